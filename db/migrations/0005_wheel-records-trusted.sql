CREATE TABLE "refused_run_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"wheel_id" uuid NOT NULL,
	"client_id" text,
	"by_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"raw" jsonb NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "job_events" ADD COLUMN "self_signoff" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "job_events" ADD COLUMN "wheels" jsonb;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD COLUMN "submitted_by_id" uuid;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD COLUMN "started_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD COLUMN "snapshot" jsonb;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD COLUMN "rework" jsonb;--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD COLUMN "device_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "wheel_run_events" ADD COLUMN "superseded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "refused_run_events" ADD CONSTRAINT "refused_run_events_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refused_run_events" ADD CONSTRAINT "refused_run_events_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refused_run_events" ADD CONSTRAINT "refused_run_events_wheel_id_job_wheels_id_fk" FOREIGN KEY ("wheel_id") REFERENCES "public"."job_wheels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refused_run_events" ADD CONSTRAINT "refused_run_events_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "refused_run_events_client_key" ON "refused_run_events" USING btree ("wheel_id","client_id");--> statement-breakpoint
CREATE INDEX "refused_run_events_job_idx" ON "refused_run_events" USING btree ("shop_id","job_id","at");--> statement-breakpoint
ALTER TABLE "job_wheels" ADD CONSTRAINT "job_wheels_submitted_by_id_users_id_fk" FOREIGN KEY ("submitted_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;