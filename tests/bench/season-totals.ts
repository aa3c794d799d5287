/**
 * Season totals of the demo city: the turf engine's season outlook for every field of the
 * invented demo city (apps/api/src/db/seed/demo-city.ts, deterministic) over its season of
 * station weather, with the default Standards and department parameters the demo seed
 * stores. Prints mowings, hours, water and paint, per district and for the department, so a
 * change to the engine can be read as "before → after" in budget terms.
 * Run: node --import tsx tests/bench/season-totals.ts  (add --json for one JSON line)
 */
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, polygonAreaM2 } from '@swardwise/domain';
import * as e from '@swardwise/domain/engine';
import { buildDemoCity } from '../../apps/api/src/db/seed/demo-city.ts';
import { demoWeather } from './support.ts';

export interface SeasonTotals {
  fields: number;
  days: number;
  mowings: number;
  mowingHours: number;
  lineHours: number;
  labourHours: number;
  waterM3: number;
  paintMixedL: number;
  paintConcentrateL: number;
  nKg: number;
}

/** The season outlook of every demo field, summed per district and for the department. */
export function demoSeasonTotals(): { department: SeasonTotals; byDistrict: Record<string, SeasonTotals> } {
  const city = buildDemoCity();
  const weatherAt = demoWeather(city);
  const siteOf = new Map(city.sites.map((s) => [s.key, s]));
  const empty = (): SeasonTotals => ({ fields: 0, days: 0, mowings: 0, mowingHours: 0, lineHours: 0, labourHours: 0, waterM3: 0, paintMixedL: 0, paintConcentrateL: 0, nKg: 0 });
  const department = empty();
  const byDistrict: Record<string, SeasonTotals> = {};
  city.fields.forEach((f, i) => {
    const site = siteOf.get(f.siteKey)!;
    const weather = weatherAt(site);
    const o = e.fieldOutlook(
      { id: i + 1, districtId: site.districtCode, areaM2: polygonAreaM2(f.geometry), sport: f.sport, grass: f.grass, maintenanceLevel: f.maintenanceLevel, hocOverrideMm: f.hocOverrideMm, clippings: f.clippings, irrigation: f.irrigation },
      weather,
      DEFAULT_STANDARDS,
      DEFAULT_PARAMETERS,
    );
    const mixed = o.paintMixedL;
    for (const t of [department, (byDistrict[site.districtCode] ??= empty())]) {
      t.fields += 1;
      t.days = Math.max(t.days, o.days);
      t.mowings += o.mowings;
      t.mowingHours += o.mowingHours;
      t.lineHours += o.lineHours;
      t.labourHours += o.labourHours;
      t.waterM3 += o.waterM3;
      t.paintMixedL += mixed;
      t.paintConcentrateL += o.paintConcentrateL;
      t.nKg += o.nKg;
    }
  });
  return { department, byDistrict };
}

const fmt = (t: SeasonTotals) =>
  `${t.fields} fields, ${t.days} days: ${t.mowings} mowings, ${t.mowingHours.toFixed(0)} h mowing + ${t.lineHours.toFixed(0)} h lines = ${t.labourHours.toFixed(0)} h; ` +
  `water ${t.waterM3.toFixed(0)} m³ (${(e.litresToUsGallons(t.waterM3 * 1000) / 1e6).toFixed(2)} M gal); ` +
  `paint ${t.paintMixedL.toFixed(0)} L mixed / ${t.paintConcentrateL.toFixed(0)} L concentrate (${e.litresToUsGallons(t.paintMixedL).toFixed(0)} / ${e.litresToUsGallons(t.paintConcentrateL).toFixed(0)} gal); N ${t.nKg.toFixed(0)} kg`;

const totals = demoSeasonTotals();
if (process.argv.includes('--json')) {
  console.log(JSON.stringify(totals));
} else {
  console.log('demo city season totals (season outlook, default Standards and parameters)');
  console.log(`  department: ${fmt(totals.department)}`);
  for (const [code, t] of Object.entries(totals.byDistrict)) console.log(`  ${code}: ${fmt(t)}`);
}
