/** Bodies and queries of the week plan, work orders, crew reports and field events. */
import { z } from 'zod';
import { FIELD_EVENT_KINDS, WORK_REPORTS, WORK_TASKS } from '../vocabulary.ts';
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

export const createWorkOrderSchema = z.object({
  fieldId: idSchema,
  task: z.enum(WORK_TASKS, { error: `task must be one of ${WORK_TASKS.join(', ')}` }),
  plannedDate: isoDate,
  crewId: idSchema.nullable().default(null),
  equipmentId: idSchema.nullable().default(null),
  plannedHours,
  notes: z.string().max(2000).default(''),
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
