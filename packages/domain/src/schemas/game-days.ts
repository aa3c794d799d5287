/** Bodies of game-day preparation. */
import { z } from 'zod';
import { GAME_DAY_STEPS } from '../engine/game-day.ts';
import { STRIPE_PATTERNS } from '../vocabulary.ts';
import { colourantSchema } from './work.ts';
import { idSchema, isoDateSchema } from './common.ts';

/**
 * A game-day preparation for one booking: which steps (in any order; the work goes in the
 * working order), the colourant when that step is chosen, and the mowing pattern (absent:
 * the field's own pattern; null: plain mowing).
 */
export const createGameDaySchema = z
  .object({
    steps: z
      .array(z.enum(GAME_DAY_STEPS, { error: `a step is one of ${GAME_DAY_STEPS.join(', ')}` }))
      .min(1, 'choose at least one step')
      .max(GAME_DAY_STEPS.length)
      .refine((s) => new Set(s).size === s.length, 'each step once'),
    colourant: colourantSchema.nullable().default(null),
    pattern: z.enum(STRIPE_PATTERNS, { error: `pattern must be one of ${STRIPE_PATTERNS.join(', ')}, or null for none` }).nullable().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.steps.includes('colourant') && !v.colourant) ctx.addIssue({ code: 'custom', path: ['colourant'], message: 'the colourant step needs the product, the rate and the area' });
    if (!v.steps.includes('colourant') && v.colourant) ctx.addIssue({ code: 'custom', path: ['colourant'], message: 'choose the colourant step to colour the turf' });
  });
export type CreateGameDayInput = z.infer<typeof createGameDaySchema>;

/** `GET /api/game-days`: the preparations of events in a date range (default: from today, 60 days). */
export const gameDayListSchema = z.object({
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
  fieldId: idSchema.optional(),
  districtId: idSchema.optional(),
});
