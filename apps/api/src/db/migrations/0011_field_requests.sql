CREATE TABLE "field_request_messages" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_request_messages_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"request_id" integer NOT NULL,
	"author_id" integer,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "field_request_photos" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_request_photos_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"request_id" integer NOT NULL,
	"file_name" text NOT NULL,
	"mime" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"bytes" integer NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "field_requests" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_requests_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"site_id" integer NOT NULL,
	"district_id" integer NOT NULL,
	"kind" text NOT NULL,
	"game_on" date,
	"start_time" text,
	"layout" text,
	"description" text NOT NULL,
	"state" text DEFAULT 'requested' NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"event_id" integer,
	"work_order_id" integer,
	"created_by" integer,
	"decided_by" integer,
	"scheduled_at" timestamp with time zone,
	"closed_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_request_messages" ADD CONSTRAINT "field_request_messages_request_id_field_requests_id_fk" FOREIGN KEY ("request_id") REFERENCES "public"."field_requests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_request_messages" ADD CONSTRAINT "field_request_messages_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_request_photos" ADD CONSTRAINT "field_request_photos_request_id_field_requests_id_fk" FOREIGN KEY ("request_id") REFERENCES "public"."field_requests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_request_photos" ADD CONSTRAINT "field_request_photos_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_district_id_districts_id_fk" FOREIGN KEY ("district_id") REFERENCES "public"."districts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_event_id_field_events_id_fk" FOREIGN KEY ("event_id") REFERENCES "public"."field_events"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_work_order_id_work_orders_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_orders"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_requests" ADD CONSTRAINT "field_requests_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_request_messages_request_idx" ON "field_request_messages" USING btree ("request_id");--> statement-breakpoint
CREATE INDEX "field_request_photos_request_idx" ON "field_request_photos" USING btree ("request_id");--> statement-breakpoint
CREATE UNIQUE INDEX "field_request_photos_file_key" ON "field_request_photos" USING btree ("request_id","file_name");--> statement-breakpoint
CREATE INDEX "field_requests_district_idx" ON "field_requests" USING btree ("district_id","state");--> statement-breakpoint
CREATE INDEX "field_requests_site_idx" ON "field_requests" USING btree ("site_id","state");--> statement-breakpoint
CREATE INDEX "field_requests_event_idx" ON "field_requests" USING btree ("event_id");--> statement-breakpoint
CREATE INDEX "field_requests_order_idx" ON "field_requests" USING btree ("work_order_id");