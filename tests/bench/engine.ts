/**
 * Engine benchmark: a season outlook for 3,000 synthetic fields over 365 days of synthetic
 * weather, then a week's mowings assigned to 40 crews and days (`assignWeek`) and each
 * crew-day routed (`crewDayLoads`). All data is invented and generated from a fixed seed.
 * Run: node --import tsx tests/bench/engine.ts
 */
import { performance } from 'node:perf_hooks';
import { GRASSES, SPORTS } from '@swardwise/domain';
import type { Grass, IrrigationKind, Level, Sport } from '@swardwise/domain';
import * as e from '@swardwise/domain/engine';
import { seeded } from './support.ts';

const FIELDS = 3000;
const FIELDS_PER_SITE = 10;
const CREWS = 40;
const DISTRICTS = 3;
const RUNS = 5;

const { rand, pick } = seeded(20260101);

interface Site {
  id: number;
  districtId: number;
  lat: number;
  lng: number;
  weather: e.DailyWeather[];
}

function weatherFor(lat: number): e.DailyWeather[] {
  const out: e.DailyWeather[] = [];
  const shift = (lat - 37) * -0.8;
  for (let i = 0; i < 365; i++) {
    const mean = 13 + shift - 11 * Math.cos((2 * Math.PI * (i - 15)) / 365) + (rand() - 0.5) * 4;
    const range = 8 + rand() * 6;
    const wet = rand() < 0.25;
    const doy = i + 1;
    const daylight = e.daylightHours(e.sunsetHourAngle(e.degToRad(lat), e.solarDeclination(doy)));
    out.push({
      date: e.addDaysIso('2025-01-01', i),
      tmaxC: mean + range / 2,
      tminC: mean - range / 2,
      rainMm: wet ? rand() * 25 : 0,
      rhMaxPct: wet ? 95 : 75 + rand() * 15,
      rhMinPct: wet ? 65 : 30 + rand() * 25,
      windMs: 1 + rand() * 3,
      sunshineH: daylight * (wet ? rand() * 0.3 : 0.5 + rand() * 0.45),
    });
  }
  return out;
}

const sites: Site[] = [];
for (let s = 0; s < FIELDS / FIELDS_PER_SITE; s++) {
  const districtId = (s % DISTRICTS) + 1;
  const lat = 36.9 + rand() * 0.3;
  sites.push({ id: s + 1, districtId, lat, lng: -89.1 + rand() * 0.3, weather: weatherFor(lat) });
}

const fields: Array<e.OutlookField & { siteId: number }> = [];
for (let f = 0; f < FIELDS; f++) {
  const site = sites[Math.floor(f / FIELDS_PER_SITE)] as Site;
  fields.push({
    id: f + 1,
    siteId: site.id,
    districtId: site.districtId,
    areaM2: 3000 + rand() * 9000,
    sport: pick(SPORTS) as Sport,
    grass: pick(GRASSES) as Grass,
    maintenanceLevel: pick([1, 2, 3, 4] as const) as Level,
    clippings: rand() < 0.7 ? 'returned' : 'removed',
    irrigation: pick(['none', 'quick_coupler', 'automatic'] as const) as IrrigationKind,
  });
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] as number;
};
const mb = (bytes: number) => (bytes / 1024 / 1024).toFixed(1);

function seasonOutlook(): { outlooks: e.FieldOutlook[]; prepMs: number } {
  const t0 = performance.now();
  const prepared = new Map<number, e.PreparedWeather>();
  for (const s of sites) prepared.set(s.id, e.prepareWeather(s.weather, { latDeg: s.lat, elevationM: 150 }));
  const prepMs = performance.now() - t0;
  const outlooks = fields.map((f) => e.fieldOutlook(f, prepared.get(f.siteId) as e.PreparedWeather));
  return { outlooks, prepMs };
}

const WEEK = '2025-06-16';
const YARD = { lat: 37.05, lng: -88.95 };

