CREATE TYPE "public"."photo_kind" AS ENUM('bead_outer', 'bead_inner', 'other');--> statement-breakpoint
CREATE TABLE "wheel_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"wheel_id" uuid NOT NULL,
	"kind" "photo_kind" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"file_key" text NOT NULL,
	"url" text NOT NULL,
	"bytes" integer NOT NULL,
	"mime" text NOT NULL,
	"uploaded_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wheel_run_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"wheel_id" uuid NOT NULL,
	"client_id" uuid NOT NULL,
	"type" text NOT NULL,
	"payload" jsonb NOT NULL,
	"by_id" uuid NOT NULL,
	"client_at" timestamp with time zone NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "job_wheels" ADD COLUMN "submitted_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD COLUMN "flagged_reason" text;--> statement-breakpoint
ALTER TABLE "wheel_photos" ADD CONSTRAINT "wheel_photos_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_photos" ADD CONSTRAINT "wheel_photos_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_photos" ADD CONSTRAINT "wheel_photos_wheel_id_job_wheels_id_fk" FOREIGN KEY ("wheel_id") REFERENCES "public"."job_wheels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_photos" ADD CONSTRAINT "wheel_photos_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD CONSTRAINT "wheel_run_events_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD CONSTRAINT "wheel_run_events_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD CONSTRAINT "wheel_run_events_wheel_id_job_wheels_id_fk" FOREIGN KEY ("wheel_id") REFERENCES "public"."job_wheels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD CONSTRAINT "wheel_run_events_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "wheel_photos_file_key" ON "wheel_photos" USING btree ("file_key");--> statement-breakpoint
CREATE INDEX "wheel_photos_wheel_idx" ON "wheel_photos" USING btree ("wheel_id");--> statement-breakpoint
CREATE UNIQUE INDEX "wheel_run_events_client_key" ON "wheel_run_events" USING btree ("client_id");--> statement-breakpoint
CREATE INDEX "wheel_run_events_wheel_idx" ON "wheel_run_events" USING btree ("wheel_id","client_at");