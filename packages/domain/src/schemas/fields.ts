import { z } from 'zod';
import { CLIPPINGS, FIELD_STATUSES, GRASSES, IRRIGATION_KINDS, LEVELS, ROOTZONES, SPORTS } from '../vocabulary.ts';
import { changeOf, idSchema, polygonSchema } from './common.ts';

const oneOf = <T extends readonly [string, ...string[]]>(values: T, what: string) =>
  z.enum(values, { error: `${what} must be one of ${values.join(', ')}` });

const fieldFields = {
  siteId: idSchema,
  name: z.string().trim().min(1, 'enter a field name').max(120),
  sport: oneOf(SPORTS, 'sport'),
  grass: oneOf(GRASSES, 'grass'),
  rootzone: oneOf(ROOTZONES, 'rootzone'),
  irrigation: oneOf(IRRIGATION_KINDS, 'irrigation'),
  maintenanceLevel: z.union(LEVELS.map((l) => z.literal(l)) as [z.ZodLiteral<1>, z.ZodLiteral<2>, z.ZodLiteral<3>, z.ZodLiteral<4>], {
    error: 'maintenance level must be 1, 2, 3 or 4',
  }),
  /** Height of cut override in millimetres; null follows the Standards. */
  hocOverrideMm: z.number().min(3, 'a height of cut below 3 mm is not a turf height').max(150, 'a height of cut above 150 mm is not mowing').nullable(),
  clippings: oneOf(CLIPPINGS, 'clippings'),
  status: oneOf(FIELD_STATUSES, 'status'),
  statusNote: z.string().max(500),
  geometry: polygonSchema,
  weeklyUseHours: z.number().min(0).max(168, 'a week has 168 hours'),
};

// Defaults belong to creation only: an update that leaves a key out leaves it as it is.
export const createFieldSchema = z.object({
  ...fieldFields,
  hocOverrideMm: fieldFields.hocOverrideMm.default(null),
  status: fieldFields.status.default('open'),
  statusNote: fieldFields.statusNote.default(''),
  weeklyUseHours: fieldFields.weeklyUseHours.default(0),
});
export type CreateFieldInput = z.infer<typeof createFieldSchema>;

export const updateFieldSchema = changeOf(fieldFields);
export type UpdateFieldInput = z.infer<typeof updateFieldSchema>;
