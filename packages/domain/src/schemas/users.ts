import { z } from 'zod';
import { ROLES, UNIT_SYSTEMS } from '../vocabulary.ts';
import { idSchema, versionSchema } from './common.ts';

const scopeFields = {
  role: z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` }),
  districtId: idSchema.nullable().optional(),
  crewId: idSchema.nullable().optional(),
  siteIds: z.array(idSchema).max(50).optional(),
};

export interface UserScope {
  role: string;
  districtId?: number | null | undefined;
  crewId?: number | null | undefined;
  siteIds?: number[] | undefined;
}

/** What is missing from a role's scope: foremen need a district, crew leads a crew, partners at least one site. */
export function scopeIssues(v: UserScope): { path: 'districtId' | 'crewId' | 'siteIds'; message: string }[] {
  const issues: { path: 'districtId' | 'crewId' | 'siteIds'; message: string }[] = [];
  if (v.role === 'foreman' && !v.districtId) issues.push({ path: 'districtId', message: 'a foreman must be bound to a district' });
  if (v.role === 'crew' && !v.crewId) issues.push({ path: 'crewId', message: 'a crew lead must be bound to a crew' });
  if (v.role === 'partner' && !(v.siteIds && v.siteIds.length > 0)) issues.push({ path: 'siteIds', message: 'a partner must be linked to at least one site' });
  return issues;
}

function checkScope(v: UserScope, ctx: z.RefinementCtx) {
  for (const issue of scopeIssues(v)) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message });
}

export const inviteUserSchema = z
  .object({
    email: z.email('enter a valid e-mail address').trim().toLowerCase(),
    name: z.string().trim().min(2, 'enter the person’s name').max(120),
    ...scopeFields,
  })
  .superRefine(checkScope);
export type InviteUserInput = z.infer<typeof inviteUserSchema>;

/**
 * A change to an account. Without `role` the stored role and any scope attribute not sent
 * stay as they are; with `role` the scope is the one sent. Role, scope and `active` are the
 * administrator's to change (the API checks each attribute sent against the abilities).
 */
export const updateUserSchema = z
  .object({
    version: versionSchema,
    name: z.string().trim().min(2).max(120).optional(),
    units: z.enum(UNIT_SYSTEMS).optional(),
    active: z.boolean().optional(),
    ...scopeFields,
    role: scopeFields.role.optional(),
  })
  .superRefine((v, ctx) => {
    if (v.role !== undefined) checkScope({ ...v, role: v.role }, ctx);
  });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const updateProfileSchema = z.object({
  version: versionSchema,
  name: z.string().trim().min(2).max(120).optional(),
  units: z.enum(UNIT_SYSTEMS).optional(),
});
