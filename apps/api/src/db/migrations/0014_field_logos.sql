CREATE TABLE "field_logos" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_logos_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"name" text NOT NULL,
	"file_name" text NOT NULL,
	"render_name" text NOT NULL,
	"mime" text NOT NULL,
	"pixel_width" integer NOT NULL,
	"pixel_height" integer NOT NULL,
	"center_x_m" real NOT NULL,
	"center_y_m" real NOT NULL,
	"width_m" real NOT NULL,
	"rotation_deg" real DEFAULT 0 NOT NULL,
	"grid_spacing_m" real DEFAULT 1 NOT NULL,
	"colours" jsonb NOT NULL,
	"background_hex" text,
	"created_by" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_logos" ADD CONSTRAINT "field_logos_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_logos" ADD CONSTRAINT "field_logos_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_logos_field_idx" ON "field_logos" USING btree ("field_id");