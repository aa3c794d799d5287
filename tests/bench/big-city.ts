/**
 * The big city for benchmarks of the department-wide pages (overview, compare, budget,
 * what-if): the demo city plus 1,000 invented sites with 3,000 fields (three per site, each a
 * copy of a demo field's facts moved to its site), four more crews per district, and three
 * seasons of work history, about 1.5 million work orders with their field checks, some
 * closures and open requests. All of it is invented.
 *
 * The work is laid out by rules rather than by the engine (the engine would take hours for
 * this much): mowing on fixed weekdays by level, lines weekly on sports fields, watering
 * weekly where there is a system, a check weekly on levels 1–2 and every other week below, feeds in spring and autumn,
 * cultural work in fixed weeks. Hours scale with area; a few jobs are skipped; mowings run
 * late now and then (height before the cut above 1.5 × HOC). Quantities in `details` use the
 * keys the week plan writes (hocMm, heightBeforeMm, paintL, mixedL, lineLengthM, grossMm,
 * volumeL, nGPerM2, productKg).
 *
 * Built once into a PGlite data folder and reused (data/bench/big-city; BIG_CITY_DIR moves it,
 * BIG_CITY_FRESH=1 rebuilds it). Building takes a few minutes on this machine.
 * Run alone to build it and print its row counts: node --import tsx tests/bench/big-city.ts
 */
import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { eq, sql } from 'drizzle-orm';
import { DEFAULT_STANDARDS, DEFAULT_TIME_ZONE, hocFor, soccerTemplate, templatePaintedAreaM2, totalLineLengthM, type Level, type Polygon } from '@swardwise/domain';
import { openDatabase, type Database, type Db } from '../../apps/api/src/db/client.ts';
import { vacuumChurningTables } from '../../apps/api/src/db/maintenance.ts';
import { crews, districts, fields, settings, sites } from '../../apps/api/src/db/schema/index.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { seeded } from './support.ts';

export const BIG_CITY = {
  sites: 1000,
  fieldsPerSite: 3,
  extraCrewsPerDistrict: 4,
  seasons: [2024, 2025, 2026] as const,
  /** The department's date the history runs up to (orders on and after it are planned). */
  today: '2026-12-02',
} as const;

const MARKER = 'bench_big_city';
const REPO = path.resolve(import.meta.dirname, '../..');

export interface BigCitySummary {
  sites: number;
  fields: number;
  crews: number;
  workOrders: number;
  fieldChecks: number;
  closures: number;
  requests: number;
  buildSeconds: number | null;
}

/** Mowings a week by level on fixed weekdays (ISO 1 = Monday); level 4 every other week. */
const MOW_DAYS: Record<Level, number[]> = { 1: [1, 2, 4, 5], 2: [1, 3, 5], 3: [2, 5], 4: [3] };

/** Opens (building on first use) the big city's data folder. */
export async function openBigCity(): Promise<{ database: Database; db: Db; summary: BigCitySummary }> {
  const dir = path.resolve(REPO, process.env.BIG_CITY_DIR ?? 'data/bench/big-city');
  if (process.env.BIG_CITY_FRESH === '1') fs.rmSync(dir, { recursive: true, force: true });
  let database = await openDatabase({ pgliteDir: dir });
  const [marker] = await database.db.select().from(settings).where(eq(settings.key, MARKER));
  if (marker) {
    // What a server does a minute after it starts (apps/api/src/db/maintenance.ts): the
    // summary tables the triggers rewrite are vacuumed, as PGlite runs no autovacuum.
    await vacuumChurningTables(database);
    return { database, db: database.db, summary: marker.value as BigCitySummary };
  }

  // A half-built folder from an interrupted run is thrown away.
  const [anything] = await database.db.select({ id: districts.id }).from(districts).limit(1);
  if (anything) {
    await database.close();
    fs.rmSync(dir, { recursive: true, force: true });
    database = await openDatabase({ pgliteDir: dir });
  }
  const t0 = performance.now();
  const summary = await build(database.db);
  summary.buildSeconds = Math.round((performance.now() - t0) / 100) / 10;
  await database.db.insert(settings).values({ key: MARKER, value: summary });
  return { database, db: database.db, summary };
}

