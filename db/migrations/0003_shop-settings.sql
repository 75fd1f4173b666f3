CREATE TYPE "public"."verification_recency" AS ENUM('same_day', 'within_days');--> statement-breakpoint
CREATE TABLE "shop_settings" (
	"shop_id" uuid PRIMARY KEY NOT NULL,
	"time_zone" text DEFAULT 'UTC' NOT NULL,
	"wrench_floor_percent" double precision DEFAULT 20 NOT NULL,
	"verification_recency" "verification_recency" DEFAULT 'same_day' NOT NULL,
	"verification_days" integer DEFAULT 1 NOT NULL,
	"verification_near_percent" double precision DEFAULT 25 NOT NULL,
	"too_fast_seconds_per_bolt" double precision DEFAULT 1.5 NOT NULL,
	"recheck_days" integer DEFAULT 7 NOT NULL,
	"pressure_unit" "pressure_unit" DEFAULT 'psi' NOT NULL,
	"torque_unit" "torque_unit" DEFAULT 'lbf-ft' NOT NULL,
	"single_lead_self_signoff" boolean DEFAULT false NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by_id" uuid
);
--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD COLUMN "bead_seat_rating_reference" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD COLUMN "bead_seat_rating_confirmed_by_id" uuid;--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD COLUMN "bead_seat_rating_confirmed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD COLUMN "plausibility_flag" text;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_updated_by_id_users_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD CONSTRAINT "wheel_specs_bead_seat_rating_confirmed_by_id_users_id_fk" FOREIGN KEY ("bead_seat_rating_confirmed_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
-- Every shop has exactly one settings row, however the shop was created (sign-up, seed, tests).
CREATE FUNCTION "shop_settings_for_new_shop"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "shop_settings" ("shop_id") VALUES (NEW."id") ON CONFLICT DO NOTHING;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER "shops_settings_row" AFTER INSERT ON "shops" FOR EACH ROW EXECUTE FUNCTION "shop_settings_for_new_shop"();--> statement-breakpoint
INSERT INTO "shop_settings" ("shop_id") SELECT "id" FROM "shops" ON CONFLICT DO NOTHING;--> statement-breakpoint
-- Flag (never change) stored specs that break the plausibility rules added with this migration.
-- Pressures compared in psi: 1 psi = 6.894 757 kPa (NIST SP 811 App. B); 1 bar = 100 kPa.
-- 40 psi: the tire industry's bead-seating guidance for passenger and light-truck tires.
WITH "p" AS (
  SELECT "id",
    CASE "pressure_unit" WHEN 'psi' THEN 1.0 WHEN 'kPa' THEN 1 / 6.894757 ELSE 100 / 6.894757 END AS "to_psi",
    "max_bead_seat_pressure" AS "seat", "running_pressure" AS "run", "pressure_unit"::text AS "unit",
    "final_torque", "bead_seat_rating_reference" AS "ref"
  FROM "wheel_specs"
), "reasons" AS (
  SELECT "id", concat_ws(' ',
    CASE WHEN "final_torque" <= 0 OR "seat" <= 0 OR "run" <= 0 OR "final_torque" = 'NaN' OR "seat" = 'NaN' OR "run" = 'NaN'
      THEN 'A torque or pressure is zero, negative or not a number.' END,
    CASE WHEN "seat" * "to_psi" > 40 AND "ref" = ''
      THEN format('Bead-seating limit %s %s is %s psi: above the 40 psi bead-seating ceiling, with no tire maker''s rating on record.',
        trim_scale(round("seat"::numeric, 2)), "unit", trim_scale(round(("seat" * "to_psi")::numeric, 1))) END,
    CASE WHEN "run" >= "seat"
      THEN format('Running pressure %s %s is not below the bead-seating limit %s %s.',
        trim_scale(round("run"::numeric, 2)), "unit", trim_scale(round("seat"::numeric, 2)), "unit") END
  ) AS "reason"
  FROM "p"
)
UPDATE "wheel_specs" SET "plausibility_flag" = "reasons"."reason"
FROM "reasons" WHERE "reasons"."id" = "wheel_specs"."id" AND "reasons"."reason" <> '';
