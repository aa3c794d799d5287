import type { CreateWorkOrderInput, UpdateWorkOrderInput, Weekday, WorkStatus, WorkTask } from '@swardwise/domain';
import { api } from './client.ts';

/** A work order as the week plan and its writes answer it (the API contract's WorkOrderRow). */
export interface PlanOrder {
  id: number;
  fieldId: number;
  fieldName: string;
  siteId: number;
  siteName: string;
  districtId: number;
  task: WorkTask;
  weekStart: string;
  plannedDate: string;
  crewId: number | null;
  crewName: string | null;
  equipmentId: number | null;
  equipmentName: string | null;
  plannedHours: number;
  actualHours: number | null;
  status: WorkStatus;
  origin: 'generated' | 'manual';
  pinned: boolean;
  reason: string;
  notes: string;
  details: {
    hocMm?: number;
    mowerKind?: 'reel' | 'rotary';
    runTimeMin?: number;
    productKg?: number;
    paintL?: number;
    eventTitle?: string;
    eventOn?: string;
  } & Record<string, unknown>;
  version: number;
  siteLat: number;
  siteLng: number;
  photoCount: number;
}

export interface RouteStop {
  siteId: number;
  siteName: string;
  lat: number;
  lng: number;
}

/** One crew's day: its hours against what the crew has, and the sites in driving order from the yard. */
export interface CrewDay {
  crewId: number;
  date: string;
  availableHours: number;
  workHours: number;
  driveKm: number;
  driveHours: number;
  loadUnloadHours: number;
  totalHours: number;
  overloaded: boolean;
  route: RouteStop[];
  orderIds: number[];
}

export interface BoardCrew {
  id: number;
  name: string;
  hoursPerDay: number;
  workDays: Weekday[];
  leadName: string | null;
}

export interface WeekBoard {
  districtId: number;
  districtName: string;
  weekStart: string;
  /** Seven ISO dates, Monday to Sunday. */
  dates: string[];
  yard: { name: string; lat: number; lng: number };
  crews: BoardCrew[];
  orders: PlanOrder[];
  crewDays: CrewDay[];
  unassignedHours: number;
  warnings: string[];
  lastGeneratedAt: string | null;
}

export interface DiffItem {
  fieldId: number;
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
  summary: { added: number; removed: number; changed: number; kept: number; unchanged?: number };
}

export interface GenerateAnswer {
  dryRun: boolean;
  diff: PlanDiff;
  /** What the planner could not do (e.g. a field with no crew able to mow it). */
  warnings: string[];
  board: WeekBoard;
}

/** The counts every records row carries (per field, crew, week and in total). */
export interface RecordTally {
  plannedHours: number;
  actualHours: number;
  /** Planned hours of the orders that are done, to compare like with like. */
  plannedHoursDone: number;
  ordersDone: number;
  ordersSkipped: number;
  ordersOpen: number;
  /** Mowings the one-third rule asked for in the range. */
  mowingsAsked: number;
  mowingsDone: number;
  /** Done after the day they were due by. */
  mowingsLate: number;
  /** Not done and their day has passed. */
  mowingsMissed: number;
}

export interface FieldRecord extends RecordTally {
  fieldId: number;
  fieldName: string;
  siteName: string;
}

export interface CrewRecord extends RecordTally {
  crewId: number | null;
  crewName: string;
}

export interface WeekRecord extends RecordTally {
  weekStart: string;
}

export interface LateMowing {
  id: number;
  fieldName: string;
  siteName: string;
  dueBy: string;
  doneOn: string;
  daysLate: number;
}

export interface Records {
  from: string;
  to: string;
  districtId: number | null;
  /** The day "missed" is counted against. */
  asOf: string;
  byField: FieldRecord[];
  byCrew: CrewRecord[];
  byWeek: WeekRecord[];
  lateMowings: LateMowing[];
  totals: RecordTally;
}

export function fetchWeekBoard(query: { districtId: number; weekStart: string }, signal?: AbortSignal): Promise<WeekBoard> {
  return api.get<WeekBoard>('/week-plans', query, signal);
}

/** With `dryRun` nothing is written: the answer shows what generating would change. */
export function generateWeek(body: { districtId: number; weekStart: string; dryRun: boolean }): Promise<GenerateAnswer> {
  return api.post<GenerateAnswer>('/week-plans/generate', body);
}

/**
 * Confirms the suggested crews of the week (or of one crew): planned orders with a crew become
 * assigned and pinned, and each crew lead gets one e-mail.
 */
export function confirmWeek(body: { districtId: number; weekStart: string; crewId?: number }): Promise<{ assigned: number; emailed: number; board: WeekBoard }> {
  return api.post('/week-plans/confirm', body);
}

export function createWorkOrder(body: CreateWorkOrderInput): Promise<PlanOrder> {
  return api.post<PlanOrder>('/work-orders', body);
}

/** Sends the version the order was read at; a stale one answers 409. */
export function updateWorkOrder(id: number, body: UpdateWorkOrderInput): Promise<PlanOrder & { emailed?: number }> {
  return api.patch<PlanOrder & { emailed?: number }>(`/work-orders/${id}`, body);
}

export function deleteWorkOrder(id: number, version: number): Promise<void> {
  return api.delete<void>(`/work-orders/${id}?version=${version}`);
}

export function fetchRecords(query: { districtId?: number; from: string; to: string }, signal?: AbortSignal): Promise<Records> {
  return api.get<Records>('/records', query, signal);
}
