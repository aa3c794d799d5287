CREATE TABLE "field_check_photos" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_check_photos_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_check_id" integer NOT NULL,
	"file_name" text NOT NULL,
	"mime" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"bytes" integer NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_check_photos" ADD CONSTRAINT "field_check_photos_field_check_id_field_checks_id_fk" FOREIGN KEY ("field_check_id") REFERENCES "public"."field_checks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_check_photos" ADD CONSTRAINT "field_check_photos_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_check_photos_check_idx" ON "field_check_photos" USING btree ("field_check_id");--> statement-breakpoint
CREATE UNIQUE INDEX "field_check_photos_file_key" ON "field_check_photos" USING btree ("field_check_id","file_name");