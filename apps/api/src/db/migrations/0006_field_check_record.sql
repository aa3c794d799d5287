ALTER TABLE "field_checks" ADD COLUMN "bare_areas" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "field_checks" ADD COLUMN "hardness_readings" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "field_checks" ADD COLUMN "divots" smallint;--> statement-breakpoint
ALTER TABLE "field_checks" ADD COLUMN "torn_leaf_tips" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "field_checks" ADD COLUMN "work_order_id" integer;--> statement-breakpoint
ALTER TABLE "field_checks" ADD CONSTRAINT "field_checks_work_order_id_work_orders_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_orders"("id") ON DELETE set null ON UPDATE no action;