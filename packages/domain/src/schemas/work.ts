/** Bodies and queries of the week plan, work orders, crew reports and field events. */
import { z } from 'zod';
import { FIELD_EVENT_KINDS, HARDNESS_DEVICES, WORK_REPORTS, WORK_TASKS } from '../vocabulary.ts';
import { MAX_HARDNESS_READINGS, WEAR_AREAS } from '../engine/field-check.ts';
import { changeOf, idSchema, isoDateSchema as isoDate, isoDateTimeSchema, versionSchema } from './common.ts';
const hours = z.number({ error: 'hours must be a number' }).min(0, 'hours cannot be negative').max(24, 'more than 24 hours in a day is not possible');
const plannedHours = z.number({ error: 'planned hours must be a number' }).positive('planned hours must be more than 0').max(24, 'more than 24 hours in a day is not possible');

/** The week of a district: weekStart is the Monday. */
export const weekQuerySchema = z.object({
  districtId: idSchema,
  weekStart: isoDate.refine((d) => new Date(`${d}T00:00:00Z`).getUTCDay() === 1, 'a week starts on a Monday'),
});
export type WeekQuery = z.infer<typeof weekQuerySchema>;

export const generateWeekSchema = weekQuerySchema.extend({
  /** Only show what would change; write nothing. */
  dryRun: z.boolean().default(false),
});
export type GenerateWeekInput = z.infer<typeof generateWeekSchema>;

/** A rain-out: a day's open work of one crew (or of the whole district) cancelled, with the reason the crews see. */
export const rainOutSchema = z.object({
  districtId: idSchema,
  date: isoDate,
  /** null: every crew of the district. */
  crewId: idSchema.nullable().default(null),
  reason: z.string().trim().min(3, 'say why the work is cancelled (e.g. thunderstorms, fields waterlogged)').max(300, 'keep the reason under 300 characters'),
});
export type RainOutInput = z.infer<typeof rainOutSchema>;

/**
 * A colourant (turf dye or pigment) application: the product, the label's rate in mL of
 * product per m², and the area coloured in m².
 */
export const colourantSchema = z.object({
  product: z.string({ error: 'name the colourant product' }).trim().min(2, 'name the colourant product').max(120, 'keep the product name under 120 characters'),
  rateMlPerM2: z.number({ error: 'the rate must be a number' }).positive('the rate must be more than 0').max(100, 'a rate above 100 mL/m² is not a colourant rate; check the label'),
  areaM2: z.number({ error: 'the area must be a number' }).positive('the area must be more than 0').max(500_000, 'an area above 50 ha is not one field'),
});
export type ColourantInput = z.infer<typeof colourantSchema>;

export const createWorkOrderSchema = z
  .object({
    fieldId: idSchema,
    task: z.enum(WORK_TASKS, { error: `task must be one of ${WORK_TASKS.join(', ')}` }),
    plannedDate: isoDate,
    crewId: idSchema.nullable().default(null),
    equipmentId: idSchema.nullable().default(null),
    plannedHours,
    notes: z.string().max(2000).default(''),
    /** Required for a colourant job, refused on any other. */
    colourant: colourantSchema.nullable().default(null),
  })
  .superRefine((v, ctx) => {
    if (v.task === 'colourant' && !v.colourant) ctx.addIssue({ code: 'custom', path: ['colourant'], message: 'a colourant job needs the product, the rate and the area' });
    if (v.task !== 'colourant' && v.colourant) ctx.addIssue({ code: 'custom', path: ['colourant'], message: 'only a colourant job takes a colourant' });
  });
export type CreateWorkOrderInput = z.infer<typeof createWorkOrderSchema>;

/** A foreman's change: assign, move, re-time. Any change pins the order against re-generation. */
export const updateWorkOrderSchema = changeOf({
  plannedDate: isoDate,
  crewId: idSchema.nullable(),
  equipmentId: idSchema.nullable(),
  plannedHours,
  notes: z.string().max(2000),
  pinned: z.boolean(),
});
export type UpdateWorkOrderInput = z.infer<typeof updateWorkOrderSchema>;

