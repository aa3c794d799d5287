/** Sites compared: what their care cost and gave over a period. */
import type { WorkCost } from '../cost-of-work.ts';
import type { ComparePeriod } from '../schemas/compare.ts';
import type { Level } from '../vocabulary.ts';

/** One site's figures over the period. Money in the department's currency; per-acre figures per international acre (4,046.8564224 m²). */
export interface CompareSiteRow {
  siteId: number;
  siteName: string;
  districtId: number;
  districtName: string;
  /** The maintenance level that covers most of the site's field area (ties: the higher level). */
  level: Level;
  fieldCount: number;
  /** The fields' area (m²) and acres. */
  areaM2: number;
  acres: number;
  /** Work orders done in the period, and their hours (actual, else planned). */
  ordersDone: number;
  hours: number;
  /** Inputs put down in the period (SI). */
  fertiliserKgN: number;
  waterM3: number;
  paintL: number;
  seedKg: number;
  colourantL: number;
  /** Money by heading (labour, fuel, each input, inputs, total). */
  cost: WorkCost;
  /** Per acre of field; null for a site without field area. */
  costPerAcre: number | null;
  hoursPerAcre: number | null;
  inputsPerAcre: number | null;
  /** Mean of each field's latest surface score (0–100) in the period, weighted by area; null without checks. */
  surfaceScore: number | null;
  /** Fields with a check in the period. */
  fieldsChecked: number;
}

/** `GET /api/compare/sites`. */
export interface CompareSitesAnswer {
  period: { kind: ComparePeriod; from: string; to: string };
  currency: string;
  /** The district the rows are narrowed to (a foreman's own; the head's choice), or null for all. */
  districtId: number | null;
  rows: CompareSiteRow[];
  /** Sums over the rows (per-acre figures over the summed acres). */
  totals: Omit<CompareSiteRow, 'siteId' | 'siteName' | 'districtId' | 'districtName' | 'level' | 'surfaceScore' | 'fieldsChecked'>;
}
