/** The engine run for a district's week: each field's asked work, then crews and days. */
import {
  addDaysIso,
  assignWeek,
  isKept,
  planFieldWeek,
  planSharpeningJobs,
  weekDates,
  weekWarningText,
  DISTRICT_WEEK_WARNINGS,
  type AskedOrder,
  type DepartmentParameters,
  type PlanMower,
  type Standards,
  type WeekWarning,
  type Weekday,
} from '@swardwise/domain';
import type { Queryable } from '../../db/client.ts';
import { loadParameters, loadStandards } from '../standards.ts';
import { planningWeather } from '../stations.ts';
import { districtCrews, districtRow, planEquipment, planFields, rainedOutDays, siteCrewHints, type ExistingRow, type GenerationInput, type YardRow } from './load.ts';

interface AskInput {
  q: GenerationInput;
  kept: ExistingRow[];
  workDays: Weekday[];
  mowers: PlanMower[];
  standards: Standards;
  params: DepartmentParameters;
  notBefore: string | undefined;
}

/** What each field asks of the week, with the warnings the district week shows. */
async function askFields(db: Queryable, input: AskInput) {
  const { q, kept, workDays, mowers, standards, params, notBefore } = input;
  const keptByField = new Map<number, ExistingRow[]>();
  for (const k of kept) keptByField.set(k.fieldId, [...(keptByField.get(k.fieldId) ?? []), k]);
  const { fieldRows, toPlanField } = await planFields(db, q);
  const weather = await planningWeather(db, addDaysIso(weekDates(q.weekStart)[6]!, 7));
  const asked: AskedOrder[] = [];
  const warnings: WeekWarning[] = [];
  let noWeather = 0;
  for (const f of fieldRows) {
    const station = weather.nearest({ lat: f.siteLat, lng: f.siteLng });
    if (!station) {
      noWeather++;
      continue;
    }
    const w = await weather.load(station.id);
    const plan = planFieldWeek({ field: toPlanField(f), weather: w, weekStart: q.weekStart, kept: keptByField.get(f.id) ?? [], workDays: workDays.length ? workDays : ['mon', 'tue', 'wed', 'thu', 'fri'], mowers, standards, params, ...(notBefore ? { notBefore } : {}) });
    asked.push(...plan.orders);
    warnings.push(...plan.warnings.filter((n) => DISTRICT_WEEK_WARNINGS.has(n.code)));
  }
  if (noWeather) warnings.push({ code: 'no_station', fields: noWeather });
  return { asked, warnings, fieldRows };
}

/** Everything the engine needs for a district's week, and its answer: the scheduled orders and the worded warnings. */
export async function planDistrictWeek(db: Queryable, q: GenerationInput, existing: ExistingRow[], today: string, yardExisting: YardRow[] = []) {
  const weekEnd = weekDates(q.weekStart)[6]!;
  // In the week under way, work goes on today (the department's) or later.
  const notBefore = today >= q.weekStart && today <= weekEnd ? today : undefined;
  const district = await districtRow(db, q.districtId);
  const { standards } = await loadStandards(db);
  const params = await loadParameters(db);
  const crewRows = await districtCrews(db, q.districtId);
  const units = await planEquipment(db, q.districtId);
  const workDays = [...new Set(crewRows.flatMap((c) => c.workDays))] as Weekday[];
  const kept = existing.filter(isKept);
  const { asked, warnings, fieldRows } = await askFields(db, { q, kept, workDays, mowers: units.mowers, standards, params, notBefore });

  const closed = await rainedOutDays(db, q, crewRows.map((c) => c.id));
  // Yard jobs first: blades sharpened before the week's mowing; their hours take crew time.
  const crewInputs = crewRows.map((c) => ({ id: c.id, hoursPerDay: c.hoursPerDay, workDays: c.workDays }));
  const sharpenJobs = planSharpeningJobs({ weekStart: q.weekStart, machines: units.sharpen, crews: crewInputs, closed, ...(notBefore ? { notBefore } : {}) });
  const keptHours = new Map<string, number>();
  const keptSites = new Map<string, number[]>();
  const keptYard = yardExisting.filter(isKept);
  const yardTime = [...keptYard, ...sharpenJobs.filter((j) => !keptYard.some((k) => k.equipmentId === j.equipmentId))];
  for (const y of yardTime) {
    if (y.crewId === null || ('status' in y && y.status === 'skipped')) continue;
    const key = `${y.crewId}|${y.plannedDate}`;
    keptHours.set(key, (keptHours.get(key) ?? 0) + y.plannedHours);
  }
  for (const k of kept) {
    if (k.crewId === null || k.status === 'skipped') continue;
    const key = `${k.crewId}|${k.plannedDate}`;
    keptHours.set(key, (keptHours.get(key) ?? 0) + k.plannedHours);
    keptSites.set(key, [...(keptSites.get(key) ?? []), k.siteId]);
  }
  const assigned = assignWeek({
    weekStart: q.weekStart,
    orders: asked,
    crews: crewInputs,
    keptHours,
    keptSites,
    closed,
    siteCrewHint: await siteCrewHints(db, q, weekEnd),
    equipment: units.equipment,
    sites: new Map(fieldRows.map((f) => [f.siteId, { lat: f.siteLat, lng: f.siteLng }])),
    yard: { lat: district.yardLat, lng: district.yardLng },
    travel: params.travel,
    ...(notBefore ? { notBefore } : {}),
    previous: existing.filter((e) => !isKept(e)),
  });
  const fieldNames = new Map(fieldRows.map((f) => [f.id, f.name]));
  const crewNames = new Map(crewRows.map((c) => [c.id, c.name]));
  const words = [...warnings, ...assigned.warnings].map((w) => weekWarningText(w, (id) => fieldNames.get(id), (id) => crewNames.get(id)));
  return { orders: assigned.orders, warnings: [...new Set(words)], crewRows, fieldCount: fieldRows.length, sharpenJobs, yardName: district.yardName, machineNames: new Map(units.sharpen.map((m) => [m.id, m.name])) };
}