/** A crew's report from the field; `clientRef` makes a retried submission count once. */
export const workReportSchema = z
  .object({
    status: z.enum(WORK_REPORTS, { error: `status must be one of ${WORK_REPORTS.join(', ')}` }),
    actualHours: hours.nullable().default(null),
    note: z.string().trim().max(2000, 'keep the note under 2,000 characters').default(''),
    clientRef: z.string().trim().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'a client reference uses letters, digits, - and _').optional(),
    reportedAt: isoDateTimeSchema.optional(),
    version: versionSchema.optional(),
    /** A sharpening job done: the machine's hour meter reading at the sharpening, h (default: the meter as the portal knows it). */
    hourMeterH: z.number({ error: 'the hour meter reading must be a number' }).min(0, 'an hour meter reading cannot be negative').max(100_000, 'an hour meter reading is under 100,000 h').optional(),
  })
  .superRefine((v, ctx) => {
    if (v.status === 'done' && v.actualHours === null) ctx.addIssue({ code: 'custom', path: ['actualHours'], message: 'enter the hours the job took' });
    if (v.status === 'skipped' && v.note === '') ctx.addIssue({ code: 'custom', path: ['note'], message: 'say why the job was skipped' });
  });
export type WorkReportInput = z.infer<typeof workReportSchema>;

/** `POST /api/work-orders/:id/reopen`: why a finished job is opened again. */
export const reopenSchema = z.object({
  reason: z.string().trim().max(500, 'keep the reason under 500 characters').default(''),
  version: versionSchema.optional(),
});
export type ReopenInput = z.infer<typeof reopenSchema>;

/** `GET /api/fields/:id/work`: which page of the field's work history. */
export const pageQuerySchema = z.object({
  page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'pages start at 1').max(10_000).default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1).max(50, 'ask for at most 50 per page').default(10),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

const eventFields = {
  fieldId: idSchema,
  kind: z.enum(FIELD_EVENT_KINDS, { error: `kind must be one of ${FIELD_EVENT_KINDS.join(', ')}` }),
  title: z.string().trim().min(2, 'enter a title').max(120),
  startsOn: isoDate,
  startTime: z
    .string()
    .regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'use a time as HH:MM (24 h)')
    .nullable(),
  notes: z.string().max(2000),
};
export const createFieldEventSchema = z.object({ ...eventFields, startTime: eventFields.startTime.default(null), notes: eventFields.notes.default('') });
export type CreateFieldEventInput = z.infer<typeof createFieldEventSchema>;
export const updateFieldEventSchema = changeOf(eventFields);
export type UpdateFieldEventInput = z.infer<typeof updateFieldEventSchema>;

export const dateRangeQuerySchema = z
  .object({ districtId: idSchema.optional(), from: isoDate, to: isoDate })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'the end date is before the start date' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 <= 400, { path: ['to'], message: 'ask for at most 400 days at a time' });
export type DateRangeQuery = z.infer<typeof dateRangeQuerySchema>;

const pct = (what: string) => z.number({ error: `enter the ${what} (%)` }).min(0, `${what} cannot be below 0 %`).max(100, `${what} cannot pass 100 %`);
const rating = (what: string) => z.number({ error: `rate the ${what} 1–5` }).int(`rate the ${what} in whole steps`).min(1, `rate the ${what} 1–5`).max(5, `rate the ${what} 1–5`);

