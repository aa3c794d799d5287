CREATE TABLE "field_closures" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_closures_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"status" text NOT NULL,
	"reason" text,
	"note" text DEFAULT '' NOT NULL,
	"from_at" timestamp with time zone NOT NULL,
	"to_at" timestamp with time zone,
	"expected_reopen_on" date,
	"decided_by" integer,
	"work_choice" text,
	"work_count" smallint DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_closures" ADD CONSTRAINT "field_closures_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_closures" ADD CONSTRAINT "field_closures_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_closures_field_idx" ON "field_closures" USING btree ("field_id","from_at");--> statement-breakpoint
CREATE UNIQUE INDEX "field_closures_current_key" ON "field_closures" USING btree ("field_id") WHERE "field_closures"."to_at" is null;