/** Edits to one maintenance level of the Standards, and the query of a field's needs. */
import { z } from 'zod';
import { GRASSES, SPORTS } from '../vocabulary.ts';
import { AERATION_METHODS, CULTURAL_TASKS } from '../engine/cultural.ts';
import { isoDateSchema, versionSchema } from './common.ts';

/** A height of cut in mm as the Standards accept it. */
export const standardHocMmSchema = z
  .number({ error: 'enter a height of cut in mm' })
  .min(3, 'a height of cut below 3 mm is not a turf height')
  .max(150, 'a height of cut above 150 mm is not mowing');

const share = (what: string) => z.number({ error: `enter ${what} as a share from 0 to 1` }).min(0, `${what} cannot be below 0`).max(1, `${what} cannot be above 1 (100 %)`);

const seasonHoc = z.object({ cool: standardHocMmSchema, warm: standardHocMmSchema }).partial().strict();

const month = (end: string) =>
  z
    .number({ error: `enter the ${end} month (1–12)` })
    .int(`the ${end} month is a whole number 1–12`)
    .min(1, `the ${end} month is 1–12`)
    .max(12, `the ${end} month is 1–12`);

/** Months of a window, both ends included; a window does not run over the new year. */
export const monthWindowSchema = z
  .object({ fromMonth: month('first'), toMonth: month('last') })
  .strict()
  .refine((w) => w.fromMonth <= w.toMonth, { message: 'the window ends before it begins: the last month must be on or after the first', path: ['toMonth'] });

/** One cultural task of a level: times a season and its months for cool- and warm-season grass. */
export const culturalProgramSchema = z
  .object({
    timesPerSeason: z.number({ error: 'enter how many times a season' }).int('use a whole number of times').min(0, 'times a season cannot be negative').max(12, 'more than 12 times a season is not a program'),
    cool: monthWindowSchema,
    warm: monthWindowSchema,
    method: z.enum(AERATION_METHODS, { error: `aeration is ${AERATION_METHODS.join(' or ')}` }).optional(),
  })
  .strict();

/** The editable parts of a level (all optional: send only what changes). */
export const levelStandardChangesSchema = z
  .object({
    name: z.string().trim().min(1, 'enter a name for the level').max(40, 'keep the level name under 40 characters'),
    hocMm: z.partialRecord(z.enum(SPORTS, { error: `sport must be one of ${SPORTS.join(', ')}` }), seasonHoc),
    /** A grass's HOC for every sport at this level; null removes it. */
    hocByGrassMm: z.partialRecord(z.enum(GRASSES, { error: `grass must be one of ${GRASSES.join(', ')}` }), standardHocMmSchema.nullable()),
    minMowingsPerWeek: z.number({ error: 'enter mowings per week' }).min(0, 'mowings per week cannot be negative').max(14, 'more than 14 mowings a week is not a plan'),
    maxMowingIntervalDays: z.number({ error: 'enter the longest interval in days' }).int('use whole days').min(1, 'the interval is at least 1 day').max(60, 'an interval above 60 days is not mowing to a level'),
    annualNShare: share('the feed share'),
    irrigationShareOfEtc: share('the irrigation share').nullable(),
    reducedKc: z.boolean({ error: 'reduced Kc is yes or no' }),
    lineRepaintDays: z.number({ error: 'enter the repaint interval in days' }).int('use whole days').min(1, 'repaint at most daily').max(120, 'a repaint interval above 120 days is not a line plan').nullable(),
    fieldCheckDays: z.number({ error: 'enter the days between field checks' }).int('use whole days').min(1, 'check at most daily').max(365, 'check at least once a year'),
    targetScore: z.number({ error: 'enter a target surface score' }).min(0, 'the target score is 0–100').max(100, 'the target score is 0–100'),
    /** Cultural programs by task; a task sent replaces that task's program. */
    cultural: z.partialRecord(z.enum(CULTURAL_TASKS, { error: `cultural work is one of ${CULTURAL_TASKS.join(', ')}` }), culturalProgramSchema),
  })
  .partial()
  .strict();

export const updateLevelStandardSchema = levelStandardChangesSchema.extend({ version: versionSchema });
export type UpdateLevelStandardInput = z.infer<typeof updateLevelStandardSchema>;

export const levelParamSchema = z.object({
  level: z.coerce.number({ error: 'level must be 1, 2, 3 or 4' }).int('level must be 1, 2, 3 or 4').min(1, 'level must be 1, 2, 3 or 4').max(4, 'level must be 1, 2, 3 or 4'),
});

export const needsQuerySchema = z.object({ date: isoDateSchema.optional() });
