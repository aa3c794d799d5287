import { z } from 'zod';
import { ROLES, UNIT_SYSTEMS } from '../vocabulary.ts';
import { idSchema, versionSchema } from './common.ts';

const scopeFields = {
  role: z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` }),
  districtId: idSchema.nullable().optional(),
  crewId: idSchema.nullable().optional(),
  siteIds: z.array(idSchema).max(50).optional(),
};

/** Foremen need a district, crew leads a crew, partners at least one site. */
function checkScope(v: { role: string; districtId?: number | null; crewId?: number | null; siteIds?: number[] }, ctx: z.RefinementCtx) {
  if (v.role === 'foreman' && !v.districtId) {
    ctx.addIssue({ code: 'custom', path: ['districtId'], message: 'a foreman must be bound to a district' });
  }
  if (v.role === 'crew' && !v.crewId) {
    ctx.addIssue({ code: 'custom', path: ['crewId'], message: 'a crew lead must be bound to a crew' });
  }
  if (v.role === 'partner' && !(v.siteIds && v.siteIds.length > 0)) {
    ctx.addIssue({ code: 'custom', path: ['siteIds'], message: 'a partner must be linked to at least one site' });
  }
}

export const inviteUserSchema = z
  .object({
    email: z.email('enter a valid e-mail address').trim().toLowerCase(),
    name: z.string().trim().min(2, 'enter the person’s name').max(120),
    ...scopeFields,
  })
  .superRefine(checkScope);
export type InviteUserInput = z.infer<typeof inviteUserSchema>;

export const updateUserSchema = z
  .object({
    version: versionSchema,
    name: z.string().trim().min(2).max(120).optional(),
    active: z.boolean().optional(),
    ...scopeFields,
  })
  .superRefine(checkScope);
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const updateProfileSchema = z.object({
  version: versionSchema,
  name: z.string().trim().min(2).max(120).optional(),
  units: z.enum(UNIT_SYSTEMS).optional(),
});
