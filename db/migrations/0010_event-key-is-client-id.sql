-- The device's event id becomes the key of both event tables; the unused random surrogate `id` goes.
-- Dropping `id` drops the old primary key with it; the existing unique index on client_id then
-- becomes the primary key as it is (USING INDEX: renamed, not rebuilt), so the events stay unique
-- by the same column throughout and a large table is not re-indexed.
ALTER TABLE "wheel_run_events" DROP COLUMN "id";--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD CONSTRAINT "wheel_run_events_pkey" PRIMARY KEY USING INDEX "wheel_run_events_client_key";--> statement-breakpoint
ALTER TABLE "practice_events" DROP COLUMN "id";--> statement-breakpoint
ALTER TABLE "practice_events" ADD CONSTRAINT "practice_events_pkey" PRIMARY KEY USING INDEX "practice_events_client_key";
