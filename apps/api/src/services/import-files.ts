/**
 * Reading an uploaded file: the type is checked by its extension and by its content, then
 * CSV is split into rows with papaparse and GeoJSON into features. Nothing here touches
 * the database.
 */
import path from 'node:path';
import Papa from 'papaparse';
import { type AppError, IMPORT_COLUMNS, IMPORT_KIND_LABELS, IMPORT_MAX_ROWS, appError, type ImportKind } from '@swardwise/domain';
import { MAX_JSON_DEPTH, nestedDeeperThan } from '../http/json-depth.ts';

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

/** A raw row of the upload: its number and its cells (GeoJSON: the feature's properties and outline). */
export interface RawRow {
  row: number;
  data: Record<string, unknown>;
  /** A problem found while reading the row itself (a CSV line with too many cells). */
  readError?: { column: string; message: string };
}

const CSV_EXTENSIONS = ['.csv'];
const GEOJSON_EXTENSIONS = ['.geojson', '.json'];

function unsupported(message: string): AppError {
  return appError('import/unsupported_type', message);
}

function decodeText(file: UploadedFile, what: string): string {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw unsupported(`${file.originalname} is not a UTF-8 text file; save the ${what} as UTF-8 text and upload it again`);
  }
  if (text.includes('\u0000')) throw unsupported(`${file.originalname} holds binary data, not ${what} text`);
  return text.replace(/^\uFEFF/, '');
}

function readCsv(kind: 'sites_csv' | 'fields_csv', file: UploadedFile): RawRow[] {
  const text = decodeText(file, 'CSV');
  if (text.trim() === '') throw appError('import/empty', `${file.originalname} is empty`);
  if (/^\s*[[{]/.test(text)) throw unsupported(`${file.originalname} looks like JSON, not CSV; ${IMPORT_KIND_LABELS[kind]} need comma-separated text`);
  const parsed = Papa.parse<Record<string, string>>(text, {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const headers = (parsed.meta.fields ?? []).filter((h) => h !== '');
  const known = IMPORT_COLUMNS[kind].map((c) => c.name);
  const missing = IMPORT_COLUMNS[kind].filter((c) => c.required && !headers.includes(c.name)).map((c) => c.name);
  const unknown = headers.filter((h) => !known.includes(h));
  if (missing.length || unknown.length) {
    const parts = [
      missing.length ? `missing column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}` : '',
      unknown.length ? `unknown column${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')}` : '',
    ].filter(Boolean);
    throw appError('import/columns', `The first line of ${file.originalname} must name the columns: ${parts.join('; ')}. Expected: ${known.join(',')}`, {
      missing,
      unknown,
    });
  }
  if (parsed.data.length === 0) throw appError('import/empty', `${file.originalname} has a header line but no rows`);
  if (parsed.data.length > IMPORT_MAX_ROWS) throw appError('import/too_many_rows', `${file.originalname} has ${parsed.data.length} rows; import at most ${IMPORT_MAX_ROWS} at a time`);

  const lineErrors = new Map<number, string>();
  for (const e of parsed.errors) if (e.row !== undefined) lineErrors.set(e.row, e.message);
  return parsed.data.map((cells, i) => {
    const data: Record<string, unknown> = {};
    for (const name of known) if (name in cells) data[name] = (cells[name] ?? '').trim();
    const readError = lineErrors.get(i);
    // Header is line 1; with skipped blank lines this is the row's position, which is what people count.
    return { row: i + 2, data, ...(readError ? { readError: { column: '(line)', message: readError } } : {}) };
  });
}

function readGeoJson(file: UploadedFile): RawRow[] {
  const text = decodeText(file, 'GeoJSON');
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch {
    throw unsupported(`${file.originalname} is not valid JSON; outlines are imported from a GeoJSON FeatureCollection`);
  }
  if (nestedDeeperThan(doc)) {
    throw appError('import/too_deep', `${file.originalname} nests arrays or objects more than ${MAX_JSON_DEPTH} levels deep; a GeoJSON outline needs about 6`, {
      issues: [{ path: 'body.file', message: `nested more than ${MAX_JSON_DEPTH} levels deep` }],
    });
  }
  const collection = doc as { type?: unknown; features?: unknown };
  if (!collection || typeof collection !== 'object' || collection.type !== 'FeatureCollection' || !Array.isArray(collection.features)) {
    throw unsupported(`${file.originalname} is not a GeoJSON FeatureCollection`);
  }
  if (collection.features.length === 0) throw appError('import/empty', `${file.originalname} has no features`);
  if (collection.features.length > IMPORT_MAX_ROWS) {
    throw appError('import/too_many_rows', `${file.originalname} has ${collection.features.length} features; import at most ${IMPORT_MAX_ROWS} at a time`);
  }
  return collection.features.map((feature: unknown, i: number) => {
    const f = (feature ?? {}) as { properties?: Record<string, unknown> | null; geometry?: unknown };
    const props = f.properties ?? {};
    return { row: i + 1, data: { fieldId: props.fieldId ?? null, field: props.field ?? null, site: props.site ?? null, geometry: f.geometry ?? null } };
  });
}

/** Checks the file's type by extension and content and reads its rows; 415 for the wrong type. */
export function readUpload(kind: ImportKind, file: UploadedFile): RawRow[] {
  const ext = path.extname(file.originalname).toLowerCase();
  if (kind === 'outlines_geojson') {
    if (!GEOJSON_EXTENSIONS.includes(ext)) throw unsupported(`Outlines are imported from a .geojson or .json file; ${file.originalname} is not one`);
    return readGeoJson(file);
  }
  if (!CSV_EXTENSIONS.includes(ext)) throw unsupported(`${IMPORT_KIND_LABELS[kind]} are imported from a .csv file; ${file.originalname} is not one`);
  return readCsv(kind, file);
}
