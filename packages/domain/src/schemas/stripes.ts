import { z } from 'zod';
import { STRIPE_PATTERNS } from '../vocabulary.ts';
import { idSchema, versionSchema } from './common.ts';

/**
 * Setting a field's stripe pattern. `pattern: null` clears it. `mowerId` is a mower of the
 * field's district, or null for the one the week plan picks. `version` is the stripe row's
 * (null when the field has none yet).
 */
export const setFieldStripesSchema = z.object({
  pattern: z.enum(STRIPE_PATTERNS, { error: `pattern must be one of ${STRIPE_PATTERNS.join(', ')}, or null for none` }).nullable(),
  mowerId: idSchema.nullable().default(null),
  version: versionSchema.nullable(),
});
export type SetFieldStripesInput = z.infer<typeof setFieldStripesSchema>;
