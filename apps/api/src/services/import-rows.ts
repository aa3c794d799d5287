/**
 * Checks every row of an upload against the domain schemas, the caller's scope and
 * abilities, and plans what committing it would write. Run for the preview and again
 * inside the commit's transaction, so a commit never writes what the preview did not show.
 */
import { eq } from 'drizzle-orm';
import {
  createFieldSchema,
  createSiteSchema,
  FIELD_STATUS_LABELS,
  GRASS_LABELS,
  IRRIGATION_LABELS,
  LEVEL_NAMES,
  outlinePropertiesSchema,
  polygonSchema,
  ROOTZONE_LABELS,
  SITE_KIND_LABELS,
  SITE_OWNER_LABELS,
  CLIPPINGS_LABELS,
  SPORT_LABELS,
  updateFieldSchema,
  updateSiteSchema,
  type CreateFieldInput,
  type CreateSiteInput,
  type ImportKind,
  type ImportRow,
  type ImportRowError,
  type ImportSummary,
  type Polygon,
  type UpdateFieldInput,
  type UpdateSiteInput,
} from '@swardwise/domain';
import type { z } from 'zod';
import { districts, fields, sites } from '../db/schema/index.ts';
import { can, type Ctx } from './context.ts';
import type { RawRow } from './import-files.ts';
import { siteScope } from './scope.ts';

export type PlannedWrite =
  | { op: 'createSite'; input: CreateSiteInput }
  | { op: 'updateSite'; id: number; input: UpdateSiteInput }
  | { op: 'createField'; input: CreateFieldInput }
  | { op: 'updateField'; id: number; input: UpdateFieldInput };

export interface Plan {
  rows: ImportRow[];
  writes: PlannedWrite[];
  summary: ImportSummary;
}

const norm = (s: string) => s.trim().toLowerCase().replace(/[\s-]+/g, '_');

/** A vocabulary cell given as its code or its label ("Tall fescue" → tall_fescue); anything else is left for zod to refuse. */
function vocab(cell: unknown, labels: Record<string, string>): unknown {
  if (typeof cell !== 'string' || cell === '') return cell === '' ? undefined : cell;
  const n = norm(cell);
  for (const [code, label] of Object.entries(labels)) if (n === code || n === norm(label)) return code;
  return cell;
}

const text = (cell: unknown) => (typeof cell === 'string' && cell !== '' ? cell : undefined);

/** Issues of a zod result, keyed back to the CSV column names. */
function zodErrors(error: z.ZodError, columnOf: Record<string, string>, skip: Set<string>): ImportRowError[] {
  return error.issues
    .map((i) => ({ column: columnOf[String(i.path[0] ?? '')] ?? String(i.path[0] ?? '(row)'), message: i.message }))
    .filter((e) => !skip.has(e.column));
}

/** Drops undefined keys, so a blank cell leaves the stored value as it is. */
function defined<T extends Record<string, unknown>>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

function unchanged(existing: Record<string, unknown>, input: Record<string, unknown>): boolean {
  return Object.entries(input).every(([k, v]) => k === 'version' || JSON.stringify(existing[k]) === JSON.stringify(v));
}

class RowCheck {
  readonly errors: ImportRowError[] = [];
  readonly bad = new Set<string>();
  add(column: string, message: string) {
    this.errors.push({ column, message });
    this.bad.add(column);
  }
  number(data: Record<string, unknown>, column: string): number | undefined {
    const cell = data[column];
    if (cell === undefined || cell === '' || cell === null) return undefined;
    const n = Number(String(cell).replace(/,/g, ''));
    if (!Number.isFinite(n)) {
      this.add(column, `“${String(cell)}” is not a number`);
      return undefined;
    }
    return n;
  }
}

function summarize(rows: ImportRow[]): ImportSummary {
  const withErrors = rows.filter((r) => r.errors.length > 0).length;
  const ok = rows.filter((r) => r.errors.length === 0);
  return {
    rows: rows.length,
    valid: ok.length,
    errors: withErrors,
    create: ok.filter((r) => r.action === 'create').length,
    update: ok.filter((r) => r.action === 'update').length,
    unchanged: ok.filter((r) => r.action === null).length,
  };
}

