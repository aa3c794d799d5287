/**
 * The one definition of who may do what. The API checks it on every route (with
 * row-level conditions on district and site); the portal builds the same ability from
 * the signed-in user to hide what the API would refuse.
 */
import { AbilityBuilder, createMongoAbility, subject, type ForcedSubject, type MongoAbility } from '@casl/ability';
import type { Role } from './vocabulary.ts';

export const ACTIONS = ['manage', 'read', 'create', 'update', 'delete', 'assign', 'log'] as const;
export type Action = (typeof ACTIONS)[number];

export const SUBJECTS = [
  'User',
  'District',
  'Site',
  'Field',
  'Crew',
  'Equipment',
  'WorkOrder',
  'FieldCheck',
  'FieldEvent',
  /** A game-day preparation: an event's checklist and its work orders. */
  'GameDayPrep',
  /** Closing, restricting and reopening a field (its history of closures). */
  'FieldClosure',
  'Standards',
  'Settings',
  'AuditEntry',
  'Import',
  'Weather',
  'Request',
  /** The partner's own pages: their fields in plain words. */
  'PartnerView',
  /** A private calendar feed (a partner's own, or a crew's made by its foreman). */
  'CalendarFeed',
  /** The department's costs and rates (labour, fuel, water, products): internal, never a partner's or a crew's. */
  'CostSettings',
  /** The season budget of a district (districtId) or of the department (districtId null). */
  'Budget',
  /** The overview's figures of a district (or, for the department, of all of them). */
  'Overview',
  /** Sites compared by cost, hours and inputs per acre and surface score: the head's, a foreman's for his district. */
  'SiteComparison',
  /** E-mail waiting in the outbox or given up: recipient, subject and state, never the message. */
  'MailOutbox',
  /** A saved what-if scenario (the change, not its result) of a district (districtId) or the department (null). */
  'WhatIfScenario',
] as const;
export type SubjectName = (typeof SUBJECTS)[number];
/** A row tagged with its subject type (see `asSubject`). */
export type TaggedRow = { [K in SubjectName]: ScopedRow & ForcedSubject<K> }[SubjectName];
export type Subjects = SubjectName | TaggedRow | 'all';

export type AppAbility = MongoAbility<[Action, Subjects]>;

/** The signed-in caller as every service and ability sees it. */
export interface Actor {
  id: number;
  role: Role;
  /** District of a foreman or crew lead; null for admin, head and partner. */
  districtId: number | null;
  /** Crew of a crew lead. */
  crewId: number | null;
  /** Sites a partner is linked to. */
  siteIds: number[];
}

/** Rows carry these attributes so conditions can be checked on them. */
export interface ScopedRow {
  id?: number;
  districtId?: number | null;
  siteId?: number | null;
  crewId?: number | null;
  /** Crews with work on the row (a field) in the current window. */
  crewIds?: number[];
  /** Who made the row (a booking). */
  createdBy?: number | null;
  /** Whose row it is (a partner's calendar feed). */
  userId?: number | null;
}

/**
 * The attributes of a user's own account they may change themselves. Role, scope (district,
 * crew, sites) and `active` are the administrator's: a user never widens their own scope.
 */
export const OWN_ACCOUNT_FIELDS = ['name', 'units', 'password'] as const;

/** The attributes of an account only an administrator changes: who may do what, and where. */
export const PERMISSION_FIELDS = ['role', 'districtId', 'crewId', 'siteIds', 'active'] as const;
export type PermissionField = (typeof PERMISSION_FIELDS)[number];

