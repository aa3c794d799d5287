import { FIELD_STATUSES, LEVELS, type FieldStatus, type Level } from '@swardwise/domain';

export interface FieldTally {
  total: number;
  areaM2: number;
  byLevel: Record<Level, number>;
  byStatus: Record<FieldStatus, number>;
}

type Tallied = { maintenanceLevel: Level; status: FieldStatus; areaM2: number };

/** Counts fields per maintenance level and per status (a count of rows, not a computation). */
export function tallyFields(fields: readonly Tallied[]): FieldTally {
  const byLevel = Object.fromEntries(LEVELS.map((l) => [l, 0])) as Record<Level, number>;
  const byStatus = Object.fromEntries(FIELD_STATUSES.map((s) => [s, 0])) as Record<FieldStatus, number>;
  let areaM2 = 0;
  for (const f of fields) {
    byLevel[f.maintenanceLevel] += 1;
    byStatus[f.status] += 1;
    areaM2 += f.areaM2;
  }
  return { total: fields.length, areaM2, byLevel, byStatus };
}

/** The same tally for each district id. */
export function tallyByDistrict<T extends Tallied & { districtId: number }>(fields: readonly T[]): Map<number, FieldTally> {
  const groups = new Map<number, T[]>();
  for (const f of fields) {
    const group = groups.get(f.districtId);
    if (group) group.push(f);
    else groups.set(f.districtId, [f]);
  }
  return new Map([...groups].map(([id, group]) => [id, tallyFields(group)]));
}
