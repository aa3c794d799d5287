/**
 * What-if over 300 fields: the demo city's fields (apps/api/src/db/seed/demo-city.ts) plus
 * invented copies of them at other sizes and levels, to 300, each with its nearest station's
 * season of weather. A scenario moves 60 fields a level and changes level 3's Standards (which
 * touches every level-3 field), and the preview works out the season before and after
 * (`whatIf`, the same call the API's POST /api/what-if makes). Target: under 1 s.
 * Run: node --import tsx tests/bench/what-if.ts
 */
import { DEFAULT_COSTS, DEFAULT_PARAMETERS, DEFAULT_STANDARDS, polygonAreaM2, whatIf, type Level, type WhatIfField } from '@swardwise/domain';
import { buildDemoCity } from '../../apps/api/src/db/seed/demo-city.ts';
import { demoWeather, fmt, seeded } from './support.ts';

const FIELDS = 300;
const RUNS = 7;
const city = buildDemoCity();
const weatherAt = demoWeather(city);
const siteOf = new Map(city.sites.map((s) => [s.key, s]));
const { rand } = seeded(15);
const fields: WhatIfField[] = [];
for (let i = 0; i < FIELDS; i++) {
  const f = city.fields[i % city.fields.length]!;
  const site = siteOf.get(f.siteKey)!;
  const copy = i >= city.fields.length;
  fields.push({
    field: {
      id: i + 1,
      districtId: site.districtCode,
      areaM2: polygonAreaM2(f.geometry) * (copy ? 0.6 + rand() * 0.8 : 1),
      sport: f.sport,
      grass: f.grass,
      maintenanceLevel: copy ? ((1 + Math.floor(rand() * 4)) as Level) : f.maintenanceLevel,
      hocOverrideMm: f.hocOverrideMm,
      clippings: f.clippings,
      irrigation: f.irrigation,
    },
    weather: weatherAt(site),
  });
}
const moves = fields.filter((_, i) => i % 5 === 0).map((f) => ({ fieldId: f.field.id, level: (((f.field.maintenanceLevel as number) % 4) + 1) as Level }));
const scenario = { moves, standards: { 3: { minMowingsPerWeek: 2, annualNShare: 0.8, lineRepaintDays: 10 } } };

const times: number[] = [];
let last: ReturnType<typeof whatIf> | null = null;
for (let r = 0; r < RUNS; r++) {
  const t0 = performance.now();
  last = whatIf(fields, DEFAULT_STANDARDS, DEFAULT_PARAMETERS, DEFAULT_COSTS, scenario);
  times.push(performance.now() - t0);
}
const days = fields[0]!.weather.dates.length;
console.log(`what-if over ${FIELDS} fields (${days} days of weather), ${moves.length} moved + level 3 changed: ${last!.fieldsTouched} fields worked out again`);
console.log(`  ${fmt(times)} (target < 1000 ms)`);
console.log(`  change: ${last!.delta.totals.mowings} mowings, ${last!.delta.totals.labourHours.toFixed(0)} h, ${last!.delta.totals.waterM3.toFixed(0)} m³, ${last!.delta.totals.nKg.toFixed(0)} kg N, USD ${last!.delta.lines.labour.cost!.toFixed(0)} labour`);