/** What a planner makes of one row: its action, the write it asks for, the cells the preview shows. */
interface RowPlan {
  action: ImportRow['action'];
  write?: PlannedWrite | undefined;
  data?: ImportRow['data'];
}

/**
 * The plan of a file, row by row: `planRow` checks a row (a cell the reader could not read
 * is already an error on it). A row with any error writes nothing, so a commit writes only
 * rows the preview showed clean.
 */
function planRows(raw: RawRow[], planRow: (raw: RawRow, check: RowCheck) => RowPlan): Plan {
  const rows: ImportRow[] = [];
  const writes: PlannedWrite[] = [];
  for (const r of raw) {
    const check = new RowCheck();
    if (r.readError) check.add(r.readError.column, r.readError.message);
    const { action, write, data = r.data } = planRow(r, check);
    if (write && !check.errors.length) writes.push(write);
    rows.push({ row: r.row, data, action, errors: check.errors });
  }
  return { rows, writes, summary: summarize(rows) };
}

async function scopedSites(ctx: Ctx) {
  return ctx.db.select().from(sites).where(siteScope(ctx.actor));
}

async function scopedFields(ctx: Ctx) {
  return ctx.db
    .select({ field: fields, districtId: sites.districtId, siteName: sites.name })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(siteScope(ctx.actor));
}

function byName<T extends { name: string }>(rows: T[]) {
  const map = new Map<string, T[]>();
  for (const r of rows) {
    const key = r.name.trim().toLowerCase();
    map.set(key, [...(map.get(key) ?? []), r]);
  }
  return map;
}

const SITE_COLUMNS: Record<string, string> = { name: 'site', districtId: 'district', kind: 'kind', owner: 'owner', address: 'address', lat: 'lat', lng: 'lng', notes: 'notes' };

async function planSites(ctx: Ctx, raw: RawRow[]): Promise<Plan> {
  const allDistricts = await ctx.db.select({ id: districts.id, code: districts.code, name: districts.name }).from(districts);
  const districtOf = (cell: string) => {
    const n = cell.trim().toLowerCase();
    return allDistricts.find((d) => d.code.toLowerCase() === n || d.name.toLowerCase() === n);
  };
  const siteNames = byName(await scopedSites(ctx));
  const seen = new Set<string>();

  return planRows(raw, ({ data }, check) => {
    const name = text(data.site) ?? '';
    const key = name.toLowerCase();
    if (key && seen.has(key)) check.add('site', `“${name}” appears more than once in this file`);
    seen.add(key);

    let districtId: number | undefined;
    const districtCell = text(data.district);
    if (districtCell) {
      const d = districtOf(districtCell);
      if (!d) check.add('district', `no district with the code or name “${districtCell}”`);
      else districtId = d.id;
    }
    const values = {
      name: name || undefined,
      districtId,
      kind: vocab(data.kind, SITE_KIND_LABELS),
      owner: vocab(data.owner, SITE_OWNER_LABELS),
      address: text(data.address),
      lat: check.number(data, 'lat'),
      lng: check.number(data, 'lng'),
      notes: text(data.notes),
    };
    const matches = key ? (siteNames.get(key) ?? []) : [];

    if (matches.length > 1) {
      check.add('site', `${matches.length} sites in your districts are called “${name}”; rename one before importing`);
      return { action: null };
    }
    if (matches.length === 1) {
      const existing = matches[0]!;
      if (districtId !== undefined && districtId !== existing.districtId) {
        check.add('district', 'this site exists in another district; moving a site is done on its page, not by import');
      }
      if (!can(ctx, 'update', 'Site', existing)) check.add('site', 'your role may not change this site');
      const { name: _n, districtId: _d, ...rest } = values;
      void _n;
      void _d;
      const input = { version: existing.version, ...defined(rest) };
      const parsed = updateSiteSchema.safeParse(input);
      if (!parsed.success) check.errors.push(...zodErrors(parsed.error, SITE_COLUMNS, check.bad));
      else if (!unchanged(existing, parsed.data)) return { action: 'update', write: { op: 'updateSite', id: existing.id, input: parsed.data } };
      return { action: null };
    }
    const parsed = createSiteSchema.safeParse(defined(values));
    if (!parsed.success) check.errors.push(...zodErrors(parsed.error, SITE_COLUMNS, check.bad));
    if (districtId !== undefined && !can(ctx, 'create', 'Site', { districtId })) {
      check.add('district', `your role may not add sites in district “${districtCell}”`);
    }
    return { action: 'create', write: parsed.success ? { op: 'createSite', input: parsed.data } : undefined };
  });
}

