import type { Action, AppAbility, Role, SubjectName } from '@swardwise/domain';
import { FIELD_STAFF, OFFICE } from '../../utils/roleGroups.ts';

export interface NavItem {
  key: 'overview' | 'district' | 'sites' | 'fields' | 'users' | 'audit' | 'today' | 'my-fields' | 'standards' | 'map' | 'imports' | 'crews' | 'equipment' | 'weather'
    | 'week' | 'records' | 'requests' | 'costs' | 'budget' | 'compare' | 'mail-outbox' | 'what-if';
  label: string;
  to: string;
  roles: readonly Role[];
  can: [Action, SubjectName];
}

/**
 * The side navigation. A link shows when the role's work includes the page and the
 * shared ability allows it, the same two checks the router guard makes.
 */
const NAV_ITEMS: NavItem[] = [
  { key: 'overview', label: 'Overview', to: '/overview', roles: ['admin', 'head'], can: ['read', 'District'] },
  { key: 'district', label: 'My district', to: '/district', roles: ['foreman'], can: ['read', 'District'] },
  { key: 'today', label: 'Today', to: '/today', roles: ['crew'], can: ['read', 'Crew'] },
  { key: 'my-fields', label: 'My fields', to: '/my-fields', roles: ['partner'], can: ['read', 'Field'] },
  { key: 'requests', label: 'Requests', to: '/requests', roles: [...OFFICE, 'partner'], can: ['read', 'Request'] },
  { key: 'sites', label: 'Sites', to: '/sites', roles: OFFICE, can: ['read', 'Site'] },
  { key: 'fields', label: 'Fields', to: '/fields', roles: FIELD_STAFF, can: ['read', 'Field'] },
  { key: 'map', label: 'Map', to: '/map', roles: [...FIELD_STAFF, 'partner'], can: ['read', 'Field'] },
  { key: 'crews', label: 'Crews', to: '/crews', roles: OFFICE, can: ['read', 'Crew'] },
  { key: 'equipment', label: 'Equipment', to: '/equipment', roles: OFFICE, can: ['read', 'Equipment'] },
  { key: 'weather', label: 'Weather', to: '/weather', roles: OFFICE, can: ['read', 'Weather'] },
  { key: 'standards', label: 'Standards', to: '/standards', roles: ['admin', 'head'], can: ['read', 'Standards'] },
  { key: 'costs', label: 'Costs and rates', to: '/costs', roles: OFFICE, can: ['read', 'CostSettings'] },
  { key: 'budget', label: 'Season budget', to: '/budget', roles: OFFICE, can: ['read', 'Budget'] },
  { key: 'what-if', label: 'What if', to: '/what-if', roles: OFFICE, can: ['read', 'Budget'] },
  { key: 'compare', label: 'Compare sites', to: '/compare', roles: OFFICE, can: ['read', 'SiteComparison'] },
  { key: 'week', label: 'Week plan', to: '/week', roles: OFFICE, can: ['read', 'WorkOrder'] },
  { key: 'records', label: 'Records', to: '/records', roles: OFFICE, can: ['read', 'WorkOrder'] },
  { key: 'imports', label: 'Imports', to: '/imports', roles: OFFICE, can: ['create', 'Import'] },
  { key: 'users', label: 'Users', to: '/admin/users', roles: ['admin'], can: ['create', 'User'] },
  { key: 'audit', label: 'Audit log', to: '/audit', roles: ['admin', 'head'], can: ['read', 'AuditEntry'] },
  { key: 'mail-outbox', label: 'Mail outbox', to: '/mail-outbox', roles: ['admin', 'head'], can: ['read', 'MailOutbox'] },
];

export function navItemsFor(role: Role, ability: AppAbility): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role) && ability.can(item.can[0], item.can[1]));
}
