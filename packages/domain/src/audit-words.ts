/**
 * The audit log in words: which attributes changed, named as a turf manager would name them,
 * with the values before and after and the ids of people, places and crews replaced by their
 * names. The API resolves the names (one query per kind) and calls `describeAuditChanges`.
 */
import type { AuditChange } from './contracts/audit.ts';
import { LEVEL_NAMES, WORK_TASK_LABELS, type Level, type WorkTask } from './vocabulary.ts';

/** The kinds of row an id in a logged row can point to. */
export type AuditRefKind = 'user' | 'field' | 'site' | 'crew' | 'district' | 'equipment';

/** Names by kind and id, as the API found them; a missing id reads as "#id (removed)". */
export type AuditNames = Partial<Record<AuditRefKind, ReadonlyMap<number, string>>>;

/** Attributes that hold the id of another row, and which kind of row. */
export const AUDIT_REFERENCE_KEYS: Readonly<Record<string, AuditRefKind>> = {
  userId: 'user',
  createdBy: 'user',
  updatedBy: 'user',
  decidedBy: 'user',
  doneBy: 'user',
  checkedBy: 'user',
  setBy: 'user',
  authorId: 'user',
  actorId: 'user',
  fieldId: 'field',
  siteId: 'site',
  siteIds: 'site',
  crewId: 'crew',
  districtId: 'district',
  equipmentId: 'equipment',
  mowerId: 'equipment',
};

/** Bookkeeping attributes a reader does not need to see change. */
const SILENT_KEYS = new Set(['id', 'version', 'createdAt', 'updatedAt']);

/** Words for attributes whose name alone would read oddly; the rest are split from camelCase. */
const ATTRIBUTE_WORDS: Readonly<Record<string, string>> = {
  hocMm: 'Height of cut (mm)',
  level: 'Maintenance level',
  maintenanceLevel: 'Maintenance level',
  plannedDate: 'Planned date',
  plannedHours: 'Planned hours',
  actualHours: 'Hours worked',
  areaM2: 'Area (m²)',
  lengthM: 'Length (m)',
  widthM: 'Width (m)',
  siteIds: 'Sites',
  expectedReopenAt: 'Expected reopening',
  fromAt: 'From',
  toAt: 'Until',
  timeZone: 'Time zone',
  active: 'Active account',
  units: 'Units shown',
  passwordReset: 'Password reset',
  invitationAccepted: 'Invitation accepted',
  firstAdministrator: 'First administrator',
  pinned: 'Kept by the week plan',
  lat: 'Latitude',
  lng: 'Longitude',
  geometry: 'Outline',
  labourRatePerHour: 'Labour rate per hour',
  crewRates: 'Crew rates per hour',
  fuelPricePerL: 'Fuel price per L',
  fuelLPerHour: 'Fuel per machine hour (L)',
  waterPricePerM3: 'Water price per m³',
  fertiliserPricePerKgN: 'Fertiliser price per kg N',
  seedPricePerKg: 'Seed price per kg',
  paintPricePerL: 'Paint concentrate price per L',
  colourantPricePerL: 'Colourant price per L',
};

