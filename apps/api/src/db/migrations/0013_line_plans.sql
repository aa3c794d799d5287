CREATE TABLE "field_line_plans" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_line_plans_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"layouts" jsonb NOT NULL,
	"paint" jsonb NOT NULL,
	"marker_id" integer,
	"season_start" text NOT NULL,
	"season_end" text NOT NULL,
	"shifts" jsonb NOT NULL,
	"set_by" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_line_plans" ADD CONSTRAINT "field_line_plans_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_line_plans" ADD CONSTRAINT "field_line_plans_marker_id_equipment_id_fk" FOREIGN KEY ("marker_id") REFERENCES "public"."equipment"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_line_plans" ADD CONSTRAINT "field_line_plans_set_by_users_id_fk" FOREIGN KEY ("set_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "field_line_plans_field_key" ON "field_line_plans" USING btree ("field_id");