/** The week plan of a district: the board, what re-generating would change, confirming it. */
import type { Weekday } from '../engine/dates.ts';
import type { CrewDayLoad } from '../engine/weekgen.ts';
import type { WorkTask } from '../vocabulary.ts';
import type { Instant } from './common.ts';
import type { WorkOrderRow } from './work-orders.ts';

export interface SiteStop {
  siteId: number;
  siteName: string;
  lat: number;
  lng: number;
}

/** One crew's day: the engine's load of it (hours against what the crew has), with its sites in driving order from the yard. */
export type CrewDay = Omit<CrewDayLoad, 'route'> & { route: SiteStop[] };

export interface BoardCrew {
  id: number;
  name: string;
  hoursPerDay: number;
  workDays: Weekday[];
  leadName: string | null;
}

/** `GET /api/week-plans?districtId&weekStart`. */
export interface WeekBoard<At extends Instant = string> {
  districtId: number;
  districtName: string;
  weekStart: string;
  /** Seven ISO dates, Monday to Sunday. */
  dates: string[];
  yard: { name: string; lat: number; lng: number };
  crews: BoardCrew[];
  orders: WorkOrderRow<At>[];
  crewDays: CrewDay[];
  unassignedHours: number;
  warnings: string[];
  /** When the week was last generated (ISO 8601), null if never. */
  lastGeneratedAt: string | null;
}

/** One order in a preview of re-generating. */
export interface DiffItem {
  /** Null for a yard job: `fieldName` is then its machine and `siteName` the district's yard. */
  fieldId: number | null;
  fieldName: string;
  siteName: string;
  task: WorkTask;
  plannedDate: string;
  plannedHours: number;
  crewId: number | null;
  crewName: string | null;
  reason: string;
}

export interface PlanDiff {
  added: DiffItem[];
  removed: DiffItem[];
  changed: { before: DiffItem; after: DiffItem; what: string[] }[];
  kept: DiffItem[];
  /** `unchanged`: orders the new plan matches as they are (not listed one by one). */
  summary: { added: number; removed: number; changed: number; kept: number; unchanged: number };
}

/** `POST /api/week-plans/generate`; with `dryRun` nothing is written. */
export interface GenerateAnswer<At extends Instant = string> {
  dryRun: boolean;
  diff: PlanDiff;
  /** What the planner could not do (e.g. a field with no crew able to mow it). */
  warnings: string[];
  board: WeekBoard<At>;
}

/** `POST /api/week-plans/confirm`: orders assigned, crew leads e-mailed, and the board after. */
/** `POST /api/week-plans/rain-out`: how many orders were cancelled, and the board after it. */
export interface RainOutAnswer<At extends Instant = string> {
  cancelled: number;
  board: WeekBoard<At>;
}

export interface ConfirmAnswer<At extends Instant = string> {
  assigned: number;
  emailed: number;
  /** Why fewer crew leads were e-mailed than there were crews with new work. */
  mail: CrewMailReport;
  board: WeekBoard<At>;
}

/** The crew-lead e-mails of one change: how many went out and why the others did not. */
export interface CrewMailReport {
  /** Crews with new work. */
  crews: number;
  sent: number;
  /** The server has no mail set up (SMTP_HOST): nothing could be mailed. */
  mailOff: boolean;
  /** Crews with new work but no active crew-lead account to write to. */
  crewsWithoutLead: string[];
  /** E-mails the mail server refused or could not take. */
  failed: number;
}
