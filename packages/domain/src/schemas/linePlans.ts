import { z } from 'zod';
import { LINE_LAYOUT_IDS, type LineLayout } from '../engine/lines.ts';
import { dimensionProblem, MAX_SEASON_SHIFT_M } from '../engine/linePlans.ts';
import { idSchema, versionSchema } from './common.ts';

/** Most layouts one field carries (e.g. a full pitch with youth fields across it). */
export const MAX_LINE_LAYOUTS = 6;

const metres = (what: string, limit: number) => z.number({ error: `${what} must be a number of metres` }).min(-limit, `${what} must be at least −${limit} m`).max(limit, `${what} must be at most ${limit} m`);
const monthDay = z.string().regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be a month and day, MM-DD');

const layoutSchema = z
  .object({
    layout: z.enum(LINE_LAYOUT_IDS as [LineLayout, ...LineLayout[]], { error: `layout must be one of ${LINE_LAYOUT_IDS.join(', ')}` }),
    lengthM: z.number({ error: 'length must be a number of metres' }).nullable().default(null),
    widthM: z.number({ error: 'width must be a number of metres' }).nullable().default(null),
    colour: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'colour must be #rrggbb'),
    alongM: metres('offset along the field', 100).default(0),
    acrossM: metres('offset across the field', 100).default(0),
    rotationDeg: z.number({ error: 'turn must be a number of degrees' }).min(0, 'turn must be 0–359°').lt(360, 'turn must be 0–359°').default(0),
  })
  .superRefine((l, ctx) => {
    // Out-of-range sizes are refused with the governing body's range in the message.
    for (const key of ['lengthM', 'widthM'] as const) {
      const v = l[key];
      if (v === null) continue;
      const problem = dimensionProblem(l.layout, key, v);
      if (problem) ctx.addIssue({ code: 'custom', path: [key], message: problem });
    }
  });

const shiftSchema = z.object({ alongM: metres('seasonal shift along', MAX_SEASON_SHIFT_M), acrossM: metres('seasonal shift across', MAX_SEASON_SHIFT_M) });

/**
 * Saving a field's line plan: its layouts, paint choices, marker, season window and the
 * seasonal shift of each season (key: the season's year). `version` is the plan row's (null
 * while the field has none).
 */
export const setFieldLinePlanSchema = z.object({
  layouts: z.array(layoutSchema).max(MAX_LINE_LAYOUTS, `at most ${MAX_LINE_LAYOUTS} layouts on one field`),
  paint: z.object({
    dilutionWaterPerPaint: z.number({ error: 'dilution must be a number' }).min(0, 'dilution must be 0–10 parts water').max(10, 'dilution must be 0–10 parts water'),
    coats: z.number().int('coats must be a whole number').min(1, 'coats must be 1–3').max(3, 'coats must be 1–3'),
    passes: z.number().int('passes must be a whole number').min(1, 'passes must be 1–4').max(4, 'passes must be 1–4'),
  }),
  markerId: idSchema.nullable().default(null),
  seasonStart: monthDay,
  seasonEnd: monthDay,
  shifts: z.record(z.string().regex(/^\d{4}$/, 'a season is a four-digit year'), shiftSchema).refine((r) => Object.keys(r).length <= 50, 'at most 50 seasons of shifts'),
  version: versionSchema.nullable(),
});
export type SetFieldLinePlanInput = z.infer<typeof setFieldLinePlanSchema>;
