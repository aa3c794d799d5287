/**
 * What the week plan engine has to say about a week, as data: the engine returns these and
 * the words are chosen here, in one place, for whoever shows them.
 */
import { WORK_TASK_LABELS } from '../vocabulary.ts';
import type { WorkTask } from '../vocabulary.ts';

export type WeekWarning =
  /** The field is retired: nothing is planned for it. */
  | { code: 'field_retired'; fieldId: number }
  /** The station's weather starts after the week (`date`: the week's Sunday): only field checks are planned. */
  | { code: 'no_weather_before_week'; fieldId: number; date: string }
  /** The field is closed: only its field check is planned. */
  | { code: 'field_closed'; fieldId: number }
  /** Weather on file ends on `date`: growth for the week's last `days` days is projected. */
  | { code: 'weather_projected'; fieldId: number; date: string; days: number }
  /** No mowing on record (`date` null), or the last one (`date`) falls after the week began: the one-third rule is assumed kept. */
  | { code: 'mowing_assumed'; fieldId: number; date: string | null }
  /** `fields` fields have no station with weather: only their hand-made work is shown. */
  | { code: 'no_station'; fields: number }
  /** No crew of the district has working days. */
  | { code: 'no_crew' }
  /** A task on a field lands after its latest date (`date`): the crew works no day before it. */
  | { code: 'due_date_missed'; fieldId: number; date: string; task: WorkTask }
  /** No working day is left before the booking on `date`: its lines are painted on the day itself. */
  | { code: 'paint_on_event_day'; fieldId: number; date: string; eventTitle: string }
  /** A cultural task is due but the turf grows too little this week (mean GP `gp` below `needs`) to recover: it waits. */
  | { code: 'cultural_waits_growth'; fieldId: number; task: WorkTask; gp: number; needs: number }
  /** A cultural task is due but every working day left in the week is a booking or the day before one. */
  | { code: 'cultural_no_day'; fieldId: number; task: WorkTask }
  /** Work due on `date` does not fit the crew's hours that day (`hours` planned of `available`) and no other crew has room. */
  | { code: 'crew_day_over'; crewId: number; date: string; hours: number; available: number };

/** The warnings a district's week shows from its fields' plans (the others explain one field only). */
export const DISTRICT_WEEK_WARNINGS: ReadonlySet<WeekWarning['code']> = new Set(['no_weather_before_week', 'weather_projected', 'paint_on_event_day', 'cultural_no_day']);

/**
 * The plain-language sentence of a warning, as the district week shows it. `fieldName` names
 * a field by id (else "field <id>").
 */
export function weekWarningText(w: WeekWarning, fieldName: (id: number) => string | undefined = () => undefined, crewName: (id: number) => string | undefined = () => undefined): string {
  const name = (id: number) => fieldName(id) ?? `field ${id}`;
  const hm = (h: number) => `${Math.floor(Math.round(h * 60) / 60)}:${String(Math.round(h * 60) % 60).padStart(2, '0')}`;
  switch (w.code) {
    case 'field_retired':
      return 'The field is retired: nothing is planned for it.';
    case 'no_weather_before_week':
      return 'Some fields have no weather before the week: only field checks are planned for this field.';
    case 'field_closed':
      return 'The field is closed: only its field check is planned.';
    case 'weather_projected':
      return `Weather on file ends ${w.date}: growth for the last ${w.days} day(s) of the week is projected from the week before.`;
    case 'mowing_assumed':
      return w.date
        ? `The last mowing on record (${w.date}) is after this week began: the plan assumes the one-third rule was kept up to the week.`
        : 'No mowing on record: the plan assumes the field was mowed as the one-third rule asked before this week.';
    case 'no_station':
      return `${w.fields} field(s) have no weather station with data: only their hand-made work is shown. Add weather first.`;
    case 'no_crew':
      return 'No crew with working days in this district: every order is left unassigned.';
    case 'due_date_missed':
      return `${w.task === 'mow' ? 'Mowing' : 'Work'} on ${name(w.fieldId)} falls after ${w.date}: no working day of the crew before it.`;
    case 'crew_day_over':
      return `${crewName(w.crewId) ?? `Crew ${w.crewId}`} has ${hm(w.hours)} h planned on ${w.date} for ${hm(w.available)} h: work due that day does not fit and no other crew has room. Move work by hand or add hours.`;
    case 'paint_on_event_day':
      return `Lines on ${name(w.fieldId)} for ${w.eventTitle} are painted on the day itself (${w.date}): no working day is left before it. Paint early and keep players off until the paint is dry.`;
    case 'cultural_waits_growth':
      return `${WORK_TASK_LABELS[w.task]} on ${name(w.fieldId)} is due but waits: the turf grows too little this week (growth potential ${w.gp.toFixed(2)}, needs ${w.needs.toFixed(2)}) to recover.`;
    case 'cultural_no_day':
      return `${WORK_TASK_LABELS[w.task]} on ${name(w.fieldId)} is due but every working day left this week is a booking or the day before one: it waits for next week.`;
  }
}
