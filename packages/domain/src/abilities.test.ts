import { describe, expect, test } from 'vitest';
import { asSubject, defineAbilityFor, districtScope, OWN_ACCOUNT_FIELDS, PERMISSION_FIELDS, type Action, type Actor, type SubjectName } from './abilities.ts';

const D1 = 1;
const D2 = 2;
const SITE_A = 10; // in D1
const SITE_B = 20; // in D2
const CREW_1 = 100; // in D1
const CREW_2 = 200; // in D2

const actors: Record<string, Actor> = {
  admin: { id: 1, role: 'admin', districtId: null, crewId: null, siteIds: [] },
  head: { id: 2, role: 'head', districtId: null, crewId: null, siteIds: [] },
  foreman: { id: 3, role: 'foreman', districtId: D1, crewId: null, siteIds: [] },
  crew: { id: 4, role: 'crew', districtId: D1, crewId: CREW_1, siteIds: [] },
  partner: { id: 5, role: 'partner', districtId: null, crewId: null, siteIds: [SITE_A] },
};

const own = { district: { id: D1 }, site: { id: SITE_A, districtId: D1 }, field: { id: 1000, siteId: SITE_A, districtId: D1 } };
const other = { district: { id: D2 }, site: { id: SITE_B, districtId: D2 }, field: { id: 2000, siteId: SITE_B, districtId: D2 } };

type Row = Record<string, number | number[] | null>;
type Case = [role: string, action: Action, subject: SubjectName, row: Row | null, allowed: boolean];

