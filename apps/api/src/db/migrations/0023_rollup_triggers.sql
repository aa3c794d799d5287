-- Keeps rollup_overview_day and the compare's year-to-date tables exact: every change of work orders adds
-- the new rows' contribution and takes away the old rows'. Statement-level triggers with
-- transition tables, so a week plan's apply of hundreds of orders is one grouped upsert.
CREATE FUNCTION rollup_num(j jsonb) RETURNS numeric LANGUAGE sql IMMUTABLE AS $$
  SELECT CASE WHEN jsonb_typeof(j) = 'number' THEN (j #>> '{}')::numeric ELSE 0 END
$$;
--> statement-breakpoint
-- The rows to take away (sign -1) and to add (+1), with their field's area. An order whose field
-- no longer exists is left out: the field's delete trigger took it away beforehand.
CREATE FUNCTION rollup_work_rows(minus work_orders[], plus work_orders[])
RETURNS TABLE (s integer, district_id integer, site_id integer, on_field boolean, crew_id integer, equipment_id integer, task text,
  planned_date date, planned_hours numeric, actual_hours numeric, status text, details jsonb, done_at timestamptz, area numeric, due date)
LANGUAGE sql STABLE AS $$
  SELECT d.s, d.district_id, d.site_id, f.id IS NOT NULL, d.crew_id, d.equipment_id, d.task,
    d.planned_date, d.planned_hours::float8::numeric, d.actual_hours::float8::numeric, d.status, d.details, d.done_at, f.area_m2::numeric,
    CASE WHEN jsonb_typeof(d.details -> 'dueBy') = 'string' THEN (d.details ->> 'dueBy')::date ELSE d.planned_date END
  FROM (SELECT -1 AS s, o.* FROM unnest(minus) o UNION ALL SELECT 1, p.* FROM unnest(plus) p) d
  LEFT JOIN fields f ON f.id = d.field_id
  WHERE d.field_id IS NULL OR f.id IS NOT NULL
$$;
--> statement-breakpoint
CREATE FUNCTION rollup_work_apply(minus work_orders[], plus work_orders[]) RETURNS void LANGUAGE plpgsql AS $$
DECLARE
  tz text := coalesce((SELECT time_zone FROM rollup_state WHERE id = 1), 'UTC');
BEGIN
  IF coalesce(cardinality(minus), 0) + coalesce(cardinality(plus), 0) = 0 THEN RETURN; END IF;
  INSERT INTO rollup_overview_day AS t (district_id, day, orders, planned_hours, orders_done, actual_hours_done, planned_hours_done,
    mow_asked, mow_done, mow_late, mow_not_done, n_kg_done, water_vol_budget, water_qc_budget, water_vol_used, water_qc_used, paint_planned, paint_used)
  SELECT w.district_id, w.planned_date,
    sum(w.s),
    sum(w.s * w.planned_hours),
    coalesce(sum(w.s) FILTER (WHERE w.status = 'done'), 0),
    coalesce(sum(w.s * coalesce(w.actual_hours, 0)) FILTER (WHERE w.status = 'done'), 0),
    coalesce(sum(w.s * w.planned_hours) FILTER (WHERE w.status = 'done'), 0),
    coalesce(sum(w.s) FILTER (WHERE w.task = 'mow'), 0),
    coalesce(sum(w.s) FILTER (WHERE w.task = 'mow' AND w.status = 'done'), 0),
    coalesce(sum(w.s) FILTER (WHERE w.task = 'mow' AND w.status = 'done' AND w.done_at IS NOT NULL AND (w.done_at AT TIME ZONE tz)::date > w.due), 0),
    coalesce(sum(w.s) FILTER (WHERE w.task = 'mow' AND w.status <> 'done'), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'nGPerM2') * w.area / 1000) FILTER (WHERE w.on_field AND w.task = 'feed' AND w.status = 'done'), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'volumeL')) FILTER (WHERE w.on_field AND w.task = 'irrigate' AND w.status <> 'skipped' AND NOT q.qc), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'runTimeMin') * w.area) FILTER (WHERE w.on_field AND w.task = 'irrigate' AND w.status <> 'skipped' AND q.qc), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'volumeL')) FILTER (WHERE w.on_field AND w.task = 'irrigate' AND w.status = 'done' AND NOT q.qc), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'runTimeMin') * w.area) FILTER (WHERE w.on_field AND w.task = 'irrigate' AND w.status = 'done' AND q.qc), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'paintL')) FILTER (WHERE w.on_field AND w.task = 'paint_lines' AND w.status <> 'skipped'), 0),
    coalesce(sum(w.s * rollup_num(w.details -> 'paintL')) FILTER (WHERE w.on_field AND w.task = 'paint_lines' AND w.status = 'done'), 0)
  FROM rollup_work_rows(minus, plus) w,
    LATERAL (SELECT coalesce(w.details ->> 'system' = 'quick_coupler' AND jsonb_typeof(w.details -> 'runTimeMin') = 'number', false) AS qc) q
  GROUP BY w.district_id, w.planned_date
  ON CONFLICT (district_id, day) DO UPDATE SET
    orders = t.orders + excluded.orders,
    planned_hours = t.planned_hours + excluded.planned_hours,
    orders_done = t.orders_done + excluded.orders_done,
    actual_hours_done = t.actual_hours_done + excluded.actual_hours_done,
    planned_hours_done = t.planned_hours_done + excluded.planned_hours_done,
    mow_asked = t.mow_asked + excluded.mow_asked,
    mow_done = t.mow_done + excluded.mow_done,
    mow_late = t.mow_late + excluded.mow_late,
    mow_not_done = t.mow_not_done + excluded.mow_not_done,
    n_kg_done = t.n_kg_done + excluded.n_kg_done,
    water_vol_budget = t.water_vol_budget + excluded.water_vol_budget,
    water_qc_budget = t.water_qc_budget + excluded.water_qc_budget,
    water_vol_used = t.water_vol_used + excluded.water_vol_used,
    water_qc_used = t.water_qc_used + excluded.water_qc_used,
    paint_planned = t.paint_planned + excluded.paint_planned,
    paint_used = t.paint_used + excluded.paint_used;

  -- A done order counts in its month's year to date and in every later month's of that year.
  INSERT INTO rollup_compare_crew_ytd AS t (year, month, district_id, site_id, crew_key, orders, hours, kg_n, water_m3, paint_l, colourant_l)
  SELECT extract(year FROM w.planned_date)::smallint, m.m::smallint, w.district_id, w.site_id, coalesce(w.crew_id, 0),
    sum(w.s),
    sum(w.s * coalesce(w.actual_hours, w.planned_hours)),
    sum(w.s * CASE WHEN w.task = 'feed' THEN rollup_num(w.details -> 'nGPerM2') * w.area / 1000 ELSE 0 END),
    sum(w.s * CASE WHEN w.task = 'irrigate' THEN rollup_num(w.details -> 'volumeL') / 1000 ELSE 0 END),
    sum(w.s * CASE WHEN w.task = 'paint_lines' THEN rollup_num(w.details -> 'paintL') ELSE 0 END),
    sum(w.s * CASE WHEN w.task = 'colourant' THEN rollup_num(w.details -> 'colourant' -> 'rateMlPerM2') * rollup_num(w.details -> 'colourant' -> 'areaM2') / 1000 ELSE 0 END)
  FROM rollup_work_rows(minus, plus) w, generate_series(extract(month FROM w.planned_date)::int, 12) m(m)
  WHERE w.on_field AND w.status = 'done'
  GROUP BY 1, 2, 3, 4, 5
  ON CONFLICT (year, month, district_id, site_id, crew_key) DO UPDATE SET
    orders = t.orders + excluded.orders,
    hours = t.hours + excluded.hours,
    kg_n = t.kg_n + excluded.kg_n,
    water_m3 = t.water_m3 + excluded.water_m3,
    paint_l = t.paint_l + excluded.paint_l,
    colourant_l = t.colourant_l + excluded.colourant_l;

  INSERT INTO rollup_compare_machine_ytd AS t (year, month, district_id, site_id, equipment_key, task, reel, hours)
  SELECT extract(year FROM w.planned_date)::smallint, m.m::smallint, w.district_id, w.site_id, coalesce(w.equipment_id, 0), w.task,
    w.task = 'mow' AND coalesce(w.details ->> 'mowerKind', w.details ->> 'mower', '') LIKE 'reel%',
    sum(w.s * coalesce(w.actual_hours, w.planned_hours))
  FROM rollup_work_rows(minus, plus) w, generate_series(extract(month FROM w.planned_date)::int, 12) m(m)
  WHERE w.on_field AND w.status = 'done'
  GROUP BY 1, 2, 3, 4, 5, 6, 7
  ON CONFLICT (year, month, district_id, site_id, equipment_key, task, reel) DO UPDATE SET hours = t.hours + excluded.hours;