export function defineAbilityFor(actor: Actor): AppAbility {
  const { can, cannot, build } = new AbilityBuilder<AppAbility>(createMongoAbility);

  // Everyone may read their own account and change its name, unit preference and password;
  // nothing else of it (field-level rule: role, scope and `active` stay the administrator's).
  can('read', 'User', { id: actor.id });
  can('update', 'User', [...OWN_ACCOUNT_FIELDS], { id: actor.id });

  switch (actor.role) {
    case 'admin':
      can('manage', 'all');
      break;

    case 'head':
      can('read', ['District', 'Site', 'Field', 'Crew', 'Equipment', 'WorkOrder', 'FieldCheck', 'FieldEvent', 'Weather', 'Request', 'GameDayPrep']);
      can('read', ['Standards', 'Settings', 'AuditEntry']);
      can('update', ['Standards', 'Settings']);
      // The head decides maintenance levels and may correct any site or field.
      can(['create', 'update'], ['Site', 'Field']);
      // The head may close or reopen any field.
      can(['read', 'create'], 'FieldClosure');
      can(['create', 'read'], 'Import');
      // The head defends the budget: he sets what labour, fuel, water and products cost.
      can(['read', 'update'], 'CostSettings');
      can(['read', 'update'], 'Budget');
      can('read', 'Overview');
      can('read', 'SiteComparison');
      // The head sees which e-mail (invitations, resets) is stuck and sends a failed one again.
      can(['read', 'update'], 'MailOutbox');
      // Saved what-ifs: any scope; he removes only his own.
      can(['read', 'create'], 'WhatIfScenario');
      can('delete', 'WhatIfScenario', { createdBy: actor.id });
      break;

    case 'foreman': {
      const d = actor.districtId ?? -1;
      can('read', 'District', { id: d });
      can('manage', ['Site', 'Field', 'Crew', 'Equipment', 'WorkOrder', 'FieldCheck', 'FieldEvent', 'FieldClosure', 'GameDayPrep'], { districtId: d });
      // A foreman answers his district's requests and decides them ('assign': schedule into work, decline, close).
      can(['read', 'update', 'assign'], 'Request', { districtId: d });
      can('read', ['Standards', 'Weather']);
      // A foreman sees his district's costs, so he reads the rates they are worked out with.
      can('read', 'CostSettings');
      // His district's budget, read-only: the head sets it.
      can('read', 'Budget', { districtId: d });
      // The overview of his own district, never another's or the department's.
      can('read', 'Overview', { districtId: d });
      can('read', 'SiteComparison', { districtId: d });
      // What-ifs of his own district; he removes only the ones he saved.
      can(['read', 'create'], 'WhatIfScenario', { districtId: d });
      can('delete', 'WhatIfScenario', { districtId: d, createdBy: actor.id });
      can('create', ['Import', 'Weather']);
      can('read', 'Import', { districtId: d });
      can('read', 'AuditEntry', { districtId: d });
      can('read', 'User', { districtId: d });
      // One calendar feed per crew of the district (a partner's feed has no district).
      can(['read', 'create', 'delete'], 'CalendarFeed', { districtId: d });
      break;
    }

    case 'crew': {
      const d = actor.districtId ?? -1;
      const c = actor.crewId ?? -1;
      can('read', 'District', { id: d });
      can('read', 'Site', { districtId: d });
      // A crew sees the fields of its own work, not the whole district.
      can('read', 'Field', { districtId: d, crewIds: c });
      can('read', 'Crew', { id: c });
      can('read', 'Equipment', { crewId: c });
      can(['read', 'log'], 'WorkOrder', { crewId: c });
      can('create', 'FieldCheck', { districtId: d });
      can('read', 'FieldEvent', { districtId: d });
      can('read', 'GameDayPrep', { districtId: d });
      can('read', 'FieldClosure', { districtId: d });
      can('read', ['Standards', 'Weather']);
      break;
    }

    case 'partner': {
      const sites = actor.siteIds;
      can('read', 'Site', { id: { $in: sites } });
      can('read', 'Field', { siteId: { $in: sites } });
      can('read', 'WorkOrder', { siteId: { $in: sites } });
      // School athletic directors and league contacts book games on their fields, and change
      // or cancel only the bookings they made themselves, not the department's or another partner's.
      can(['read', 'create'], 'FieldEvent', { siteId: { $in: sites } });
      can(['update', 'delete'], 'FieldEvent', { siteId: { $in: sites }, createdBy: actor.id });
      // They follow how the department readies their events (progress only, in plain words).
      can('read', 'GameDayPrep', { siteId: { $in: sites } });
      can(['read', 'create'], 'Request', { siteId: { $in: sites } });
      // A partner changes only the requests they filed themselves; deciding them is the foreman's.
      can('update', 'Request', { siteId: { $in: sites }, createdBy: actor.id });
      // Partners see why their fields are closed; closing them is the department's.
      can('read', 'FieldClosure', { siteId: { $in: sites } });
      can('read', 'Standards');
      can('read', 'PartnerView');
      // Their own calendar feed of their fields.
      can(['read', 'create', 'delete'], 'CalendarFeed', { userId: actor.id });
      break;
    }
  }

  // Nobody, not even an admin, edits the audit log.
  cannot(['create', 'update', 'delete'], 'AuditEntry');

  return build();
}

/** Tag a plain row with its subject type so conditions are checked against it. */
export function asSubject<T extends ScopedRow>(type: SubjectName, row: T): T & TaggedRow {
  return subject(type, { ...row }) as T & TaggedRow;
}

/** Which districts an actor may read rows of: 'all' or a list of ids. */
export function districtScope(actor: Actor): 'all' | number[] {
  switch (actor.role) {
    case 'admin':
    case 'head':
      return 'all';
    case 'foreman':
    case 'crew':
      return actor.districtId == null ? [] : [actor.districtId];
    case 'partner':
      return [];
  }
}
