import type { LevelStandard, MowerWarning } from '@swardwise/domain';
import { api } from './client.ts';

/** One input of a needs block: the raw SI value and its unit token (see utils/needUnits.ts). */
export interface NeedInput {
  key: string;
  label: string;
  value: number | string | boolean | null;
  unit: string | null;
}

interface Explained {
  inputs: NeedInput[];
  how: string;
  cautions: string[];
}

/** The answer of `GET /api/fields/:id/needs` (SI units throughout). */
export interface FieldNeeds {
  fieldId: number;
  requestedDate: string;
  week: { start: string; end: string; days: number; fallback: boolean };
  weatherNote: string | null;
  station: { id: number; code: string; name: string; distanceKm: number; hargreavesDays: number };
  standards: { level: number; name: string; version: number | null; missingLevels: number[] };
  hoc: Explained & { hocMm: number; source: 'override' | 'standards_grass' | 'standards_sport'; triggerHeightMm: number; mowerKind: 'reel' | 'rotary'; mowerWarnings: MowerWarning[] };
  growth: Explained & { gpDaily: { date: string; gp: number; growthMm: number }[]; gpMean: number; growthMmPerDay: number; growthMmWeek: number };
  mowing: Explained & {
    mowingsThisWeek: number;
    mowingsPerWeek: number;
    weekMowingDates: string[];
    nextMowingOn: string | null;
    nextMowingNote: string | null;
    overdueOn: string | null;
    overdueNow: boolean;
    lastMowedOn: string | null;
  };
  labour: Explained & {
    method: 'pass_plan' | 'field_capacity';
    hoursPerMowing: number;
    hoursPerWeek: number;
    seasonHours: number;
    passPlan: { direction: string; passes: number; passLengthM: number; turns: number; distanceM: number } | null;
    capacityHours: number;
  };
  water: Explained & {
    irrigated: boolean;
    notIrrigatedReason: string | null;
    et0Method: 'penman_monteith' | 'hargreaves' | 'mixed';
    et0Mm: number;
    kc: number;
    etcMm: number;
    rainMm: number;
    effectiveRainMm: number;
    shareOfEtc: number;
    netMm: number;
    grossMm: number;
    runTimeMin: number;
    volumeL: number;
  };
  feed: Explained & {
    annualNGPerM2: number;
    reasons: string[];
    monthlyNGPerM2: number[];
    product: { analysis: string; slowReleaseShare: number; bagKg: number };
    applications: { date: string; month: number; nGPerM2: number; productGPerM2: number; productKg: number; bags: number }[];
    nextApplication: { date: string; nGPerM2: number; productKg: number; bags: number } | null;
    productKgSeason: number;
  };
  lines: Explained & {
    kept: boolean;
    reason: string | null;
    template: { id: string; name: string; source: string; lineWidthM: number } | null;
    lineLengthM: number;
    /** What the totals include, element by element. */
    elements: { label: string; count: number; lengthM: number; paintedAreaM2: number; equivalentLengthM: number }[];
    paintedAreaM2: number;
    mixedLitres: number;
    concentrateLitres: number;
    waterLitres: number;
    hoursPerRepaint: number;
    firstCoat: { mixedLitres: number; concentrateLitres: number; waterLitres: number; hours: number };
    repaintDays: number | null;
    repaints: number;
    firstCoats: number;
    touchUps: number;
    seasonMixedLitres: number;
    seasonConcentrateLitres: number;
    seasonHours: number;
  };
  level: Explained & {
    assigned: number;
    recommended: number;
    points: number;
    reasons: string[];
    targetScore: number;
    latestCheck: { checkedOn: string; score: number } | null;
    scoreMet: boolean | null;
    workCompliance: { tracked: boolean; note: string };
  };
  season: {
    stationId: number;
    start: string;
    end: string;
    dates: string[];
    gp: number[];
    growthMm: number[];
    waterNeedMm: number[];
    mowings: string[];
    feedApplications: { date: string; nGPerM2: number }[];
  };
}

export async function getFieldNeeds(id: number, date?: string, signal?: AbortSignal): Promise<FieldNeeds> {
  return (await api.get<{ needs: FieldNeeds }>(`/fields/${id}/needs`, { date }, signal)).needs;
}

export type { LevelStandard };
