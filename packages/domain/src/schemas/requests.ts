/** Partners' requests: filing, changing, the thread, and the foreman's decisions. */
import { z } from 'zod';
import { LINE_LAYOUT_IDS } from '../engine/lines.ts';
import { REQUEST_KINDS, REQUEST_STATES, WORK_TASKS } from '../vocabulary.ts';
import { idSchema, isoDateSchema, versionSchema } from './common.ts';

const description = z.string().trim().min(3, 'say what you need (at least a few words)').max(2000, 'keep the description under 2,000 characters');
const layout = z.enum(LINE_LAYOUT_IDS as [string, ...string[]], { error: `layout must be one of ${LINE_LAYOUT_IDS.join(', ')}` });
const startTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'use a time as HH:MM (24 h)');

/** A game request needs its date and layout; the other kinds have neither. */
function gameNeeds(v: { kind?: string; gameOn?: string | null; layout?: string | null }, ctx: z.RefinementCtx) {
  if (v.kind !== 'game_lines') return;
  if (!v.gameOn) ctx.addIssue({ code: 'custom', path: ['gameOn'], message: 'give the date of the game' });
  if (!v.layout) ctx.addIssue({ code: 'custom', path: ['layout'], message: 'choose the layout to paint' });
}

export const createFieldRequestSchema = z
  .object({
    fieldId: idSchema,
    kind: z.enum(REQUEST_KINDS, { error: `kind must be one of ${REQUEST_KINDS.join(', ')}` }),
    /** The day of the game (game_lines only). */
    gameOn: isoDateSchema.nullable().default(null),
    startTime: startTime.nullable().default(null),
    layout: layout.nullable().default(null),
    description,
  })
  .superRefine(gameNeeds);
export type CreateFieldRequestInput = z.infer<typeof createFieldRequestSchema>;

/** A partner's change of what they filed, while it is still requested. The kind and the field stay. */
export const updateFieldRequestSchema = z.object({
  version: versionSchema,
  gameOn: isoDateSchema.nullable().optional(),
  startTime: startTime.nullable().optional(),
  layout: layout.nullable().optional(),
  description: description.optional(),
});
export type UpdateFieldRequestInput = z.infer<typeof updateFieldRequestSchema>;

/** One message of a request's thread (the foreman's answer, the partner's reply). */
export const requestMessageSchema = z.object({
  body: z.string().trim().min(1, 'write a message').max(2000, 'keep the message under 2,000 characters'),
});
export type RequestMessageInput = z.infer<typeof requestMessageSchema>;

/**
 * The foreman turns a request into work. A game request becomes a booking of the field on the
 * game's day, which the week plan paints lines before; any other kind needs `work`, the one
 * work order it becomes.
 */
export const scheduleFieldRequestSchema = z.object({
  version: versionSchema,
  note: z.string().trim().max(1000, 'keep the note under 1,000 characters').default(''),
  work: z
    .object({
      task: z.enum(WORK_TASKS, { error: `task must be one of ${WORK_TASKS.join(', ')}` }),
      plannedDate: isoDateSchema,
      crewId: idSchema.nullable().default(null),
      plannedHours: z.number({ error: 'planned hours must be a number' }).positive('planned hours must be more than 0').max(24, 'more than 24 hours in a day is not possible'),
    })
    .optional(),
});
export type ScheduleFieldRequestInput = z.infer<typeof scheduleFieldRequestSchema>;

export const declineFieldRequestSchema = z.object({
  version: versionSchema,
  reason: z.string().trim().min(3, 'say why the request is declined').max(1000, 'keep the reason under 1,000 characters'),
});
export type DeclineFieldRequestInput = z.infer<typeof declineFieldRequestSchema>;

export const closeFieldRequestSchema = z.object({
  version: versionSchema,
  note: z.string().trim().max(1000, 'keep the note under 1,000 characters').default(''),
});
export type CloseFieldRequestInput = z.infer<typeof closeFieldRequestSchema>;

export const requestListQuerySchema = z.object({
  state: z.enum(REQUEST_STATES, { error: `state must be one of ${REQUEST_STATES.join(', ')}` }).optional(),
});
export type RequestListQuery = z.infer<typeof requestListQuerySchema>;