const FIELD_COLUMNS: Record<string, string> = {
  siteId: 'site',
  name: 'field',
  sport: 'sport',
  grass: 'grass',
  rootzone: 'rootzone',
  irrigation: 'irrigation',
  maintenanceLevel: 'level',
  clippings: 'clippings',
  hocOverrideMm: 'hoc_mm',
  status: 'status',
  statusNote: 'status_note',
  weeklyUseHours: 'weekly_use_hours',
  geometry: 'geometry',
};

function levelOf(cell: unknown, check: RowCheck): number | undefined {
  if (typeof cell !== 'string' || cell === '') return undefined;
  const named = Object.entries(LEVEL_NAMES).find(([, n]) => norm(n) === norm(cell));
  if (named) return Number(named[0]);
  const n = Number(cell);
  if (!Number.isInteger(n)) check.add('level', `“${cell}” is not a maintenance level (1–4 or its name)`);
  return Number.isInteger(n) ? n : undefined;
}

function geometryOf(cell: unknown, check: RowCheck): unknown {
  if (typeof cell !== 'string' || cell === '') return undefined;
  try {
    return JSON.parse(cell);
  } catch {
    check.add('geometry', 'not valid JSON; give a GeoJSON Polygon such as {"type":"Polygon","coordinates":[[[lng,lat],…]]}');
    return undefined;
  }
}

async function planFields(ctx: Ctx, raw: RawRow[]): Promise<Plan> {
  const siteNames = byName(await scopedSites(ctx));
  const existingFields = await scopedFields(ctx);
  const fieldAt = new Map<string, (typeof existingFields)[number][]>();
  for (const f of existingFields) {
    const key = `${f.field.siteId}|${f.field.name.trim().toLowerCase()}`;
    fieldAt.set(key, [...(fieldAt.get(key) ?? []), f]);
  }
  const seen = new Set<string>();

  return planRows(raw, ({ data }, check) => {
    const siteCell = text(data.site);
    const name = text(data.field);
    let site: { id: number; districtId: number } | undefined;
    if (siteCell) {
      const matches = siteNames.get(siteCell.toLowerCase()) ?? [];
      if (matches.length === 0) check.add('site', `no site called “${siteCell}” in your districts; import or add the site first`);
      else if (matches.length > 1) check.add('site', `${matches.length} sites in your districts are called “${siteCell}”`);
      else site = matches[0];
    }
    const values = {
      siteId: site?.id,
      name,
      sport: vocab(data.sport, SPORT_LABELS),
      grass: vocab(data.grass, GRASS_LABELS),
      rootzone: vocab(data.rootzone, ROOTZONE_LABELS),
      irrigation: vocab(data.irrigation, IRRIGATION_LABELS),
      maintenanceLevel: levelOf(data.level, check),
      clippings: vocab(data.clippings, CLIPPINGS_LABELS),
      hocOverrideMm: check.number(data, 'hoc_mm'),
      status: vocab(data.status, FIELD_STATUS_LABELS),
      statusNote: text(data.status_note),
      weeklyUseHours: check.number(data, 'weekly_use_hours'),
      geometry: geometryOf(data.geometry, check),
    };
    if (site && name) {
      const key = `${site.id}|${name.toLowerCase()}`;
      if (seen.has(key)) check.add('field', `“${name}” at “${siteCell}” appears more than once in this file`);
      seen.add(key);
      const matches = fieldAt.get(key) ?? [];
      if (matches.length > 1) {
        check.add('field', `${matches.length} fields at this site are called “${name}”`);
      } else if (matches.length === 1) {
        const existing = matches[0]!;
        const scoped = { ...existing.field, districtId: existing.districtId };
        if (!can(ctx, 'update', 'Field', scoped)) check.add('field', 'your role may not change this field');
        const { siteId: _s, name: _n, ...rest } = values;
        void _s;
        void _n;
        const parsed = updateFieldSchema.safeParse({ version: existing.field.version, ...defined(rest) });
        if (!parsed.success) check.errors.push(...zodErrors(parsed.error, FIELD_COLUMNS, check.bad));
        else if (!unchanged(existing.field, parsed.data)) return { action: 'update', write: { op: 'updateField', id: existing.field.id, input: parsed.data } };
        return { action: null };
      }
    }
    if (values.geometry === undefined && !check.bad.has('geometry')) check.add('geometry', 'a new field needs its outline: a GeoJSON Polygon');
    const parsed = createFieldSchema.safeParse(defined(values));
    if (!parsed.success) check.errors.push(...zodErrors(parsed.error, FIELD_COLUMNS, check.bad));
    if (site && !can(ctx, 'create', 'Field', { siteId: site.id, districtId: site.districtId })) check.add('site', 'your role may not add fields at this site');
    return { action: 'create', write: parsed.success ? { op: 'createField', input: parsed.data } : undefined };
  });
}