END
$$;
--> statement-breakpoint
CREATE FUNCTION rollup_work_orders_changed() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM rollup_work_apply('{}', array(SELECT n::work_orders FROM rollup_new n));
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM rollup_work_apply(array(SELECT o::work_orders FROM rollup_old o), '{}');
  ELSIF TG_OP = 'UPDATE' THEN
    -- Only orders whose counted columns changed (a note or a pin moves nothing).
    PERFORM rollup_work_apply(
      array(SELECT o::work_orders FROM rollup_old o JOIN rollup_new n ON n.id = o.id
        WHERE (o.district_id, o.site_id, o.field_id, o.crew_id, o.equipment_id, o.task, o.planned_date, o.planned_hours, o.actual_hours, o.status, o.details, o.done_at)
          IS DISTINCT FROM (n.district_id, n.site_id, n.field_id, n.crew_id, n.equipment_id, n.task, n.planned_date, n.planned_hours, n.actual_hours, n.status, n.details, n.done_at)),
      array(SELECT n::work_orders FROM rollup_new n JOIN rollup_old o ON o.id = n.id
        WHERE (o.district_id, o.site_id, o.field_id, o.crew_id, o.equipment_id, o.task, o.planned_date, o.planned_hours, o.actual_hours, o.status, o.details, o.done_at)
          IS DISTINCT FROM (n.district_id, n.site_id, n.field_id, n.crew_id, n.equipment_id, n.task, n.planned_date, n.planned_hours, n.actual_hours, n.status, n.details, n.done_at)));
  ELSE
    DELETE FROM rollup_overview_day;
    DELETE FROM rollup_compare_crew_ytd;
    DELETE FROM rollup_compare_machine_ytd;
  END IF;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER rollup_work_orders_ins AFTER INSERT ON work_orders REFERENCING NEW TABLE AS rollup_new FOR EACH STATEMENT EXECUTE FUNCTION rollup_work_orders_changed();