async function build(db: Db): Promise<BigCitySummary> {
  const log = (m: string) => process.stderr.write(`big city: ${m}\n`);
  await seedDemoCity(db, BIG_CITY.today, DEFAULT_TIME_ZONE);
  log('demo city seeded');
  const { rand, pick } = seeded(20261202);

  const demoSites = await db.select().from(sites).orderBy(sites.id);
  const demoFields = await db.select().from(fields).orderBy(fields.id);
  const districtRows = await db.select({ id: districts.id }).from(districts).orderBy(districts.id);

  // More crews: a thousand sites need more than the demo's two a district.
  const crewRows = districtRows.flatMap((d, di) =>
    Array.from({ length: BIG_CITY.extraCrewsPerDistrict }, (_, i) => ({ districtId: d.id, name: `Bench crew ${di + 1}-${i + 1}`, hoursPerDay: 8, members: [] as string[] })),
  );
  await db.insert(crews).values(crewRows);

  // Sites spread around the demo's, in the demo's districts by turn.
  const siteRows = Array.from({ length: BIG_CITY.sites }, (_, i) => {
    const like = demoSites[i % demoSites.length]!;
    return {
      districtId: districtRows[i % districtRows.length]!.id,
      name: `Bench site ${i + 1}`,
      kind: like.kind,
      owner: like.owner,
      lat: like.lat + (rand() - 0.5) * 0.2,
      lng: like.lng + (rand() - 0.5) * 0.2,
      notes: 'Invented for benchmarks',
    };
  });
  const newSites: Array<{ id: number; lat: number; lng: number }> = [];
  for (let i = 0; i < siteRows.length; i += 250) {
    newSites.push(...(await db.insert(sites).values(siteRows.slice(i, i + 250)).returning({ id: sites.id, lat: sites.lat, lng: sites.lng })));
  }

  // Fields: a demo field's facts and outline, moved to the new site.
  const fieldRows = newSites.flatMap((s, si) =>
    Array.from({ length: BIG_CITY.fieldsPerSite }, (_, k) => {
      const like = demoFields[(si * BIG_CITY.fieldsPerSite + k) % demoFields.length]!;
      const ring = like.geometry.coordinates[0]!;
      const [lng0, lat0] = ring[0]!;
      const dLat = s.lat - lat0! + k * 0.0012;
      const dLng = s.lng - lng0!;
      const geometry: Polygon = { type: 'Polygon', coordinates: [ring.map(([x, y]) => [x! + dLng, y! + dLat])] };
      return {
        siteId: s.id,
        name: `Bench field ${si + 1}.${k + 1}`,
        sport: like.sport,
        grass: like.grass,
        rootzone: like.rootzone,
        irrigation: like.irrigation,
        maintenanceLevel: pick([like.maintenanceLevel, like.maintenanceLevel, 1, 2, 3, 4] as Level[]),
        clippings: like.clippings,
        weeklyUseHours: like.weeklyUseHours,
        geometry,
        areaM2: like.areaM2,
        longAxisDeg: like.longAxisDeg,
      };
    }),
  );
  for (let i = 0; i < fieldRows.length; i += 250) await db.insert(fields).values(fieldRows.slice(i, i + 250));
  log(`${newSites.length} sites, ${fieldRows.length} fields`);

  // Per-field facts the rules below need, worked out once here (HOC by the Standards, line paint by sport).
  const allFields = await db.select().from(fields).where(sql`${fields.name} like 'Bench field %'`);
  const fullPitch = soccerTemplate();
  const paintByUse = (sport: string) => {
    // Concentrate for one coat: painted area × 0.1 L/m² of mix at 1:1 (bench rule of thumb, invented).
    const share = sport === 'lawn' ? 0 : sport === 'baseball' || sport === 'softball' ? 0.35 : sport === 'multi_use' ? 0.6 : 1;
    return { lineLengthM: Math.round(totalLineLengthM(fullPitch) * share), mixedL: Math.round(templatePaintedAreaM2(fullPitch) * share * 0.1 * 10) / 10 };
  };
  const facts = allFields.map((f) => ({
    fieldId: f.id,
    hocMm: Math.round(hocFor({ ...f, maintenanceLevel: f.maintenanceLevel }, DEFAULT_STANDARDS) * 10) / 10,
    mowDays: `{${MOW_DAYS[f.maintenanceLevel].join(',')}}`,
    ...paintByUse(f.sport),
  }));
  await db.execute(sql`create temporary table bench_facts (field_id int primary key, hoc_mm real, mow_days int[], line_length_m real, mixed_l real)`);
  await db.execute(sql`
    insert into bench_facts select "fieldId", "hocMm", "mowDays"::int[], "lineLengthM", "mixedL"
    from json_to_recordset(${JSON.stringify(facts)}::json) as x("fieldId" int, "hocMm" real, "mowDays" text, "lineLengthM" real, "mixedL" real)`);

  // Each field's crew: one of its district's crews, by turn.
  await db.execute(sql`
    create temporary table bench_field_crew as
    select f.id as field_id, f.site_id, s.district_id, f.maintenance_level as level, f.area_m2, f.sport, f.irrigation,
           (array_agg(c.id order by c.id))[1 + (f.id % count(c.id))::int] as crew_id
    from fields f join sites s on s.id = f.site_id join crews c on c.district_id = s.district_id
    where f.name like 'Bench field %'
    group by f.id, s.district_id`);

  for (const season of BIG_CITY.seasons) {
    const t = performance.now();
    await insertSeason(db, season);
    log(`season ${season}: ${((performance.now() - t) / 1000).toFixed(1)} s`);
  }

  // A check row for each check done: scores fall with level and vary by field and day.
  await db.execute(sql`
    insert into field_checks (field_id, checked_on, turf_cover_pct, weeds_pct, bare_pct, height_mm, days_since_cut, evenness, notes, score, flags)
    select w.field_id, w.planned_date,
           92 - b.level * 4 - (h % 12), 2 + (h % 9), 1 + ((h / 7) % 10), round((b2.hoc_mm * (1.1 + (h % 50) / 100.0))::numeric, 1), 1 + (h % 5), 3 + (h % 3), '',
           greatest(35, 95 - b.level * 6 - (h % 25)), '[]'::jsonb
    from work_orders w
    join bench_field_crew b on b.field_id = w.field_id
    join bench_facts b2 on b2.field_id = w.field_id
    cross join lateral (select abs(hashtext(w.id::text)) as h) r
    where w.task = 'field_check' and w.status = 'done'`);
  log('field checks');

  // Some fields closed or restricted now, with their history row; open requests on a few hundred fields.
  await db.execute(sql`
    insert into field_closures (field_id, status, reason, note, from_at, expected_reopen_on, work_choice)
    select field_id, case when field_id % 3 = 0 then 'restricted' else 'closed' end,
           (array['wet','hardness','renovation','event'])[1 + field_id % 4], 'Invented for benchmarks',
           (${BIG_CITY.today}::date - 2 + time '07:00') at time zone ${DEFAULT_TIME_ZONE}, ${BIG_CITY.today}::date + 5, 'keep'
    from bench_field_crew where field_id % 50 = 7`);
  await db.execute(sql`update fields f set status = c.status from field_closures c where c.field_id = f.id and c.to_at is null`);
  await db.execute(sql`
    insert into field_requests (field_id, site_id, district_id, kind, description, state)
    select field_id, site_id, district_id, (array['wet_area','damaged_turf','safety'])[1 + field_id % 3], 'Invented for benchmarks', 'requested'
    from bench_field_crew where field_id % 10 = 3`);
  await db.execute(sql`analyze`);
  log('closures, requests, analyze');

  const count = async (table: string) => Number(((await db.execute(sql.raw(`select count(*)::int as n from ${table}`))).rows[0] as { n: number }).n);
  return {
    sites: await count('sites'),
    fields: await count('fields'),
    crews: await count('crews'),
    workOrders: await count('work_orders'),
    fieldChecks: await count('field_checks'),
    closures: await count('field_closures'),
    requests: await count('field_requests'),
    buildSeconds: null,
  };
}

