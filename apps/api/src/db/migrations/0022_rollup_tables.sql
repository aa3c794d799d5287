CREATE TABLE "rollup_compare_crew_ytd" (
	"year" smallint NOT NULL,
	"month" smallint NOT NULL,
	"district_id" integer NOT NULL,
	"site_id" integer NOT NULL,
	"crew_key" integer NOT NULL,
	"orders" integer DEFAULT 0 NOT NULL,
	"hours" numeric DEFAULT '0' NOT NULL,
	"kg_n" numeric DEFAULT '0' NOT NULL,
	"water_m3" numeric DEFAULT '0' NOT NULL,
	"paint_l" numeric DEFAULT '0' NOT NULL,
	"colourant_l" numeric DEFAULT '0' NOT NULL,
	CONSTRAINT "rollup_compare_crew_ytd_year_month_district_id_site_id_crew_key_pk" PRIMARY KEY("year","month","district_id","site_id","crew_key")
);
--> statement-breakpoint
CREATE TABLE "rollup_compare_machine_ytd" (
	"year" smallint NOT NULL,
	"month" smallint NOT NULL,
	"district_id" integer NOT NULL,
	"site_id" integer NOT NULL,
	"equipment_key" integer NOT NULL,
	"task" text NOT NULL,
	"reel" boolean NOT NULL,
	"hours" numeric DEFAULT '0' NOT NULL,
	CONSTRAINT "rollup_compare_machine_ytd_year_month_district_id_site_id_equipment_key_task_reel_pk" PRIMARY KEY("year","month","district_id","site_id","equipment_key","task","reel")
);
--> statement-breakpoint
CREATE TABLE "rollup_field_latest" (
	"field_id" integer PRIMARY KEY NOT NULL,
	"check_id" integer NOT NULL,
	"checked_on" date NOT NULL,
	"score" real NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rollup_overview_day" (
	"district_id" integer NOT NULL,
	"day" date NOT NULL,
	"orders" integer DEFAULT 0 NOT NULL,
	"planned_hours" numeric DEFAULT '0' NOT NULL,
	"orders_done" integer DEFAULT 0 NOT NULL,
	"actual_hours_done" numeric DEFAULT '0' NOT NULL,
	"planned_hours_done" numeric DEFAULT '0' NOT NULL,
	"mow_asked" integer DEFAULT 0 NOT NULL,
	"mow_done" integer DEFAULT 0 NOT NULL,
	"mow_late" integer DEFAULT 0 NOT NULL,
	"mow_not_done" integer DEFAULT 0 NOT NULL,
	"n_kg_done" numeric DEFAULT '0' NOT NULL,
	"water_vol_budget" numeric DEFAULT '0' NOT NULL,
	"water_qc_budget" numeric DEFAULT '0' NOT NULL,
	"water_vol_used" numeric DEFAULT '0' NOT NULL,
	"water_qc_used" numeric DEFAULT '0' NOT NULL,
	"paint_planned" numeric DEFAULT '0' NOT NULL,
	"paint_used" numeric DEFAULT '0' NOT NULL,
	CONSTRAINT "rollup_overview_day_district_id_day_pk" PRIMARY KEY("district_id","day")
);
--> statement-breakpoint
CREATE TABLE "rollup_state" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"time_zone" text NOT NULL,
	CONSTRAINT "rollup_state_one_row" CHECK ("rollup_state"."id" = 1)
);
