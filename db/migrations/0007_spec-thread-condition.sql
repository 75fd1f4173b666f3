CREATE TYPE "public"."thread_condition" AS ENUM('dry', 'oiled', 'anti_seize', 'thread_locker');--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD COLUMN "thread_condition" "thread_condition";--> statement-breakpoint
ALTER TABLE "wheel_specs" ADD COLUMN "bolt_reuse" text DEFAULT '' NOT NULL;