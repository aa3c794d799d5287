CREATE TABLE "weather_days" (
	"station_id" integer NOT NULL,
	"date" date NOT NULL,
	"kind" text NOT NULL,
	"tmax_c" real NOT NULL,
	"tmin_c" real NOT NULL,
	"rh_max_pct" real,
	"rh_min_pct" real,
	"wind_ms" real,
	"sunshine_h" real,
	"solar_mj" real,
	"rain_mm" real DEFAULT 0 NOT NULL,
	"source" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "weather_days_station_id_date_pk" PRIMARY KEY("station_id","date")
);
--> statement-breakpoint
CREATE TABLE "weather_stations" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "weather_stations_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"code" text NOT NULL,
	"name" text NOT NULL,
	"lat" double precision NOT NULL,
	"lng" double precision NOT NULL,
	"elevation_m" real NOT NULL,
	"coastal" integer DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "field_checks" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "field_checks_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"field_id" integer NOT NULL,
	"checked_on" date NOT NULL,
	"checked_by" integer,
	"turf_cover_pct" real NOT NULL,
	"weeds_pct" real NOT NULL,
	"bare_pct" real NOT NULL,
	"height_mm" real,
	"days_since_cut" integer,
	"gmax" real,
	"evenness" smallint,
	"notes" text DEFAULT '' NOT NULL,
	"score" real NOT NULL,
	"flags" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "imports" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "imports_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"kind" text NOT NULL,
	"status" text DEFAULT 'preview' NOT NULL,
	"user_id" integer NOT NULL,
	"district_id" integer,
	"file_name" text NOT NULL,
	"rows" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"changes" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"committed_at" timestamp with time zone,
	"undone_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "standards" (
	"level" smallint PRIMARY KEY NOT NULL,
	"data" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" integer
);
--> statement-breakpoint
ALTER TABLE "fields" ADD COLUMN "long_axis_deg" real;--> statement-breakpoint
ALTER TABLE "fields" ADD COLUMN "last_mowed_on" date;--> statement-breakpoint
ALTER TABLE "weather_days" ADD CONSTRAINT "weather_days_station_id_weather_stations_id_fk" FOREIGN KEY ("station_id") REFERENCES "public"."weather_stations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_checks" ADD CONSTRAINT "field_checks_field_id_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_checks" ADD CONSTRAINT "field_checks_checked_by_users_id_fk" FOREIGN KEY ("checked_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "standards" ADD CONSTRAINT "standards_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "weather_days_date_idx" ON "weather_days" USING btree ("date");--> statement-breakpoint
CREATE UNIQUE INDEX "weather_stations_code_key" ON "weather_stations" USING btree ("code");--> statement-breakpoint
CREATE INDEX "field_checks_field_idx" ON "field_checks" USING btree ("field_id","checked_on");--> statement-breakpoint
CREATE INDEX "imports_user_idx" ON "imports" USING btree ("user_id","created_at");