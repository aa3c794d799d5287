import { z } from 'zod';
import { isoDateSchema as isoDate, idSchema } from './common.ts';
import { isoToDayNumber } from '../engine/dates.ts';

export const COMPARE_PERIODS = ['season', 'last12', 'range'] as const;
export type ComparePeriod = (typeof COMPARE_PERIODS)[number];

/** The longest date range compared at once: three seasons. */
export const COMPARE_MAX_DAYS = 3 * 366;

/**
 * Query of `GET /api/compare/sites` (and its CSV): the period (this season by the department's
 * clock, the last 12 months, or a date range `from`–`to`) and, for the head, one district.
 */
export const compareQuerySchema = z
  .object({
    period: z.enum(COMPARE_PERIODS, { error: `the period is one of ${COMPARE_PERIODS.join(', ')}` }).default('season'),
    from: isoDate.optional(),
    to: isoDate.optional(),
    districtId: idSchema.optional(),
  })
  .strict()
  .superRefine((q, ctx) => {
    if (q.period !== 'range') {
      if (q.from !== undefined || q.to !== undefined) ctx.addIssue({ code: 'custom', path: ['from'], message: 'a from and to date go with period=range' });
      return;
    }
    if (q.from === undefined) ctx.addIssue({ code: 'custom', path: ['from'], message: 'a date range needs a from date' });
    if (q.to === undefined) ctx.addIssue({ code: 'custom', path: ['to'], message: 'a date range needs a to date' });
    if (q.from === undefined || q.to === undefined) return;
    const days = isoToDayNumber(q.to) - isoToDayNumber(q.from);
    if (days < 0) ctx.addIssue({ code: 'custom', path: ['to'], message: 'the to date is before the from date' });
    else if (days >= COMPARE_MAX_DAYS) ctx.addIssue({ code: 'custom', path: ['to'], message: 'compare at most three seasons at once' });
  });
export type CompareQuery = z.infer<typeof compareQuerySchema>;
