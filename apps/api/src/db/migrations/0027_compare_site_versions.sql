CREATE TABLE "rollup_compare_site_versions" (
	"year" smallint NOT NULL,
	"month" smallint NOT NULL,
	"site_id" integer NOT NULL,
	"version" bigint DEFAULT 0 NOT NULL,
	CONSTRAINT "rollup_compare_site_versions_year_month_site_id_pk" PRIMARY KEY("year","month","site_id")
);
--> statement-breakpoint
-- Raises the counter of every (year, month, site) whose compare rows a statement added,
-- changed or removed: one grouped upsert per statement, whatever the number of rows.
CREATE FUNCTION rollup_compare_touch() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO rollup_compare_site_versions AS v (year, month, site_id, version)
  SELECT DISTINCT r.year, r.month, r.site_id, 1 FROM rollup_touched r
  ON CONFLICT (year, month, site_id) DO UPDATE SET version = v.version + 1;
  RETURN NULL;
END
$$;
--> statement-breakpoint
-- A transition table goes with one event per trigger: three triggers a table. An upsert fires
-- both its insert and its update trigger, each with its own rows.
CREATE TRIGGER rollup_compare_crew_ytd_added AFTER INSERT ON rollup_compare_crew_ytd REFERENCING NEW TABLE AS rollup_touched FOR EACH STATEMENT EXECUTE FUNCTION rollup_compare_touch();
--> statement-breakpoint
CREATE TRIGGER rollup_compare_crew_ytd_changed AFTER UPDATE ON rollup_compare_crew_ytd REFERENCING NEW TABLE AS rollup_touched FOR EACH STATEMENT EXECUTE FUNCTION rollup_compare_touch();
--> statement-breakpoint
CREATE TRIGGER rollup_compare_crew_ytd_removed AFTER DELETE ON rollup_compare_crew_ytd REFERENCING OLD TABLE AS rollup_touched FOR EACH STATEMENT EXECUTE FUNCTION rollup_compare_touch();
--> statement-breakpoint
CREATE TRIGGER rollup_compare_machine_ytd_added AFTER INSERT ON rollup_compare_machine_ytd REFERENCING NEW TABLE AS rollup_touched FOR EACH STATEMENT EXECUTE FUNCTION rollup_compare_touch();
--> statement-breakpoint
CREATE TRIGGER rollup_compare_machine_ytd_changed AFTER UPDATE ON rollup_compare_machine_ytd REFERENCING NEW TABLE AS rollup_touched FOR EACH STATEMENT EXECUTE FUNCTION rollup_compare_touch();
--> statement-breakpoint
CREATE TRIGGER rollup_compare_machine_ytd_removed AFTER DELETE ON rollup_compare_machine_ytd REFERENCING OLD TABLE AS rollup_touched FOR EACH STATEMENT EXECUTE FUNCTION rollup_compare_touch();