/** An attribute's name in words: a known label, else camelCase split ("expectedReopenAt" → "Expected reopen at"). */
export function auditAttributeLabel(key: string): string {
  const dot = key.indexOf('.');
  if (dot > 0) return `${auditAttributeLabel(key.slice(0, dot))} · ${auditAttributeLabel(key.slice(dot + 1))}`;
  const known = ATTRIBUTE_WORDS[key];
  if (known) return known;
  const ref = AUDIT_REFERENCE_KEYS[key];
  if (ref) {
    const base = key.replace(/Ids?$/, '').replace(/By$/, ' by');
    const words = base.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
    return words.charAt(0).toUpperCase() + words.slice(1);
  }
  const unit = UNIT_SUFFIXES.find(([re]) => re.test(key));
  if (unit) return `${auditAttributeLabel(key.replace(unit[0], ''))} (${unit[1]})`;
  const words = key
    .replace(/_/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** Unit endings of attribute names, worded as units. */
const UNIT_SUFFIXES: readonly (readonly [RegExp, string])[] = [
  [/Pct$/, '%'],
  [/Mm$/, 'mm'],
  [/M2$/, 'm²'],
  [/(?<=[a-z])M$/, 'm'],
  [/Kg$/, 'kg'],
  [/Min$/, 'min'],
];

const ISO_INSTANT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

function nameOf(kind: AuditRefKind, id: unknown, names: AuditNames): string {
  if (typeof id !== 'number') return plainValue(id);
  return names[kind]?.get(id) ?? `#${id} (removed)`;
}

/** A logged value in words: dates as written, instants to the minute (UTC), yes/no, lists joined. */
function plainValue(v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') return Number.isInteger(v) ? String(v) : String(Math.round(v * 100) / 100);
  if (typeof v === 'string') return ISO_INSTANT.test(v) ? `${v.slice(0, 10)} ${v.slice(11, 16)} UTC` : v;
  if (Array.isArray(v)) return v.length ? v.map(plainValue).join(', ') : '—';
  if (typeof v === 'object' && !Array.isArray(v)) return objectText(v as Record<string, unknown>, {});
  const text = JSON.stringify(v);
  return text.length > 120 ? `${text.slice(0, 117)}…` : text;
}

/** A small object in words: its values in order, ids named ("North Crew 52.5"). */
function objectText(o: Record<string, unknown>, names: AuditNames): string {
  const text = Object.entries(o)
    .map(([k, v]) => auditValueText(k, v, names))
    .join(' ');
  return text.length > 120 ? `${text.slice(0, 117)}…` : text;
}

/** One attribute's value in words, with ids named and the trade's own words for levels and tasks. */
export function auditValueText(key: string, value: unknown, names: AuditNames = {}): string {
  if (key.includes('.')) return auditValueText(key.slice(key.lastIndexOf('.') + 1), value, names);
  if (Array.isArray(value) && value.some(isPlainObject)) return value.map((v) => (isPlainObject(v) ? objectText(v, names) : auditValueText('', v, names))).join(', ');
  const ref = AUDIT_REFERENCE_KEYS[key];
  if (ref) {
    if (value === null || value === undefined) return '—';
    return Array.isArray(value) ? (value.length ? value.map((id) => nameOf(ref, id, names)).join(', ') : '—') : nameOf(ref, value, names);
  }
  if ((key === 'level' || key === 'maintenanceLevel') && typeof value === 'number' && value in LEVEL_NAMES) return LEVEL_NAMES[value as Level];
  if (key === 'task' && typeof value === 'string' && value in WORK_TASK_LABELS) return WORK_TASK_LABELS[value as WorkTask];
  return plainValue(value);
}

/**
 * What an entry changed, in words. An update lists the attributes whose values differ; a
 * creation lists what was set, a removal what was there (both without empty values).
 */
export function describeAuditChanges(before: Record<string, unknown> | null, after: Record<string, unknown> | null, names: AuditNames = {}): AuditChange[] {
  const b = flatten(before ?? {});
  const a = flatten(after ?? {});
  const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => !SILENT_KEYS.has(k));
  const out: AuditChange[] = [];
  for (const key of keys) {
    const was = b[key];
    const now = a[key];
    if (before && after && JSON.stringify(was) === JSON.stringify(now)) continue;
    if (!before && (now === null || now === undefined)) continue;
    if (!after && (was === null || was === undefined)) continue;
    out.push({ attribute: key, label: auditAttributeLabel(key), before: before ? auditValueText(key, was, names) : '—', after: after ? auditValueText(key, now, names) : '—' });
  }
  return out;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Nested objects one level down as their own attributes (`fuelLPerHour.reel_mower`), so each change reads alone. */
function flatten(row: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(row)) {
    if (isPlainObject(value) && key !== 'geometry') for (const [sub, v] of Object.entries(value)) out[`${key}.${sub}`] = v;
    else out[key] = value;
  }
  return out;
}

/** The ids an entry refers to, by kind, so the API can look up their names in one query per kind. */
export function auditReferences(rows: readonly { before: Record<string, unknown> | null; after: Record<string, unknown> | null }[]): Record<AuditRefKind, Set<number>> {
  const out: Record<AuditRefKind, Set<number>> = { user: new Set(), field: new Set(), site: new Set(), crew: new Set(), district: new Set(), equipment: new Set() };
  for (const row of rows) {
    for (const side of [row.before, row.after]) {
      if (!side) continue;
      // Ids at the top, in lists (siteIds) and in lists of small objects (crewRates[].crewId).
      const nested = Object.values(side).flatMap((v) => (Array.isArray(v) ? v.filter(isPlainObject) : []));
      for (const obj of [side, ...nested]) {
        for (const [key, kind] of Object.entries(AUDIT_REFERENCE_KEYS)) {
          const v = obj[key];
          for (const id of Array.isArray(v) ? v : [v]) if (typeof id === 'number') out[kind].add(id);
        }
      }
    }
  }
  return out;
}

/** Words for the kinds of row the log records. */
const ENTITY_WORDS: Readonly<Record<string, string>> = {
  user_permissions: 'User permissions',
  account: 'Account',
  settings: 'Department settings',
  standards: 'Standards',
  week_plan: 'Week plan',
  rain_out: 'Rain-out',
  field_stripes: 'Stripe pattern',
  work_update: 'Work report',
  what_if_scenario: 'Saved what-if',
};

/** The kind of row an entry is about, in words ("work_order" → "Work order"). */
export function auditEntityLabel(entity: string): string {
  const known = ENTITY_WORDS[entity];
  if (known) return known;
  const words = entity.replace(/_/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}
