/** How a work order is named where crews and foremen read it (board card, Today, the crew sheet). */
import { WORK_TASK_LABELS, type WorkTask } from './vocabulary.ts';

/** A yard job: work at the district's yard on a machine (blade sharpening), on no field. */
export function isYardJob(o: { fieldId: number | null }): boolean {
  return o.fieldId === null;
}

/** "Mow" for work on a field (the field is named beside it); "Sharpen blades — R-1 triplex reel" for a yard job. */
export function workTitle(o: { task: WorkTask; fieldId: number | null; equipmentName: string | null }): string {
  const task = WORK_TASK_LABELS[o.task];
  return isYardJob(o) ? `${task} \u2014 ${o.equipmentName ?? 'machine removed'}` : task;
}

/** "Mow · Field 2" or "Sharpen blades — R-1 triplex reel" (a yard job names its machine, not a field). */
export function workLabel(o: { task: WorkTask; fieldId: number | null; fieldName: string; equipmentName: string | null }): string {
  return isYardJob(o) ? workTitle(o) : `${WORK_TASK_LABELS[o.task]} \u00b7 ${o.fieldName}`;
}