--> statement-breakpoint
CREATE TRIGGER rollup_work_orders_upd AFTER UPDATE ON work_orders REFERENCING OLD TABLE AS rollup_old NEW TABLE AS rollup_new FOR EACH STATEMENT EXECUTE FUNCTION rollup_work_orders_changed();
--> statement-breakpoint
CREATE TRIGGER rollup_work_orders_del AFTER DELETE ON work_orders REFERENCING OLD TABLE AS rollup_old FOR EACH STATEMENT EXECUTE FUNCTION rollup_work_orders_changed();
--> statement-breakpoint
CREATE TRIGGER rollup_work_orders_trunc AFTER TRUNCATE ON work_orders FOR EACH STATEMENT EXECUTE FUNCTION rollup_work_orders_changed();
--> statement-breakpoint
-- A field's area weighs its feeds and quick-coupler runs: take its orders away at the old area,
-- add them back at the new. A deleted field takes its orders away before they cascade.
CREATE FUNCTION rollup_field_changed() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' OR TG_WHEN = 'BEFORE' THEN
    PERFORM rollup_work_apply(array(SELECT wo FROM work_orders wo WHERE wo.field_id = old.id), '{}');
  ELSE
    PERFORM rollup_work_apply('{}', array(SELECT wo FROM work_orders wo WHERE wo.field_id = new.id));
  END IF;
  IF TG_OP = 'DELETE' THEN RETURN old; END IF;
  RETURN new;
END
$$;
--> statement-breakpoint
CREATE TRIGGER rollup_field_area_before BEFORE UPDATE OF area_m2 ON fields FOR EACH ROW WHEN (old.area_m2 IS DISTINCT FROM new.area_m2) EXECUTE FUNCTION rollup_field_changed();
--> statement-breakpoint
CREATE TRIGGER rollup_field_area_after AFTER UPDATE OF area_m2 ON fields FOR EACH ROW WHEN (old.area_m2 IS DISTINCT FROM new.area_m2) EXECUTE FUNCTION rollup_field_changed();
--> statement-breakpoint
CREATE TRIGGER rollup_field_delete BEFORE DELETE ON fields FOR EACH ROW EXECUTE FUNCTION rollup_field_changed();
--> statement-breakpoint
-- Counts everything again, the late mowings in the zone given (the department's, when it changes).
-- One task and month at a time, each read through work_orders_task_date_idx.
CREATE FUNCTION rollup_rebuild(zone text) RETURNS void LANGUAGE plpgsql AS $$
DECLARE
  t text;
  m date;
BEGIN
  INSERT INTO rollup_state (id, time_zone) VALUES (1, zone) ON CONFLICT (id) DO UPDATE SET time_zone = excluded.time_zone;
  DELETE FROM rollup_overview_day;
  DELETE FROM rollup_compare_crew_ytd;
  DELETE FROM rollup_compare_machine_ytd;
  FOR t IN SELECT DISTINCT wo.task FROM work_orders wo LOOP
    FOR m IN SELECT DISTINCT date_trunc('month', wo.planned_date)::date FROM work_orders wo WHERE wo.task = t LOOP
      PERFORM rollup_work_apply('{}', array(SELECT wo FROM work_orders wo WHERE wo.task = t AND wo.planned_date >= m AND wo.planned_date < (m + interval '1 month')::date));
    END LOOP;
  END LOOP;
END
$$;
--> statement-breakpoint
SELECT rollup_rebuild(coalesce(
  (SELECT s.value ->> 'timeZone' FROM settings s JOIN pg_timezone_names z ON z.name = s.value ->> 'timeZone' WHERE s.key = 'department.time_zone'),
  'America/Chicago'));
