import type { Role } from '@swardwise/domain';

/** The editable part of a user in the invite and edit forms. */
export interface UserFormModel {
  name: string;
  email: string;
  role: Role;
  districtId: number | null;
  crewId: number | null;
  siteIds: number[];
}

export function emptyUserForm(): UserFormModel {
  return { name: '', email: '', role: 'foreman', districtId: null, crewId: null, siteIds: [] };
}

/**
 * The scope a role is bound by: a foreman by a district, a crew lead by a crew (and that
 * crew's district), a partner by sites; the others by nothing, so stale choices are dropped.
 */
export function scopeFor(model: UserFormModel, crewDistrict: (crewId: number) => number | null) {
  switch (model.role) {
    case 'foreman':
      return { districtId: model.districtId, crewId: null, siteIds: [] };
    case 'crew':
      return { districtId: model.crewId ? crewDistrict(model.crewId) : null, crewId: model.crewId, siteIds: [] };
    case 'partner':
      return { districtId: null, crewId: null, siteIds: model.siteIds };
    default:
      return { districtId: null, crewId: null, siteIds: [] };
  }
}