/** A field check as a crew (or staff) records it; the server scores it. */
export const fieldCheckSchema = z
  .object({
    turfCoverPct: pct('turf cover'),
    weedsPct: pct('weed cover'),
    bareWornPct: pct('bare/worn area'),
    bareAreas: z.array(z.enum(WEAR_AREAS, { error: `a worn area is one of ${WEAR_AREAS.join(', ')}` })).max(WEAR_AREAS.length).default([]),
    heightMm: z.number({ error: 'enter the measured grass height' }).positive('the height must be more than 0').max(500, 'a height above 500 mm is not a mown field'),
    hardnessReadingsG: z.array(z.number({ error: 'a reading is a number' }).min(0, 'a reading cannot be negative').max(1000, 'a reading above 1,000 G is not a field')).max(MAX_HARDNESS_READINGS, `at most ${MAX_HARDNESS_READINGS} readings`).default([]),
    hardnessDevice: z.enum(HARDNESS_DEVICES, { error: `the tester is one of ${HARDNESS_DEVICES.join(', ')}` }).nullable().default(null),
    evenness: rating('evenness'),
    divots: rating('divots'),
    tornLeafTips: z.boolean().default(false),
    notes: z.string().trim().max(2000, 'keep the notes under 2,000 characters').default(''),
    /** Hours the check took, for the work order it logs. */
    actualHours: hours.nullable().default(null),
  })
  .superRefine((v, ctx) => {
    if (v.turfCoverPct + v.weedsPct + v.bareWornPct > 100 + 1e-9) ctx.addIssue({ code: 'custom', path: ['bareWornPct'], message: 'turf, weeds and bare/worn share one surface: together at most 100 %' });
    if (v.hardnessReadingsG.length > 0 && v.hardnessDevice === null) ctx.addIssue({ code: 'custom', path: ['hardnessDevice'], message: 'name the tester the readings were taken with' });
  });
export type FieldCheckBody = z.infer<typeof fieldCheckSchema>;

/** Work orders an application can be recorded on: something was put on the field. */
export const APPLICATION_TASKS = ['feed', 'overseed', 'topdress', 'weed_control'] as const;
export type ApplicationTask = (typeof APPLICATION_TASKS)[number];
/** Rates as product labels state them (metric and US). */
export const APPLICATION_RATE_UNITS = ['g/m²', 'kg/ha', 'L/ha', 'mL/100 m²', 'lb/1000 ft²', 'oz/1000 ft²', 'fl oz/1000 ft²', 'mm depth'] as const;
export type ApplicationRateUnit = (typeof APPLICATION_RATE_UNITS)[number];

/** `POST /api/work-orders/:id/application`: what was applied. A pesticide (weed control) names the applicator's licence. */
export const applicationSchema = z
  .object({
    product: z.string({ error: 'enter the product as named on its label' }).trim().min(1, 'enter the product as named on its label').max(120, 'keep the product name under 120 characters'),
    rate: z.number({ error: 'enter the rate applied' }).positive('the rate must be more than 0').max(100_000, 'that rate is not a field application'),
    rateUnit: z.enum(APPLICATION_RATE_UNITS, { error: `the rate unit is one of ${APPLICATION_RATE_UNITS.join(', ')}` }),
    areaM2: z.number({ error: 'enter the area treated' }).positive('the area must be more than 0').max(1_000_000, 'an area above 100 ha is not one field'),
    appliedOn: isoDate,
    applicator: z.string({ error: 'enter who applied it' }).trim().min(1, 'enter who applied it').max(80, 'keep the name under 80 characters'),
    licenceNumber: z.string().trim().max(40, 'keep the licence number under 40 characters').nullable().default(null),
    notes: z.string().trim().max(2000, 'keep the notes under 2,000 characters').default(''),
  })
  .strict();
export type ApplicationInput = z.infer<typeof applicationSchema>;
/** `POST /api/calendar-feeds`: a partner sends nothing; a foreman names the crew. */
export const createCalendarFeedSchema = z.object({ crewId: idSchema.optional() }).strict();
export type CreateCalendarFeedInput = z.infer<typeof createCalendarFeedSchema>;

/** `GET /api/calendar/:token.ics`: the secret as it was made (base64url, 43 characters). */
export const calendarTokenParamsSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'not a calendar address') });
