/**
 * The department head's overview (a foreman's: his district's): quantities per district and
 * for the whole department, each a sum over rows the portal can link to. SI units: m², h, kg, L.
 */
import type { Level } from '../vocabulary.ts';

/** Planned against done labour of a span, hours rounded to 0.01 h. */
export interface OverviewLabour {
  /** Hours planned on every order of the span. */
  plannedHours: number;
  /** Hours the crews logged on the orders done. */
  actualHours: number;
  /** Hours planned on the orders done. */
  plannedHoursDone: number;
  ordersPlanned: number;
  ordersDone: number;
}

/** Mowings of a span by the one-third rule's due date (Records' counting: late = done after its due date). */
export interface OverviewMowings {
  asked: number;
  onTime: number;
  late: number;
  /** Not done and their day has passed. */
  missed: number;
}

/** One maintenance level inside a district or the department. */
export interface OverviewLevel {
  level: Level;
  fields: number;
  areaM2: number;
  /** Fields with a field check on record (their latest one counts). */
  scored: number;
  /** Mean of the latest surface score (0–100) of the scored fields; null when none is scored. */
  scoreAvg: number | null;
  /** The level's target surface score (Standards). */
  targetScore: number;
  /** Scored fields whose latest score is below the level's target. */
  belowTarget: number;
}

export interface OverviewBlock {
  /** null: the department (every district the caller may see). */
  districtId: number | null;
  name: string;
  levels: OverviewLevel[];
  labour: { week: OverviewLabour; season: OverviewLabour };
  mowings: { week: OverviewMowings; season: OverviewMowings };
  /** Nitrogen applied by the season's done feed orders against the season's feed plan (annual N × area), kg N. */
  nitrogen: { appliedKg: number; planKg: number };
  /** Irrigation water of the season's orders: the water budget the week plans scheduled, and what the done orders applied (L). */
  water: { budgetL: number; usedL: number };
  /** Line paint (concentrate) of the season's line-marking orders: planned and used by the done ones (L). */
  paint: { plannedL: number; usedL: number };
  /** Partner requests: open now (waiting for an answer, or scheduled into work), and closed (done or declined) in the season. */
  requests: { open: number; waiting: number; scheduled: number; closedInSeason: number };
  /** Fields closed or restricted now, and closures or restrictions decided in the season. */
  closures: { closedNow: number; restrictedNow: number; inSeason: number };
}

export interface Overview {
  season: number;
  /** The season's first and last day (1 January – 31 December, the department's dates). */
  seasonFrom: string;
  seasonTo: string;
  /** The department's current week (Monday to Sunday). */
  weekFrom: string;
  weekTo: string;
  /** The department's today: later orders are not yet missed. */
  asOf: string;
  /** The district asked for (a foreman's own), or null for the department. */
  districtId: number | null;
  /** The whole of what was asked: the department, or the one district. */
  total: OverviewBlock;
  /** One block per district in the answer, by name. */
  districts: OverviewBlock[];
}
