import { z } from 'zod';
import { idSchema } from './common.ts';

/** What an upload holds: sites or fields as CSV, or field outlines as GeoJSON. */
export const IMPORT_KINDS = ['sites_csv', 'fields_csv', 'outlines_geojson'] as const;
export type ImportKind = (typeof IMPORT_KINDS)[number];
export const IMPORT_KIND_LABELS: Record<ImportKind, string> = {
  sites_csv: 'Sites (CSV)',
  fields_csv: 'Fields (CSV)',
  outlines_geojson: 'Field outlines (GeoJSON)',
};

export const IMPORT_STATUSES = ['preview', 'committed', 'undone', 'discarded'] as const;
export type ImportStatus = (typeof IMPORT_STATUSES)[number];

/** Largest upload accepted, in bytes. */
export const IMPORT_MAX_BYTES = 5 * 1024 * 1024;
/** Most rows (or features) one upload may hold. */
export const IMPORT_MAX_ROWS = 2000;

export interface ImportColumn {
  name: string;
  required: boolean;
  /** What goes in the column, shown on the imports page. */
  help: string;
}

/** Our own CSV columns, in the order a template lists them. */
export const IMPORT_COLUMNS: Record<'sites_csv' | 'fields_csv', ImportColumn[]> = {
  sites_csv: [
    { name: 'site', required: true, help: 'site name; an existing site of that name in your districts is updated' },
    { name: 'district', required: true, help: 'district code or name' },
    { name: 'kind', required: true, help: 'park, school or complex' },
    { name: 'owner', required: true, help: 'city or school_district' },
    { name: 'address', required: false, help: 'street address' },
    { name: 'lat', required: true, help: 'latitude in decimal degrees (WGS84)' },
    { name: 'lng', required: true, help: 'longitude in decimal degrees (WGS84)' },
    { name: 'notes', required: false, help: 'free text' },
  ],
  fields_csv: [
    { name: 'site', required: true, help: 'name of an existing site in your districts' },
    { name: 'field', required: true, help: 'field name; an existing field of that name at the site is updated' },
    { name: 'sport', required: true, help: 'soccer, football, baseball, softball, lacrosse, field_hockey, multi_use or lawn' },
    { name: 'grass', required: true, help: 'e.g. tall_fescue, kentucky_bluegrass, bermudagrass' },
    { name: 'rootzone', required: true, help: 'native_soil, sand_capped or sand_based' },
    { name: 'irrigation', required: true, help: 'none, quick_coupler or automatic' },
    { name: 'level', required: true, help: 'maintenance level 1–4 (or its name, e.g. Competition)' },
    { name: 'clippings', required: true, help: 'returned or removed' },
    { name: 'hoc_mm', required: false, help: 'height of cut override in millimetres; empty follows the Standards' },
    { name: 'status', required: false, help: 'open, restricted or closed (default open)' },
    { name: 'status_note', required: false, help: 'why a field is restricted or closed' },
    { name: 'weekly_use_hours', required: false, help: 'hours of play per week' },
    { name: 'geometry', required: false, help: 'GeoJSON Polygon as text, [longitude, latitude]; required for a new field' },
  ],
};

export const importKindSchema = z.enum(IMPORT_KINDS, { error: `kind must be one of ${IMPORT_KINDS.join(', ')}` });
export const createImportSchema = z.object({ kind: importKindSchema });

/** Properties a GeoJSON feature uses to name the field its outline belongs to. */
export const outlinePropertiesSchema = z
  .object({
    fieldId: idSchema.optional(),
    field: z.string().trim().min(1).max(120).optional(),
    site: z.string().trim().min(1).max(120).optional(),
  })
  .refine((p) => p.fieldId !== undefined || (p.field !== undefined && p.site !== undefined), {
    message: 'each feature needs a "fieldId" property, or both "field" and "site" names',
  });

/** One error in one row of an upload. */
export interface ImportRowError {
  column: string;
  message: string;
}

export interface ImportRow {
  /** Line of the CSV (header is line 1) or 1-based feature number of the GeoJSON. */
  row: number;
  /** The cells as read (GeoJSON: the feature's names and outline). */
  data: Record<string, unknown>;
  /** What committing would do with the row. */
  action: 'create' | 'update' | null;
  errors: ImportRowError[];
}

export interface ImportSummary {
  rows: number;
  valid: number;
  errors: number;
  create: number;
  update: number;
  [key: string]: number;
}
