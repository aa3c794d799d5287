/**
 * The equipment form in the person's units (inches, mph, inches of HOC — or metres, km/h,
 * millimetres) and its conversion to the SI body the API takes.
 */
import { createEquipmentSchema, inchesToEighthsText, KM_PER_MILE, MM_PER_INCH, MOWER_KINDS, type CreateEquipmentInput, type EquipmentKind, type EquipmentRow, type UnitSystem } from '@swardwise/domain';

export interface EquipmentModel {
  districtId: number | null;
  crewId: number | null;
  kind: EquipmentKind;
  name: string;
  /** Cutting width: inches or metres. */
  width: number | null;
  /** Working speed: mph or km/h. */
  speed: number | null;
  /** Field efficiency as a percentage. */
  efficiencyPct: number | null;
  /** HOC range: inches or millimetres. */
  hocMin: number | null;
  hocMax: number | null;
  hourMeterH: number | null;
  sharpenIntervalH: number | null;
  lastSharpenedAtH: number | null;
  notes: string;
  active: boolean;
}

export const isMower = (kind: string) => MOWER_KINDS.includes(kind as EquipmentKind);

export const widthUnit = (u: UnitSystem) => (u === 'imperial' ? 'in' : 'm');
export const speedUnit = (u: UnitSystem) => (u === 'imperial' ? 'mph' : 'km/h');
export const hocUnitOf = (u: UnitSystem) => (u === 'imperial' ? 'in' : 'mm');

const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;
const map = (v: number | null, f: (x: number) => number) => (v === null || v === undefined ? null : f(v));

export const widthToShown = (m: number, u: UnitSystem) => (u === 'imperial' ? round((m * 1000) / MM_PER_INCH, 0) : round(m, 2));
const widthToM = (v: number, u: UnitSystem) => (u === 'imperial' ? round((v * MM_PER_INCH) / 1000, 4) : v);
export const speedToShown = (kmh: number, u: UnitSystem) => (u === 'imperial' ? round(kmh / KM_PER_MILE, 1) : round(kmh, 1));
const speedToKmh = (v: number, u: UnitSystem) => (u === 'imperial' ? round(v * KM_PER_MILE, 3) : v);
// Inches to 0.001 so eighths stay exact (1⅜ in = 34.925 mm).
const hocToShown = (mm: number, u: UnitSystem) => (u === 'imperial' ? round(mm / MM_PER_INCH, 3) : round(mm, 0));
const hocToMmOf = (v: number, u: UnitSystem) => (u === 'imperial' ? round(v * MM_PER_INCH, 3) : v);
/** A mower setting as text: inches to the eighth ("1⅜") or whole millimetres. */
export const hocToText = (mm: number, u: UnitSystem) => (u === 'imperial' ? inchesToEighthsText(mm / MM_PER_INCH) : String(Math.round(mm)));

export function emptyEquipment(): EquipmentModel {
  return {
    districtId: null,
    crewId: null,
    kind: 'rotary_mower',
    name: '',
    width: null,
    speed: null,
    efficiencyPct: 80,
    hocMin: null,
    hocMax: null,
    hourMeterH: 0,
    sharpenIntervalH: null,
    lastSharpenedAtH: null,
    notes: '',
    active: true,
  };
}

export function modelOf(row: EquipmentRow, u: UnitSystem): EquipmentModel {
  return {
    districtId: row.districtId,
    crewId: row.crewId,
    kind: row.kind,
    name: row.name,
    width: map(row.cuttingWidthM, (m) => widthToShown(m, u)),
    speed: map(row.speedKmh, (k) => speedToShown(k, u)),
    efficiencyPct: map(row.fieldEfficiency, (e) => round(e * 100, 0)),
    hocMin: map(row.hocMinMm, (mm) => hocToShown(mm, u)),
    hocMax: map(row.hocMaxMm, (mm) => hocToShown(mm, u)),
    hourMeterH: row.hourMeterH,
    sharpenIntervalH: row.sharpenIntervalH,
    lastSharpenedAtH: row.lastSharpenedAtH,
    notes: row.notes,
    active: row.active,
  };
}

/**
 * The SI body of the form. Only mowers keep cutting figures and blade care: the fields are
 * hidden for other kinds, so what is hidden is not sent.
 */
export function inputOf(m: EquipmentModel, u: UnitSystem): Record<keyof CreateEquipmentInput, unknown> {
  const mower = isMower(m.kind);
  const only = <T>(v: T) => (mower ? v : null);
  return {
    districtId: m.districtId,
    crewId: m.crewId ?? null,
    kind: m.kind,
    name: m.name,
    cuttingWidthM: only(map(m.width, (v) => widthToM(v, u))),
    speedKmh: only(map(m.speed, (v) => speedToKmh(v, u))),
    fieldEfficiency: only(map(m.efficiencyPct, (v) => round(v / 100, 3))),
    hocMinMm: only(map(m.hocMin, (v) => hocToMmOf(v, u))),
    hocMaxMm: only(map(m.hocMax, (v) => hocToMmOf(v, u))),
    hourMeterH: m.hourMeterH ?? 0,
    sharpenIntervalH: only(m.sharpenIntervalH ?? null),
    lastSharpenedAtH: only(m.lastSharpenedAtH ?? null),
    notes: m.notes,
    active: m.active,
  };
}

/** Form field → the API field it becomes, for placing the schema's and the server's messages. */
const API_KEY_OF: Record<string, keyof CreateEquipmentInput> = {
  width: 'cuttingWidthM',
  speed: 'speedKmh',
  efficiencyPct: 'fieldEfficiency',
  hocMin: 'hocMinMm',
  hocMax: 'hocMaxMm',
};
const FORM_KEY_OF: Record<string, string> = Object.fromEntries(Object.entries(API_KEY_OF).map(([form, apiKey]) => [apiKey, form]));
export const formKeyOf = (apiKey: string) => FORM_KEY_OF[apiKey] ?? apiKey;

/** The schema's first message for one form field, checked on the converted body; null when fine. */
export function equipmentIssue(m: EquipmentModel, u: UnitSystem, formKey: string): string | null {
  const result = createEquipmentSchema.safeParse(inputOf(m, u));
  if (result.success) return null;
  const apiKey = API_KEY_OF[formKey] ?? formKey;
  const issue = result.error.issues.find((i) => i.path[0] === apiKey);
  if (!issue) return null;
  // The schema speaks in SI; in the person's units a range message names the unit it checks.
  if (u === 'imperial' && (apiKey === 'cuttingWidthM' || apiKey === 'speedKmh' || apiKey === 'hocMinMm' || apiKey === 'hocMaxMm') && issue.code !== 'custom') {
    return `${issue.message} (checked after converting to ${apiKey === 'speedKmh' ? 'km/h' : apiKey === 'cuttingWidthM' ? 'metres' : 'millimetres'})`;
  }
  return issue.message;
}
