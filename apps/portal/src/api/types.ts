import type {
  Clippings,
  EquipmentKind,
  FieldEventKind,
  Weekday,
  ImportKind,
  ImportRow,
  ImportStatus,
  ImportSummary,
  FieldStatus,
  Grass,
  IrrigationKind,
  Level,
  Polygon,
  Role,
  Rootzone,
  SiteKind,
  SiteOwner,
  Sport,
  UnitSystem,
} from '@swardwise/domain';

/** Shapes of the API answers, as the API contract describes them. */

export interface SessionUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  districtId: number | null;
  crewId: number | null;
  siteIds: number[];
  units: UnitSystem;
  version: number;
}

export interface UserRow extends SessionUser {
  active: boolean;
  lastSignInAt: string | null;
  createdAt: string;
  districtName: string | null;
  crewName: string | null;
  pendingInvite: boolean;
}

export interface DistrictRow {
  id: number;
  code: string;
  name: string;
  boundary: Polygon;
  yard: { name: string; lat: number; lng: number };
  siteCount: number;
  fieldCount: number;
  fieldAreaM2: number;
}

export interface SiteRow {
  id: number;
  districtId: number;
  districtName: string;
  name: string;
  kind: SiteKind;
  owner: SiteOwner;
  address: string;
  lat: number;
  lng: number;
  notes: string;
  fieldCount: number;
  fieldAreaM2: number;
  version: number;
}

export interface FieldRow {
  id: number;
  siteId: number;
  siteName: string;
  districtId: number;
  districtName: string;
  name: string;
  sport: Sport;
  grass: Grass;
  rootzone: Rootzone;
  irrigation: IrrigationKind;
  maintenanceLevel: Level;
  hocOverrideMm: number | null;
  clippings: Clippings;
  status: FieldStatus;
  statusNote: string;
  weeklyUseHours: number;
  areaM2: number;
  version: number;
  updatedAt: string;
}

export interface FieldDetail extends FieldRow {
  geometry: Polygon;
}

export interface CrewRow {
  id: number;
  districtId: number;
  districtName: string;
  name: string;
  hoursPerDay: number;
  members: string[];
  workDays: Weekday[];
  leadUserId: number | null;
  leadName: string | null;
  version: number;
}

export interface EquipmentRow {
  id: number;
  districtId: number;
  districtName: string;
  crewId: number | null;
  crewName: string | null;
  kind: EquipmentKind;
  name: string;
  cuttingWidthM: number | null;
  speedKmh: number | null;
  fieldEfficiency: number | null;
  hocMinMm: number | null;
  hocMaxMm: number | null;
  hourMeterH: number;
  sharpenIntervalH: number | null;
  lastSharpenedAtH: number | null;
  hoursSinceSharpening: number | null;
  sharpeningDue: boolean;
  notes: string;
  active: boolean;
  version: number;
  updatedAt: string;
}

export interface FieldEventRow {
  id: number;
  fieldId: number;
  fieldName: string;
  siteId: number;
  siteName: string;
  districtId: number;
  kind: FieldEventKind;
  title: string;
  startsOn: string;
  startTime: string | null;
  notes: string;
  createdBy: number | null;
  version: number;
  updatedAt: string;
}

export interface WeatherStationRow {
  id: number;
  code: string;
  name: string;
  lat: number;
  lng: number;
  elevationM: number;
  dayCount: number;
  forecastDays: number;
  firstDate: string | null;
  lastDate: string | null;
}

export interface WeatherDayRow {
  stationId: number;
  date: string;
  kind: 'observed' | 'forecast';
  tmaxC: number;
  tminC: number;
  rhMaxPct: number | null;
  rhMinPct: number | null;
  windMs: number | null;
  sunshineH: number | null;
  solarMJ: number | null;
  rainMm: number;
  source: string;
}

export interface StationCsvRow {
  line: number;
  data: Omit<WeatherDayRow, 'stationId' | 'source'> | null;
  errors: { column: string; message: string }[];
}

export interface StationCsvAnswer {
  committed: boolean;
  rows: StationCsvRow[];
  summary: { rows: number; valid: number; invalid: number };
}

export interface AuditEntry {
  id: number;
  at: string;
  actorId: number | null;
  actorName: string | null;
  /** Row changes, and account events (entity `account`). */
  action: 'create' | 'update' | 'delete' | 'sign_in' | 'sign_in_failed' | 'sign_out' | 'reset_requested';
  entity: string;
  entityId: number | null;
  districtId: number | null;
  before: unknown;
  after: unknown;
}

export interface Items<T> {
  items: T[];
}

/** An upload of sites, fields or outlines, as previewed and as committed. */
export interface ImportListItem {
  id: number;
  kind: ImportKind;
  status: ImportStatus;
  userId: number;
  userName: string | null;
  districtId: number | null;
  fileName: string;
  summary: ImportSummary;
  createdAt: string;
  committedAt: string | null;
  undoneAt: string | null;
}

export interface ImportRecord extends ImportListItem {
  rows: ImportRow[];
  changes: { created: number; updated: number } | null;
}
