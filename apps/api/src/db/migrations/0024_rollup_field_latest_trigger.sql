-- Keeps rollup_field_latest: a field's latest check found again whenever one of its checks is
-- written, moved to another date or field, or deleted.
CREATE FUNCTION rollup_field_latest_of(field integer) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM rollup_field_latest WHERE field_id = field;
  INSERT INTO rollup_field_latest (field_id, check_id, checked_on, score)
  SELECT c.field_id, c.id, c.checked_on, c.score FROM field_checks c WHERE c.field_id = field
  ORDER BY c.checked_on DESC, c.id DESC LIMIT 1;
END
$$;
--> statement-breakpoint
CREATE FUNCTION rollup_field_checks_changed() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN PERFORM rollup_field_latest_of(old.field_id); END IF;
  IF TG_OP IN ('INSERT', 'UPDATE') AND (TG_OP = 'INSERT' OR new.field_id <> old.field_id) THEN PERFORM rollup_field_latest_of(new.field_id); END IF;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER rollup_field_checks_row AFTER INSERT OR UPDATE OF field_id, checked_on, score OR DELETE ON field_checks FOR EACH ROW EXECUTE FUNCTION rollup_field_checks_changed();
--> statement-breakpoint
CREATE FUNCTION rollup_field_checks_truncated() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM rollup_field_latest;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER rollup_field_checks_trunc AFTER TRUNCATE ON field_checks FOR EACH STATEMENT EXECUTE FUNCTION rollup_field_checks_truncated();
--> statement-breakpoint
INSERT INTO rollup_field_latest (field_id, check_id, checked_on, score)
SELECT DISTINCT ON (c.field_id) c.field_id, c.id, c.checked_on, c.score FROM field_checks c ORDER BY c.field_id, c.checked_on DESC, c.id DESC;
--> statement-breakpoint
-- PGlite runs no autovacuum: the planner needs the summaries' statistics to probe them by key.
ANALYZE rollup_overview_day;
--> statement-breakpoint
ANALYZE rollup_compare_crew_ytd;
--> statement-breakpoint
ANALYZE rollup_compare_machine_ytd;
--> statement-breakpoint
ANALYZE rollup_field_latest;