const cases: Case[] = [
  // Districts
  ['admin', 'read', 'District', other.district, true],
  ['head', 'read', 'District', other.district, true],
  ['head', 'update', 'District', own.district, false],
  ['foreman', 'read', 'District', own.district, true],
  ['foreman', 'read', 'District', other.district, false],
  ['crew', 'read', 'District', own.district, true],
  ['crew', 'read', 'District', other.district, false],
  ['partner', 'read', 'District', own.district, false],
  // Sites
  ['admin', 'delete', 'Site', other.site, true],
  ['head', 'read', 'Site', other.site, true],
  ['head', 'update', 'Site', other.site, true],
  ['head', 'delete', 'Site', other.site, false],
  ['foreman', 'read', 'Site', own.site, true],
  ['foreman', 'update', 'Site', own.site, true],
  ['foreman', 'create', 'Site', { districtId: D1 }, true],
  ['foreman', 'read', 'Site', other.site, false],
  ['foreman', 'update', 'Site', other.site, false],
  ['foreman', 'create', 'Site', { districtId: D2 }, false],
  ['crew', 'read', 'Site', own.site, true],
  ['crew', 'update', 'Site', own.site, false],
  ['crew', 'read', 'Site', other.site, false],
  ['partner', 'read', 'Site', own.site, true],
  ['partner', 'read', 'Site', other.site, false],
  ['partner', 'update', 'Site', own.site, false],
  // Fields
  ['admin', 'update', 'Field', other.field, true],
  ['head', 'update', 'Field', other.field, true],
  ['head', 'delete', 'Field', other.field, false],
  ['foreman', 'read', 'Field', own.field, true],
  ['foreman', 'update', 'Field', own.field, true],
  ['foreman', 'delete', 'Field', own.field, true],
  ['foreman', 'read', 'Field', other.field, false],
  ['foreman', 'update', 'Field', other.field, false],
  ['foreman', 'delete', 'Field', other.field, false],
  // A crew reads the fields of its own work (crews with work on the field), in its district.
  ['crew', 'read', 'Field', { ...own.field, crewIds: [CREW_1] }, true],
  ['crew', 'read', 'Field', { ...own.field, crewIds: [CREW_2, CREW_1] }, true],
  ['crew', 'read', 'Field', { ...own.field, crewIds: [CREW_2] }, false],
  ['crew', 'read', 'Field', own.field, false],
  ['crew', 'update', 'Field', { ...own.field, crewIds: [CREW_1] }, false],
  ['crew', 'read', 'Field', { ...other.field, crewIds: [CREW_1] }, false],
  ['partner', 'read', 'Field', own.field, true],
  ['partner', 'read', 'Field', other.field, false],
  ['partner', 'update', 'Field', own.field, false],
  // Crews
  ['foreman', 'update', 'Crew', { id: CREW_1, districtId: D1 }, true],
  ['foreman', 'update', 'Crew', { id: CREW_2, districtId: D2 }, false],
  ['crew', 'read', 'Crew', { id: CREW_1, districtId: D1 }, true],
  ['crew', 'read', 'Crew', { id: CREW_2, districtId: D2 }, false],
  ['crew', 'update', 'Crew', { id: CREW_1, districtId: D1 }, false],
  ['partner', 'read', 'Crew', { id: CREW_1, districtId: D1 }, false],
  // Work orders: a crew logs only its own work
  ['crew', 'log', 'WorkOrder', { crewId: CREW_1, districtId: D1, siteId: SITE_A }, true],
  ['crew', 'log', 'WorkOrder', { crewId: CREW_2, districtId: D2, siteId: SITE_B }, false],
  ['foreman', 'assign', 'WorkOrder', { crewId: CREW_1, districtId: D1 }, true],
  ['foreman', 'assign', 'WorkOrder', { crewId: CREW_2, districtId: D2 }, false],
  ['partner', 'read', 'WorkOrder', { siteId: SITE_A, districtId: D1 }, true],
  ['partner', 'read', 'WorkOrder', { siteId: SITE_B, districtId: D2 }, false],
  // Users
  ['admin', 'create', 'User', null, true],
  ['admin', 'manage', 'User', { id: 99 }, true],
  ['head', 'read', 'User', { id: 99 }, false],
  ['head', 'read', 'User', { id: 2 }, true],
  ['head', 'update', 'User', { id: 2 }, true],
  ['foreman', 'read', 'User', { id: 98, districtId: D1 }, true],
  ['foreman', 'read', 'User', { id: 97, districtId: D2 }, false],
  ['foreman', 'create', 'User', null, false],
  ['crew', 'read', 'User', { id: 98, districtId: D1 }, false],
  ['partner', 'update', 'User', { id: 5 }, true],
  ['partner', 'update', 'User', { id: 6 }, false],
  // Bookings: a partner changes only the bookings he made himself
  ['partner', 'create', 'FieldEvent', { siteId: SITE_A, districtId: D1 }, true],
  ['partner', 'read', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 3 }, true],
  ['partner', 'update', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 5 }, true],
  ['partner', 'delete', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 5 }, true],
  ['partner', 'update', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 3 }, false],
  ['partner', 'delete', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 3 }, false],
  ['partner', 'update', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 6 }, false],
  ['partner', 'delete', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 6 }, false],
  ['partner', 'update', 'FieldEvent', { siteId: SITE_A, districtId: D1 }, false],
  ['partner', 'update', 'FieldEvent', { siteId: SITE_B, districtId: D2, createdBy: 5 }, false],
  ['foreman', 'update', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 5 }, true],
  ['foreman', 'delete', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 5 }, true],
  ['crew', 'update', 'FieldEvent', { siteId: SITE_A, districtId: D1, createdBy: 4 }, false],
  // Closures: foremen of the district, the head and the administrator close and reopen; crews and partners read
  ['admin', 'create', 'FieldClosure', other.field, true],
  ['head', 'create', 'FieldClosure', other.field, true],
  ['foreman', 'create', 'FieldClosure', own.field, true],
  ['foreman', 'create', 'FieldClosure', other.field, false],
  ['foreman', 'read', 'FieldClosure', other.field, false],
  ['crew', 'read', 'FieldClosure', own.field, true],
  ['crew', 'create', 'FieldClosure', own.field, false],
  ['partner', 'read', 'FieldClosure', own.field, true],
  ['partner', 'read', 'FieldClosure', other.field, false],
  ['partner', 'create', 'FieldClosure', own.field, false],
  // Standards and settings: the head sets them
  ['head', 'update', 'Standards', null, true],
  ['foreman', 'read', 'Standards', null, true],
  ['foreman', 'update', 'Standards', null, false],
  ['partner', 'update', 'Standards', null, false],
  ['admin', 'update', 'Settings', null, true],
  // Audit log: readable by the right people, writable by nobody
  ['admin', 'read', 'AuditEntry', { districtId: D2 }, true],
  ['admin', 'update', 'AuditEntry', { districtId: D2 }, false],
  ['admin', 'delete', 'AuditEntry', { districtId: D2 }, false],
  ['head', 'read', 'AuditEntry', { districtId: D2 }, true],
  ['foreman', 'read', 'AuditEntry', { districtId: D1 }, true],
  ['foreman', 'read', 'AuditEntry', { districtId: D2 }, false],
  ['crew', 'read', 'AuditEntry', null, false],
  ['partner', 'read', 'AuditEntry', null, false],
  // Imports of sites, fields and outlines
  ['admin', 'create', 'Import', null, true],
  ['head', 'create', 'Import', null, true],
  ['head', 'read', 'Import', { districtId: D2 }, true],
  ['foreman', 'create', 'Import', null, true],
  ['foreman', 'read', 'Import', { districtId: D1 }, true],
  ['foreman', 'read', 'Import', { districtId: D2 }, false],
  ['crew', 'create', 'Import', null, false],
  ['partner', 'create', 'Import', null, false],
  // Requests from partners
  ['partner', 'create', 'Request', { siteId: SITE_A, districtId: D1 }, true],
  ['partner', 'create', 'Request', { siteId: SITE_B, districtId: D2 }, false],
  ['foreman', 'update', 'Request', { siteId: SITE_A, districtId: D1 }, true],
  ['foreman', 'update', 'Request', { siteId: SITE_B, districtId: D2 }, false],
  // Costs and rates: the head sets them, a foreman reads them, crews and partners never see them
  ['admin', 'update', 'CostSettings', null, true],
  ['head', 'update', 'CostSettings', null, true],
  ['foreman', 'read', 'CostSettings', null, true],
  ['foreman', 'update', 'CostSettings', null, false],
  ['crew', 'read', 'CostSettings', null, false],
  ['partner', 'read', 'CostSettings', null, false],
  ['head', 'read', 'MailOutbox', null, true],
  ['head', 'update', 'MailOutbox', null, true],
  ['foreman', 'read', 'MailOutbox', null, false],
  ['crew', 'read', 'MailOutbox', null, false],
  ['partner', 'read', 'MailOutbox', null, false],
  // Season budget: the head sets it; a foreman reads his district's only
  ['head', 'update', 'Budget', { districtId: D2 }, true],
  ['head', 'read', 'Budget', { districtId: null }, true],
  ['foreman', 'read', 'Budget', { districtId: D1 }, true],
  ['foreman', 'read', 'Budget', { districtId: D2 }, false],
  ['foreman', 'read', 'Budget', { districtId: null }, false],
  ['foreman', 'update', 'Budget', { districtId: D1 }, false],
  ['crew', 'read', 'Budget', { districtId: D1 }, false],
  ['partner', 'read', 'Budget', { districtId: D1 }, false],
  // Saved what-ifs: a foreman's district only; only the one who saved it removes it.
  ['head', 'create', 'WhatIfScenario', { districtId: null }, true],
  ['head', 'delete', 'WhatIfScenario', { districtId: D2, createdBy: 2 }, true],
  ['head', 'delete', 'WhatIfScenario', { districtId: D2, createdBy: 1 }, false],
  ['foreman', 'delete', 'WhatIfScenario', { districtId: D1, createdBy: 3 }, true],
  ['foreman', 'delete', 'WhatIfScenario', { districtId: D1, createdBy: 2 }, false],
  ['foreman', 'read', 'WhatIfScenario', { districtId: D1 }, true],
  ['foreman', 'read', 'WhatIfScenario', { districtId: D2 }, false],
  ['foreman', 'read', 'WhatIfScenario', { districtId: null }, false],
  ['crew', 'read', 'WhatIfScenario', { districtId: D1 }, false],
  ['partner', 'create', 'WhatIfScenario', { districtId: D1 }, false],
  // The overview: the department's for the head, his district's for a foreman, none for crews and partners
  ['head', 'read', 'Overview', { districtId: D2 }, true],
  ['foreman', 'read', 'Overview', { districtId: D1 }, true],
  ['foreman', 'read', 'Overview', { districtId: D2 }, false],
  ['crew', 'read', 'Overview', null, false],
  ['partner', 'read', 'Overview', null, false],
  // The partner's own pages
  ['partner', 'read', 'PartnerView', null, true],
  ['head', 'read', 'PartnerView', null, false],
  ['foreman', 'read', 'PartnerView', null, false],
  ['crew', 'read', 'PartnerView', null, false],
  // Calendar feeds: a partner's own; a foreman's for the crews of his district
  ['partner', 'create', 'CalendarFeed', { userId: 5 }, true],
  ['partner', 'delete', 'CalendarFeed', { userId: 99 }, false],
  ['partner', 'create', 'CalendarFeed', { userId: 5, crewId: CREW_1, districtId: D1 }, true],
  ['foreman', 'create', 'CalendarFeed', { crewId: CREW_1, districtId: D1 }, true],
  ['foreman', 'create', 'CalendarFeed', { crewId: CREW_2, districtId: D2 }, false],
  ['foreman', 'read', 'CalendarFeed', { userId: 5 }, false],
  ['crew', 'create', 'CalendarFeed', { crewId: CREW_1, districtId: D1 }, false],
  ['head', 'create', 'CalendarFeed', { crewId: CREW_1, districtId: D1 }, false],
  ['foreman', 'assign', 'Request', { siteId: SITE_A, districtId: D1 }, true],
  ['foreman', 'assign', 'Request', { siteId: SITE_B, districtId: D2 }, false],
  ['partner', 'read', 'Request', { siteId: SITE_A, districtId: D1, createdBy: 3 }, true],
  ['partner', 'read', 'Request', { siteId: SITE_B, districtId: D2, createdBy: 5 }, false],
  ['partner', 'update', 'Request', { siteId: SITE_A, districtId: D1, createdBy: 5 }, true],
  ['partner', 'update', 'Request', { siteId: SITE_A, districtId: D1, createdBy: 3 }, false],
  ['partner', 'assign', 'Request', { siteId: SITE_A, districtId: D1, createdBy: 5 }, false],
  ['crew', 'read', 'Request', { siteId: SITE_A, districtId: D1 }, false],
  ['head', 'read', 'Request', { siteId: SITE_B, districtId: D2 }, true],
  ['head', 'assign', 'Request', { siteId: SITE_B, districtId: D2 }, false],
];

