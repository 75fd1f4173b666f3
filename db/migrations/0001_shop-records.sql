CREATE TYPE "public"."job_state" AS ENUM('open', 'in_progress', 'awaiting_signoff', 'signed_off', 'sent_back');--> statement-breakpoint
CREATE TYPE "public"."pattern_kind" AS ENUM('cross', 'skip', 'sequential');--> statement-breakpoint
CREATE TYPE "public"."pressure_unit" AS ENUM('psi', 'kPa', 'bar');--> statement-breakpoint
CREATE TYPE "public"."torque_unit" AS ENUM('lbf-ft', 'lbf-in', 'Nm');--> statement-breakpoint
CREATE TYPE "public"."wheel_position" AS ENUM('LF', 'RF', 'LR', 'RR', 'spare');--> statement-breakpoint
CREATE TYPE "public"."wrench_kind" AS ENUM('click', 'beam', 'dial', 'digital');--> statement-breakpoint
CREATE TYPE "public"."wrench_status" AS ENUM('in_service', 'out_of_service');--> statement-breakpoint
CREATE TABLE "customers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"name" text NOT NULL,
	"phone" text DEFAULT '' NOT NULL,
	"email" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "job_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"action" text NOT NULL,
	"from_state" "job_state",
	"to_state" "job_state" NOT NULL,
	"by_id" uuid NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "job_wheels" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"position" "wheel_position" NOT NULL,
	"spec_id" uuid NOT NULL,
	"tire_size" text NOT NULL,
	"directional" boolean DEFAULT false NOT NULL,
	"target_pressure" double precision NOT NULL,
	"pressure_unit" "pressure_unit" NOT NULL
);
--> statement-breakpoint
CREATE TABLE "jobs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"customer_id" uuid NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"state" "job_state" DEFAULT 'open' NOT NULL,
	"assignee_id" uuid,
	"due_at" timestamp with time zone,
	"dismount" boolean DEFAULT true NOT NULL,
	"reinstall" boolean DEFAULT true NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "vehicles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"year" integer,
	"make" text DEFAULT '' NOT NULL,
	"model" text DEFAULT '' NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"vin" text,
	"vin_check_overridden" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wheel_specs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"name" text NOT NULL,
	"bolt_count" integer NOT NULL,
	"bolt_thread" text NOT NULL,
	"final_torque" double precision NOT NULL,
	"torque_unit" "torque_unit" NOT NULL,
	"pass_fractions" jsonb NOT NULL,
	"pattern_kind" "pattern_kind" NOT NULL,
	"skip_step" integer,
	"check_pass" boolean DEFAULT true NOT NULL,
	"lug_torque" double precision,
	"lug_torque_unit" "torque_unit",
	"lug_count" integer,
	"max_bead_seat_pressure" double precision NOT NULL,
	"running_pressure" double precision NOT NULL,
	"pressure_unit" "pressure_unit" NOT NULL,
	"maker_reference" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wrench_status_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"wrench_id" uuid NOT NULL,
	"status" "wrench_status" NOT NULL,
	"reason" text NOT NULL,
	"by_id" uuid,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wrench_verifications" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"wrench_id" uuid NOT NULL,
	"reference_value" double precision NOT NULL,
	"reading_value" double precision NOT NULL,
	"unit" "torque_unit" NOT NULL,
	"deviation_pct" double precision NOT NULL,
	"tolerance_pct" double precision NOT NULL,
	"within_tolerance" boolean NOT NULL,
	"recorded_by_id" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wrenches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"label" text NOT NULL,
	"kind" "wrench_kind" NOT NULL,
	"min" double precision NOT NULL,
	"max" double precision NOT NULL,
	"unit" "torque_unit" NOT NULL,
	"graduation" double precision NOT NULL,
	"serial" text DEFAULT '' NOT NULL,
	"calibration_due_on" date NOT NULL,
	"cycles_since_calibration" integer,
	"status" "wrench_status" DEFAULT 'in_service' NOT NULL,
	"status_reason" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "customers" ADD CONSTRAINT "customers_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_events" ADD CONSTRAINT "job_events_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_events" ADD CONSTRAINT "job_events_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_events" ADD CONSTRAINT "job_events_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD CONSTRAINT "job_wheels_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD CONSTRAINT "job_wheels_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_wheels" ADD CONSTRAINT "job_wheels_spec_id_wheel_specs_id_fk" FOREIGN KEY ("spec_id") REFERENCES "public"."wheel_specs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_customer_id_customers_id_fk" FOREIGN KEY ("customer_id") REFERENCES "public"."customers"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_assignee_id_users_id_fk" FOREIGN KEY ("assignee_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_customer_id_customers_id_fk" FOREIGN KEY ("customer_id") REFERENCES "public"."customers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD CONSTRAINT "wheel_specs_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrench_status_events" ADD CONSTRAINT "wrench_status_events_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrench_status_events" ADD CONSTRAINT "wrench_status_events_wrench_id_wrenches_id_fk" FOREIGN KEY ("wrench_id") REFERENCES "public"."wrenches"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrench_status_events" ADD CONSTRAINT "wrench_status_events_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrench_verifications" ADD CONSTRAINT "wrench_verifications_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrench_verifications" ADD CONSTRAINT "wrench_verifications_wrench_id_wrenches_id_fk" FOREIGN KEY ("wrench_id") REFERENCES "public"."wrenches"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrench_verifications" ADD CONSTRAINT "wrench_verifications_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wrenches" ADD CONSTRAINT "wrenches_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "customers_shop_idx" ON "customers" USING btree ("shop_id","name");--> statement-breakpoint
CREATE INDEX "job_events_job_idx" ON "job_events" USING btree ("job_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "job_wheels_position_key" ON "job_wheels" USING btree ("job_id","position");--> statement-breakpoint
CREATE INDEX "job_wheels_shop_idx" ON "job_wheels" USING btree ("shop_id");--> statement-breakpoint
CREATE UNIQUE INDEX "jobs_shop_number_key" ON "jobs" USING btree ("shop_id","number");--> statement-breakpoint
CREATE INDEX "jobs_board_idx" ON "jobs" USING btree ("shop_id","state","due_at");--> statement-breakpoint
CREATE INDEX "jobs_assignee_idx" ON "jobs" USING btree ("shop_id","assignee_id","due_at");--> statement-breakpoint
CREATE INDEX "vehicles_customer_idx" ON "vehicles" USING btree ("shop_id","customer_id");--> statement-breakpoint
CREATE INDEX "wheel_specs_shop_idx" ON "wheel_specs" USING btree ("shop_id","name");--> statement-breakpoint
CREATE INDEX "wrench_status_events_wrench_idx" ON "wrench_status_events" USING btree ("wrench_id","at");--> statement-breakpoint
CREATE INDEX "wrench_verifications_wrench_idx" ON "wrench_verifications" USING btree ("wrench_id","recorded_at");--> statement-breakpoint
CREATE INDEX "wrenches_shop_idx" ON "wrenches" USING btree ("shop_id","label");