/** One district's week the way the week plan runs it: mowings to crews and days, then each crew-day routed. */
function districtWeek(districtId: number, outlooks: readonly e.FieldOutlook[]): e.CrewDayLoad[] {
  const crews = Array.from({ length: CREWS }, (_, c) => c + 1)
    .filter((id) => (id % DISTRICTS) + 1 === districtId)
    .map((id) => ({ id, hoursPerDay: 4 * e.DEFAULT_PARAMETERS.crewHoursPerWeek / 5, workDays: ['mon', 'tue', 'wed', 'thu', 'fri'] as const }));
  const orders: e.AskedOrder[] = [];
  outlooks.forEach((o, i) => {
    const f = fields[i]!;
    if (f.districtId !== districtId) return;
    const mower = e.DEFAULT_PARAMETERS.mowers[o.mowerKind];
    // A mid-season week: the field's average mowings per week, at least one.
    const cuts = Math.max(1, Math.round(o.mowingsPerWeek));
    const plannedHours = cuts * e.hoursPerMowing(f.areaM2, mower);
    orders.push({ fieldId: i + 1, siteId: f.siteId, task: 'mow', askedDate: WEEK, plannedHours, reason: '', details: {}, latestDate: null, flexible: true, equipmentKind: null });
  });
  const sitePoints = new Map(sites.map((s) => [s.id, { lat: s.lat, lng: s.lng }]));
  const travel = e.DEFAULT_PARAMETERS.travel;
  const assigned = e.assignWeek({ weekStart: WEEK, orders, crews, sites: sitePoints, yard: YARD, travel });
  return e.crewDayLoads(assigned.orders.map((o, id) => ({ ...o, id })), crews, sitePoints, YARD, travel, WEEK);
}

function weekPlans(outlooks: readonly e.FieldOutlook[]): e.CrewDayLoad[] {
  return Array.from({ length: DISTRICTS }, (_, d) => districtWeek(d + 1, outlooks)).flat();
}

const outlookMs: number[] = [];
// CPU time of the outlook (user + system): steadier than wall time on a machine shared with other work.
const outlookCpuMs: number[] = [];
const prepMs: number[] = [];
const planMs: number[] = [];
let lastOutlooks: e.FieldOutlook[] = [];
let lastPlans: e.CrewDayLoad[] = [];
(globalThis as { gc?: () => void }).gc?.();
const mem0 = process.memoryUsage();
for (let r = 0; r < RUNS; r++) {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const { outlooks, prepMs: p } = seasonOutlook();
  const c1 = process.cpuUsage(c0);
  const t1 = performance.now();
  outlookCpuMs.push((c1.user + c1.system) / 1000);
  const plans = weekPlans(outlooks);
  const t2 = performance.now();
  outlookMs.push(t1 - t0);
  prepMs.push(p);
  planMs.push(t2 - t1);
  lastOutlooks = outlooks;
  lastPlans = plans;
}
const mem1 = process.memoryUsage();

const agg = e.aggregateOutlooks(lastOutlooks);
const overloaded = new Set(lastPlans.filter((d) => d.overloaded).map((d) => d.crewId)).size;
const stops = lastPlans.reduce((s, d) => s + d.route.length, 0);
console.log(`engine bench: ${FIELDS} fields, ${sites.length} sites with their own 365-day weather, ${CREWS} crews; median of ${RUNS} runs`);
console.log(`  season outlook (incl. weather prep): ${median(outlookMs).toFixed(0)} ms  (CPU ${median(outlookCpuMs).toFixed(0)} ms; weather prep ${median(prepMs).toFixed(0)} ms, ${sites.length * 365} FAO-56 PM days)`);
console.log(`  week plans + routing, 40 crews:      ${median(planMs).toFixed(1)} ms  (${stops} site visits routed, ${overloaded} crews overloaded)`);
console.log(`  memory: heapUsed ${mb(mem0.heapUsed)} → ${mb(mem1.heapUsed)} MB (Δ ${mb(mem1.heapUsed - mem0.heapUsed)}), rss ${mb(mem0.rss)} → ${mb(mem1.rss)} MB (Δ ${mb(mem1.rss - mem0.rss)})`);
console.log(`  department: ${agg.department.mowings} mowings, ${agg.department.labourHours.toFixed(0)} h, ${agg.department.nKg.toFixed(0)} kg N, ${agg.department.waterM3.toFixed(0)} m³ water, cost ${agg.department.cost.total.toFixed(0)} (invented demo prices)`);