type FieldCase = [role: string, field: string, allowed: boolean];
/** Each role on its own account: name, units and password yes; role, scope and `active` only the admin. */
const ownAccountCases: FieldCase[] = Object.keys(actors).flatMap((role) => [
  ...OWN_ACCOUNT_FIELDS.map((field): FieldCase => [role, field, true]),
  ...PERMISSION_FIELDS.map((field): FieldCase => [role, field, role === 'admin']),
]);

describe('abilities', () => {
  test.each(ownAccountCases)('should let %s change %s of his own account: %s', (role, field, allowed) => {
    const actor = actors[role]!;
    const ability = defineAbilityFor(actor);
    expect(ability.can('update', asSubject('User', { id: actor.id, districtId: actor.districtId }), field)).toBe(allowed);
  });

  test('should let only the admin change any attribute of another account', () => {
    for (const [role, actor] of Object.entries(actors)) {
      const ability = defineAbilityFor(actor);
      for (const field of [...OWN_ACCOUNT_FIELDS, ...PERMISSION_FIELDS]) {
        expect(ability.can('update', asSubject('User', { id: 99, districtId: D1 }), field), `${role} ${field}`).toBe(role === 'admin');
      }
    }
  });

  test.each(cases)('should let %s %s %s %j: %s', (role, action, subjectName, row, allowed) => {
    const ability = defineAbilityFor(actors[role]!);
    const result = row ? ability.can(action, asSubject(subjectName, row)) : ability.can(action, subjectName);
    expect(result).toBe(allowed);
  });

  test('should give a foreman without a district no rows at all', () => {
    const ability = defineAbilityFor({ id: 9, role: 'foreman', districtId: null, crewId: null, siteIds: [] });
    expect(ability.can('read', asSubject('Field', own.field))).toBe(false);
    expect(ability.can('read', asSubject('Field', other.field))).toBe(false);
  });

  test('should give a partner with no sites no fields', () => {
    const ability = defineAbilityFor({ id: 9, role: 'partner', districtId: null, crewId: null, siteIds: [] });
    expect(ability.can('read', asSubject('Field', own.field))).toBe(false);
  });

  test('should scope district lists by role', () => {
    expect(districtScope(actors.admin!)).toBe('all');
    expect(districtScope(actors.head!)).toBe('all');
    expect(districtScope(actors.foreman!)).toEqual([D1]);
    expect(districtScope(actors.crew!)).toEqual([D1]);
    expect(districtScope(actors.partner!)).toEqual([]);
  });
});
