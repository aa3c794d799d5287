/**
 * A crew's days as it drives them: each day's sites in the order of the planner's route from
 * the district yard (the same `planRoute`, so the phone and the week plan agree), the jobs of
 * one site together, fields by name.
 */
import { addDaysIso, planRoute, type LatLng, type WorkOrderRow } from '@swardwise/domain';

export interface RouteStopJobs {
  /** Null: the yard, where yard jobs (blade sharpening) are done before the crew leaves. */
  siteId: number | null;
  siteName: string;
  orders: WorkOrderRow[];
}

export interface CrewDayPlan {
  date: string;
  label: string;
  plannedHours: number;
  stops: RouteStopJobs[];
}

function dayLabel(date: string, today: string): string {
  const long = new Date(`${date}T12:00:00`).toLocaleDateString('en-US', { weekday: 'long', month: 'short', day: 'numeric' });
  if (date === today) return `Today, ${long}`;
  if (date === addDaysIso(today, 1)) return `Tomorrow, ${long}`;
  return long;
}

/**
 * Days from `today` on, each routed from the yard. Sites whose position is unknown (or all
 * sites, when the yard is) keep the API's order after the routed ones.
 */
export function crewDays(orders: readonly WorkOrderRow[], today: string, yard: LatLng | null, sitePositions: ReadonlyMap<number, LatLng>): CrewDayPlan[] {
  const byDate = new Map<string, WorkOrderRow[]>();
  for (const o of orders) {
    if (o.plannedDate < today) continue;
    byDate.set(o.plannedDate, [...(byDate.get(o.plannedDate) ?? []), o]);
  }
  return [...byDate.keys()].sort().map((date) => {
    const items = byDate.get(date)!;
    const stops = new Map<number, RouteStopJobs>();
    const yardJobs = items.filter((o) => o.siteId === null);
    const yardStop: RouteStopJobs[] = yardJobs.length ? [{ siteId: null, siteName: yardJobs[0]!.siteName, orders: yardJobs.sort((a, b) => a.id - b.id) }] : [];
    for (const o of items) {
      if (o.siteId === null) continue;
      const stop = stops.get(o.siteId) ?? { siteId: o.siteId, siteName: o.siteName, orders: [] };
      stop.orders.push(o);
      stops.set(o.siteId, stop);
    }
    for (const stop of stops.values()) stop.orders.sort((a, b) => a.fieldName.localeCompare(b.fieldName) || a.id - b.id);
    const position = (stop: RouteStopJobs): LatLng | undefined => {
      const o = stop.orders[0]!;
      return o.siteLat != null && o.siteLng != null ? { lat: o.siteLat, lng: o.siteLng } : stop.siteId === null ? undefined : sitePositions.get(stop.siteId);
    };
    const placed = [...stops.values()].filter((s) => yard && position(s));
    const unplaced = [...stops.values()].filter((s) => !placed.includes(s));
    const order = yard && placed.length ? planRoute(yard, placed.map((s) => ({ id: s.siteId!, ...position(s)! }))).order : [];
    const routed = order.map((id) => stops.get(Number(id))!);
    return {
      date,
      label: dayLabel(date, today),
      plannedHours: items.reduce((sum, o) => sum + o.plannedHours, 0),
      stops: [...yardStop, ...routed, ...unplaced],
    };
  });
}
