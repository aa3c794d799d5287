/**
 * Week plan for one crew: the week's jobs grouped by site, sites spread over the crew's
 * working days to balance hours, each day routed from the yard, and the week's load against
 * the crew's available hours. Greedy balancing (largest site first onto the lightest day,
 * ties by weekday order then site id) — this product's rule, deterministic for equal input.
 */
import { fail, requireNonNegative } from './check.ts';
import { WEEKDAYS } from './dates.ts';
import type { Weekday } from './dates.ts';
import { crewWeekLoad } from './labour.ts';
import type { CrewLoad, LatLng, TravelSettings } from './labour.ts';
import { planRoute } from './routing.ts';

export interface PlanJob {
  id: string | number;
  siteId: string | number;
  site: LatLng;
  /** Work hours on site (e.g. hours per mowing). */
  hours: number;
}

export interface PlanCrew {
  id: string | number;
  yard: LatLng;
  days: readonly Weekday[];
  availableHours: number;
}

export interface PlanDay {
  day: Weekday;
  siteOrder: Array<string | number>;
  jobIds: Array<string | number>;
  workHours: number;
  driveKm: number;
  driveHours: number;
  loadUnloadHours: number;
  totalHours: number;
}

export interface CrewWeekPlan {
  crewId: string | number;
  days: PlanDay[];
  load: CrewLoad;
}

/** Plans a crew's week: jobs by site onto days, routes per day, hours against availability. */
export function planCrewWeek(crew: PlanCrew, jobs: readonly PlanJob[], travel: TravelSettings): CrewWeekPlan {
  const days = [...new Set(crew.days)].sort((a, b) => WEEKDAYS.indexOf(a) - WEEKDAYS.indexOf(b));
  if (days.length === 0) fail('no_work_days', `crew ${String(crew.id)} has no working days`);
  const sites = new Map<string, { siteId: string | number; site: LatLng; hours: number; jobs: Array<string | number> }>();
  for (const j of jobs) {
    requireNonNegative(j.hours, 'invalid_hours', `hours of job ${String(j.id)}`);
    const key = String(j.siteId);
    const s = sites.get(key) ?? { siteId: j.siteId, site: j.site, hours: 0, jobs: [] };
    s.hours += j.hours;
    s.jobs.push(j.id);
    sites.set(key, s);
  }
  const ordered = [...sites.values()].sort((a, b) => b.hours - a.hours || (String(a.siteId) < String(b.siteId) ? -1 : String(a.siteId) > String(b.siteId) ? 1 : 0));
  const bins = days.map(() => ({ hours: 0, sites: [] as typeof ordered }));
  for (const s of ordered) {
    let best = 0;
    for (let d = 1; d < bins.length; d++) if ((bins[d] as (typeof bins)[number]).hours < (bins[best] as (typeof bins)[number]).hours - 1e-12) best = d;
    const bin = bins[best] as (typeof bins)[number];
    bin.hours += s.hours + travel.loadUnloadMin / 60;
    bin.sites.push(s);
  }
  const planDays: PlanDay[] = bins.map((bin, d) => {
    const route = planRoute(crew.yard, bin.sites.map((s) => ({ id: s.siteId, lat: s.site.lat, lng: s.site.lng })), { roadFactor: travel.roadFactor, speedKmh: travel.speedKmh });
    const workHours = bin.sites.reduce((s, x) => s + x.hours, 0);
    const loadUnloadHours = (bin.sites.length * travel.loadUnloadMin) / 60;
    const byId = new Map(bin.sites.map((s) => [String(s.siteId), s]));
    return {
      day: days[d] as Weekday,
      siteOrder: route.order,
      jobIds: route.order.flatMap((id) => byId.get(String(id))?.jobs ?? []),
      workHours,
      driveKm: route.totalKm,
      driveHours: route.driveHours,
      loadUnloadHours,
      totalHours: workHours + route.driveHours + loadUnloadHours,
    };
  });
  return { crewId: crew.id, days: planDays, load: crewWeekLoad(crew.id, planDays.map((d) => d.totalHours), crew.availableHours) };
}
