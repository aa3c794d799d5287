CREATE TABLE "answer_versions" (
	"scope" text PRIMARY KEY NOT NULL,
	"version" bigint DEFAULT 0 NOT NULL
);
--> statement-breakpoint
INSERT INTO "answer_versions" ("scope", "version") VALUES ('districts', 0), ('sites', 0), ('fields', 0), ('field_checks', 0), ('weather_stations', 0), ('weather_days', 0), ('standards', 0), ('work_orders', 0), ('settings', 0);
--> statement-breakpoint
CREATE FUNCTION answer_version_bump() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- Statement-level: one bump per write statement, however many rows it touched.
  INSERT INTO answer_versions (scope, version) VALUES (TG_TABLE_NAME, 1)
    ON CONFLICT (scope) DO UPDATE SET version = answer_versions.version + 1;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER answer_version_districts AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "districts" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_sites AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "sites" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_fields AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "fields" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_field_checks AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "field_checks" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_weather_stations AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "weather_stations" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_weather_days AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "weather_days" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_standards AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "standards" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_work_orders AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "work_orders" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_settings AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "settings" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
