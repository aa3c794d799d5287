CREATE TABLE "field_events" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_events_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"site_id" integer NOT NULL,
	"district_id" integer NOT NULL,
	"kind" text NOT NULL,
	"title" text NOT NULL,
	"starts_on" date NOT NULL,
	"start_time" text,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "work_updates" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "work_updates_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"work_order_id" integer NOT NULL,
	"status" text NOT NULL,
	"actual_hours" real,
	"note" text DEFAULT '' NOT NULL,
	"client_ref" text,
	"reported_at" timestamp with time zone NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "crews" ADD COLUMN "work_days" jsonb DEFAULT '["mon","tue","wed","thu","fri"]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "field_events" ADD CONSTRAINT "field_events_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_events" ADD CONSTRAINT "field_events_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_events" ADD CONSTRAINT "field_events_district_id_districts_id_fk" FOREIGN KEY ("district_id") REFERENCES "public"."districts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_events" ADD CONSTRAINT "field_events_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_updates" ADD CONSTRAINT "work_updates_work_order_id_work_orders_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_updates" ADD CONSTRAINT "work_updates_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_events_field_idx" ON "field_events" USING btree ("field_id","starts_on");--> statement-breakpoint
CREATE INDEX "field_events_district_idx" ON "field_events" USING btree ("district_id","starts_on");--> statement-breakpoint
CREATE INDEX "work_updates_order_idx" ON "work_updates" USING btree ("work_order_id");--> statement-breakpoint
CREATE UNIQUE INDEX "work_updates_client_ref_key" ON "work_updates" USING btree ("client_ref");