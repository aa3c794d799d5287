CREATE TABLE "game_day_preps" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "game_day_preps_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"site_id" integer NOT NULL,
	"district_id" integer NOT NULL,
	"event_id" integer NOT NULL,
	"steps" jsonb NOT NULL,
	"colourant" jsonb,
	"pattern" text,
	"created_by" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "game_day_preps" ADD CONSTRAINT "game_day_preps_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "game_day_preps" ADD CONSTRAINT "game_day_preps_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "game_day_preps" ADD CONSTRAINT "game_day_preps_district_id_districts_id_fk" FOREIGN KEY ("district_id") REFERENCES "public"."districts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "game_day_preps" ADD CONSTRAINT "game_day_preps_event_id_field_events_id_fk" FOREIGN KEY ("event_id") REFERENCES "public"."field_events"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "game_day_preps" ADD CONSTRAINT "game_day_preps_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "game_day_preps_event_key" ON "game_day_preps" USING btree ("event_id");--> statement-breakpoint
CREATE INDEX "game_day_preps_district_idx" ON "game_day_preps" USING btree ("district_id");