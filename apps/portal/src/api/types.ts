import type {
  Clippings,
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
  leadUserId: number | null;
  version: number;
}

export interface AuditEntry {
  id: number;
  at: string;
  actorId: number | null;
  actorName: string | null;
  action: 'create' | 'update' | 'delete';
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
