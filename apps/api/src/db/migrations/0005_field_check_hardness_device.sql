ALTER TABLE "field_checks" ADD COLUMN "gmax_device" text;--> statement-breakpoint
-- Readings stored before the tester was recorded were taken with the 2.25 kg portable tester, the only one the product knew.
UPDATE "field_checks" SET "gmax_device" = 'portable_2_25kg' WHERE "gmax" IS NOT NULL;--> statement-breakpoint
ALTER TABLE "field_checks" ADD CONSTRAINT "field_checks_gmax_device_check" CHECK (("field_checks"."gmax" IS NULL) = ("field_checks"."gmax_device" IS NULL) AND ("field_checks"."gmax_device" IS NULL OR "field_checks"."gmax_device" IN ('f355_missile_a', 'portable_2_25kg')));