CREATE TABLE "anomaly_acknowledgements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"wheel_id" uuid,
	"anomaly_key" text NOT NULL,
	"code" text NOT NULL,
	"message" text NOT NULL,
	"reason" text NOT NULL,
	"by_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "anomaly_acknowledgements" ADD CONSTRAINT "anomaly_acknowledgements_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "anomaly_acknowledgements" ADD CONSTRAINT "anomaly_acknowledgements_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "anomaly_acknowledgements" ADD CONSTRAINT "anomaly_acknowledgements_wheel_id_job_wheels_id_fk" FOREIGN KEY ("wheel_id") REFERENCES "public"."job_wheels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "anomaly_acknowledgements" ADD CONSTRAINT "anomaly_acknowledgements_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "anomaly_acknowledgements_job_idx" ON "anomaly_acknowledgements" USING btree ("shop_id","job_id","at");