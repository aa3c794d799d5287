-- A write statement that changed no row changes no answer. Deleting a work order clears the
-- link of the field checks and applications that named it (ON DELETE SET NULL), and the
-- database runs that clearing as an update of each table even when no row names the order:
-- a bare statement trigger then raised their counters, and every cached answer reading them
-- was built again in full after a week was generated anew. The counters now rise only when
-- the statement's transition table holds a row; TRUNCATE, which has none, still raises them.
CREATE FUNCTION answer_version_bump_changed() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM answer_changed_rows) THEN
    INSERT INTO answer_versions (scope, version) VALUES (TG_TABLE_NAME, 1)
      ON CONFLICT (scope) DO UPDATE SET version = answer_versions.version + 1;
  END IF;
  RETURN NULL;
END
$$;
--> statement-breakpoint
-- Each counted table: the bare trigger now answers TRUNCATE alone, and one trigger each for
-- insert, update and delete carries the statement's rows (a transition table goes with one event).
DO $$
DECLARE
  t text;
BEGIN
  FOREACH t IN ARRAY ARRAY['districts', 'sites', 'fields', 'field_checks', 'weather_stations', 'weather_days', 'standards', 'work_orders', 'settings', 'applications', 'equipment'] LOOP
    EXECUTE format('DROP TRIGGER answer_version_%1$s ON %1$I', t);
    EXECUTE format('CREATE TRIGGER answer_version_%1$s AFTER TRUNCATE ON %1$I FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump()', t);
    EXECUTE format('CREATE TRIGGER answer_version_%1$s_added AFTER INSERT ON %1$I REFERENCING NEW TABLE AS answer_changed_rows FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump_changed()', t);
    EXECUTE format('CREATE TRIGGER answer_version_%1$s_changed AFTER UPDATE ON %1$I REFERENCING NEW TABLE AS answer_changed_rows FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump_changed()', t);
    EXECUTE format('CREATE TRIGGER answer_version_%1$s_removed AFTER DELETE ON %1$I REFERENCING OLD TABLE AS answer_changed_rows FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump_changed()', t);
  END LOOP;
END
$$;
