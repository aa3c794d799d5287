ALTER TABLE "work_orders" ALTER COLUMN "field_id" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "work_orders" ALTER COLUMN "site_id" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_place_check" CHECK (("work_orders"."field_id" is null) = ("work_orders"."site_id" is null));