async function planOutlines(ctx: Ctx, raw: RawRow[]): Promise<Plan> {
  const existingFields = await scopedFields(ctx);
  const seen = new Set<number>();

  return planRows(raw, ({ data }, check) => {
    const props = outlinePropertiesSchema.safeParse(defined({ fieldId: data.fieldId ?? undefined, field: data.field ?? undefined, site: data.site ?? undefined }));
    let target: (typeof existingFields)[number] | undefined;
    if (!props.success) {
      for (const i of props.error.issues) check.add(String(i.path[0] ?? 'properties'), i.message);
    } else if (props.data.fieldId !== undefined) {
      target = existingFields.find((f) => f.field.id === props.data.fieldId);
      if (!target) check.add('fieldId', `no field with id ${props.data.fieldId} in your districts`);
    } else {
      const site = props.data.site!.toLowerCase();
      const field = props.data.field!.toLowerCase();
      const matches = existingFields.filter((f) => f.siteName.trim().toLowerCase() === site && f.field.name.trim().toLowerCase() === field);
      if (matches.length === 0) check.add('field', `no field “${props.data.field}” at a site “${props.data.site}” in your districts`);
      else if (matches.length > 1) check.add('field', `${matches.length} fields match “${props.data.field}” at “${props.data.site}”; use fieldId`);
      else target = matches[0];
    }
    const geometryType = (data.geometry as { type?: unknown } | null)?.type;
    const geometry = polygonSchema.safeParse(data.geometry);
    if (!geometry.success) {
      check.add('geometry', geometryType && geometryType !== 'Polygon' ? `the outline must be a Polygon, not ${String(geometryType)}` : (geometry.error.issues[0]?.message ?? 'not a GeoJSON Polygon'));
    }
    let action: ImportRow['action'] = null;
    let write: PlannedWrite | undefined;
    if (target) {
      if (seen.has(target.field.id)) check.add('field', 'this field has another outline earlier in the file');
      seen.add(target.field.id);
      if (!can(ctx, 'update', 'Field', { ...target.field, districtId: target.districtId })) check.add('field', 'your role may not change this field');
      if (geometry.success && JSON.stringify(target.field.geometry) !== JSON.stringify(geometry.data)) {
        action = 'update';
        write = { op: 'updateField', id: target.field.id, input: { version: target.field.version, geometry: geometry.data as Polygon } };
      }
    }
    // Keep the names the preview shows; the outline itself stays for the commit.
    return { action, write, data: { ...data, fieldId: target?.field.id ?? data.fieldId, field: target?.field.name ?? data.field, site: target?.siteName ?? data.site } };
  });
}

export function planImport(ctx: Ctx, kind: ImportKind, raw: RawRow[]): Promise<Plan> {
  switch (kind) {
    case 'sites_csv':
      return planSites(ctx, raw);
    case 'fields_csv':
      return planFields(ctx, raw);
    case 'outlines_geojson':
      return planOutlines(ctx, raw);
  }
}