/** One season's work on every bench field, March to November, weekdays only, in one statement a month. */
async function insertSeason(db: Db, year: number): Promise<void> {
  for (let month = 3; month <= 11; month++) {
    const from = `${year}-${String(month).padStart(2, '0')}-01`;
    await db.execute(sql`
      insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, crew_id, planned_hours, actual_hours, status, origin, pinned, reason, details, notes, done_at)
      select b.field_id, b.site_id, b.district_id, t.task, (g.d - (g.dow - 1))::date, g.d, b.crew_id,
             t.hours, case when st.status = 'done' then round((t.hours * (0.85 + (r.h % 40) / 100.0))::numeric, 2) end,
             st.status, 'generated', true, '', t.details, '',
             case when st.status = 'done' then (g.d + time '15:30') at time zone ${DEFAULT_TIME_ZONE} end
      from bench_field_crew b
      join bench_facts x on x.field_id = b.field_id
      cross join lateral (
        select d::date as d, extract(isodow from d)::int as dow, extract(week from d)::int as wk
        from generate_series(${from}::date, (${from}::date + interval '1 month' - interval '1 day'), interval '1 day') d
      ) g
      cross join lateral (select abs(hashtext(b.field_id::text || ':' || g.d::text)) as h) r
      cross join lateral (
        select 'mow'::text as task,
               round((0.25 + b.area_m2 / 10000.0 * case when b.level = 1 then 1.1 else 0.55 end)::numeric, 2)::real as hours,
               jsonb_build_object('hocMm', x.hoc_mm, 'mower', case when b.level = 1 then 'reel' else 'rotary' end,
                                  'heightBeforeMm', round((x.hoc_mm * (1.15 + (r.h % 45) / 100.0))::numeric, 1)) as details
        where g.dow = any (x.mow_days) and (b.level < 4 or g.wk % 2 = 0)
        union all
        select 'paint_lines', 1.5, jsonb_build_object('coat', 'touch_up', 'lineLengthM', x.line_length_m, 'mixedL', x.mixed_l, 'paintL', round((x.mixed_l / 2)::numeric, 1))
        where x.line_length_m > 0 and g.dow = 4 and (b.level <= 2 or g.wk % 2 = 1)
        union all
        select 'irrigate', case when b.irrigation = 'automatic' then 0.25 else 1.0 end,
               jsonb_build_object('grossMm', 12 + r.h % 18, 'volumeL', round(((12 + r.h % 18) * b.area_m2)::numeric, 0), 'system', b.irrigation)
        where b.irrigation <> 'none' and g.dow = 1 and extract(month from g.d) between 5 and 9
        union all
        select 'field_check', 0.5, '{}'::jsonb where g.dow = 2 and (b.level <= 2 or g.wk % 2 = 0)
        union all
        select 'feed', round((0.25 + b.area_m2 / 10000.0 * 0.5)::numeric, 2)::real,
               jsonb_build_object('nGPerM2', 2.5, 'product', '20-0-10', 'productKg', round((b.area_m2 * 2.5 / 1000 / 0.2)::numeric, 1))
        where g.dow = 3 and extract(month from g.d) in (4, 5, 6, 9, 10) and g.wk % 4 = b.field_id % 4
        union all
        select 'aerate', round((b.area_m2 / 10000.0 * 2)::numeric, 2)::real, '{}'::jsonb where g.dow = 2 and g.wk in (16, 38)
        union all
        select 'overseed', round((b.area_m2 / 10000.0 * 1.5)::numeric, 2)::real, '{}'::jsonb where g.dow = 3 and g.wk = 37 and b.level <= 2
        union all
        select 'topdress', round((b.area_m2 / 10000.0 * 2.5)::numeric, 2)::real, '{}'::jsonb where g.dow = 4 and g.wk = 39 and b.level = 1
        union all
        select 'weed_control', round((b.area_m2 / 10000.0 * 0.8)::numeric, 2)::real, '{}'::jsonb where g.dow = 2 and g.wk = 20 and b.field_id % 3 = 0
      ) t
      cross join lateral (
        select case when g.d >= ${BIG_CITY.today}::date then 'planned' when r.h % 100 < 4 then 'skipped' else 'done' end as status
      ) st
      where g.dow <= 5`);
  }
}

// Run directly: build (or open) and print what it holds.
if (import.meta.url === `file://${process.argv[1]}`) {
  const t = performance.now();
  const { database, summary } = await openBigCity();
  console.log(`big city ready in ${((performance.now() - t) / 1000).toFixed(1)} s:`, summary);
  await database.close();
}
