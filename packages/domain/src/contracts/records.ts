/** `GET /api/records`: planned against actual work, and mowings asked against done. */
import type { WorkStatus, WorkTask } from '../vocabulary.ts';

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

/** A crew's note or photos on one job in the range, for the office to read. */
export interface CrewNote {
  orderId: number;
  /** Null for a yard job. */
  fieldId: number | null;
  fieldName: string;
  siteName: string;
  task: WorkTask;
  crewName: string | null;
  status: WorkStatus;
  /** The department's date of the latest report on the job. */
  reportedOn: string;
  /** The notes of its reports, oldest first. */
  notes: string[];
  photos: { id: number; url: string }[];
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
  /** Jobs with a crew's note or photos, newest report first (at most 200). */
  crewNotes: CrewNote[];
  totals: RecordTally;
}
