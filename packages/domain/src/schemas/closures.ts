import { z } from 'zod';
import { CLOSURE_REASONS, CLOSURE_WORK_CHOICES } from '../vocabulary.ts';
import { isoDateSchema, isoDateTimeSchema, versionSchema } from './common.ts';

/**
 * Closing or restricting a field (or changing the closure in force). `version` is the
 * field's. `work` says what becomes of its planned work; it is required when there is some.
 */
export const closeFieldSchema = z.object({
  version: versionSchema,
  status: z.enum(['restricted', 'closed'], { error: 'status must be restricted or closed' }),
  reason: z.enum(CLOSURE_REASONS, { error: `reason must be one of ${CLOSURE_REASONS.join(', ')}` }),
  /** Internal: shown to the department, never on the public board. */
  note: z.string().trim().max(500, 'keep the note under 500 characters').default(''),
  /** When it started; now when left out. */
  fromAt: isoDateTimeSchema.optional(),
  /** The day the field is expected to reopen; null when nobody knows yet. */
  expectedReopenOn: isoDateSchema.nullable().default(null),
  work: z.enum(CLOSURE_WORK_CHOICES, { error: `choose what to do with the planned work: ${CLOSURE_WORK_CHOICES.join(', ')}` }).optional(),
});
export type CloseFieldInput = z.infer<typeof closeFieldSchema>;

export const reopenFieldSchema = z.object({
  version: versionSchema,
  note: z.string().trim().max(500, 'keep the note under 500 characters').default(''),
});
export type ReopenFieldInput = z.infer<typeof reopenFieldSchema>;
