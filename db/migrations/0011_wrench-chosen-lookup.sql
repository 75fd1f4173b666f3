-- The quick save's wrench check reads a wheel's current wrench choices for one pass, not its whole history.
-- The migrator runs in a transaction, so this cannot be CONCURRENTLY and holds off inserts into
-- wheel_run_events while it reads the table: on a large table create the same index CONCURRENTLY by hand
-- first (IF NOT EXISTS then skips it here).
CREATE INDEX IF NOT EXISTS "wheel_run_events_wrench_chosen_idx" ON "wheel_run_events" USING btree ("wheel_id",(("payload"->>'pass')::int)) WHERE "wheel_run_events"."type" = 'wrench_chosen' and "wheel_run_events"."superseded_at" is null;
