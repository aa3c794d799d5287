/**
 * The department's Standards (maintenance levels 1–4) and department parameters.
 * Heights of cut follow the trade's common practice (elite soccer about 1 in; sports fields
 * 1–3 in; low-maintenance areas up to about 3–3½ in; bermudagrass ½–1½ in) and are set as
 * the inch values a US department sets its mowers to (whole inches and eighths), kept as the
 * exact millimetres (1 in = 25.4 mm). Everything else here is a department setting: the
 * defaults are this product's demo choices, not published values, and each department edits
 * them.
 */
import { GRASSES, GRASS_SEASON, LEVEL_NAMES, LEVELS, SPORTS } from '../vocabulary.ts';
import type { Grass, GrassSeason, HardnessDevice, Level, Sport } from '../vocabulary.ts';
import { fail, requirePositive } from './check.ts';
import type { Weekday } from './dates.ts';
import { G_PER_M2_PER_LB_PER_1000FT2 } from './units.ts';
import type { LineSettings } from './lines.ts';
import type { TurfKcSettings } from './water.ts';
import { DEFAULT_CULTURAL } from './cultural.ts';
import type { CulturalPrograms } from './cultural.ts';

/** What one maintenance level asks for. */
export interface LevelStandard {
  level: Level;
  name: string;
  /** HOC in mm per sport and grass season (cool / warm). */
  hocMm: Record<Sport, Record<GrassSeason, number>>;
  /** Per-grass HOC (mm) that replaces the season value for every sport (e.g. St. Augustinegrass is cut higher). */
  hocByGrassMm: Partial<Record<Grass, number>>;
  /** Minimum mowings per week in the growing season. */
  minMowingsPerWeek: number;
  /** Longest allowed interval between mowings, days. */
  maxMowingIntervalDays: number;
  /** Share (0–1) of the upper end of the grass's annual N range that this level receives. */
  annualNShare: number;
  /** Share of ETc that irrigation replaces; null: not irrigated at this level. */
  irrigationShareOfEtc: number | null;
  /** Use the department's turf Kc less its reduction (`turfKc.reducedBy`; FAO-56 Table 12 note: 0.10 where fast growth is not wanted). */
  reducedKc: boolean;
  /** Days between line repaints in season; null: no lines kept. */
  lineRepaintDays: number | null;
  /** Days between field checks. */
  fieldCheckDays: number;
  /** Surface score (0–100) the level aims for. */
  targetScore: number;
  /** Aeration, overseeding, topdressing and weed control per season (absent in rows saved before it: the level's default, `culturalProgramsOf`). */
  cultural?: CulturalPrograms;
}

export type Standards = Record<Level, LevelStandard>;

type HocRow = Record<Sport, Record<GrassSeason, number>>;
const hocRow = (cool: Partial<Record<Sport, number>> & { default: number }, warm: Partial<Record<Sport, number>> & { default: number }): HocRow =>
  Object.fromEntries(SPORTS.map((s) => [s, { cool: cool[s] ?? cool.default, warm: warm[s] ?? warm.default }])) as HocRow;

/**
 * Heights in inches (eighths) as exact millimetres, so that stored values read back as the
 * inch a crew sets (25.4 mm is 1 in, not 0.98 in).
 */
const IN = {
  half: 12.7,
  fiveEighths: 15.875,
  threeQuarters: 19.05,
  sevenEighths: 22.225,
  one: 25.4,
  oneQuarter: 31.75,
  oneHalf: 38.1,
  oneThreeQuarters: 44.45,
  two: 50.8,
  twoHalf: 63.5,
  twoThreeQuarters: 69.85,
  three: 76.2,
  threeHalf: 88.9,
} as const;

/** Demo defaults of the Standards table (department settings; heights from common practice). */
export const DEFAULT_STANDARDS: Standards = {
  1: {
    level: 1,
    name: LEVEL_NAMES[1],
    // Baseball outfields a little above soccer's 1 in (common practice), as softball.
    hocMm: hocRow(
      { default: IN.one, football: IN.oneQuarter, baseball: IN.oneQuarter, softball: IN.oneQuarter, field_hockey: IN.sevenEighths, multi_use: IN.oneHalf, lawn: IN.two },
      { default: IN.fiveEighths, football: IN.threeQuarters, baseball: IN.threeQuarters, softball: IN.threeQuarters, field_hockey: IN.half, multi_use: IN.one, lawn: IN.oneQuarter },
    ),
    hocByGrassMm: { st_augustinegrass: IN.twoHalf },
    minMowingsPerWeek: 3,
    maxMowingIntervalDays: 3,
    annualNShare: 1,
    irrigationShareOfEtc: 1,
    reducedKc: false,
    lineRepaintDays: 7,
    fieldCheckDays: 7,
    targetScore: 85,
    cultural: DEFAULT_CULTURAL[1],
  },
  2: {
    level: 2,
    name: LEVEL_NAMES[2],
    hocMm: hocRow(
      { default: IN.oneQuarter, football: IN.oneHalf, softball: IN.oneHalf, field_hockey: IN.one, multi_use: IN.oneThreeQuarters, lawn: IN.twoHalf },
      { default: IN.threeQuarters, football: IN.one, softball: IN.one, field_hockey: IN.fiveEighths, multi_use: IN.oneQuarter, lawn: IN.oneHalf },
    ),
    hocByGrassMm: { st_augustinegrass: IN.twoThreeQuarters },
    minMowingsPerWeek: 2,
    maxMowingIntervalDays: 4,
    annualNShare: 0.85,
    irrigationShareOfEtc: 0.8,
    reducedKc: false,
    lineRepaintDays: 10,
    fieldCheckDays: 14,
    targetScore: 75,
    cultural: DEFAULT_CULTURAL[2],
  },
  3: {
    level: 3,
    name: LEVEL_NAMES[3],
    hocMm: hocRow({ default: IN.two, field_hockey: IN.oneHalf, multi_use: IN.twoHalf, lawn: IN.three }, { default: IN.oneQuarter, field_hockey: IN.one, multi_use: IN.oneHalf, lawn: IN.oneHalf }),
    hocByGrassMm: { st_augustinegrass: IN.three },
    minMowingsPerWeek: 1,
    maxMowingIntervalDays: 7,
    annualNShare: 0.65,
    irrigationShareOfEtc: 0.6,
    reducedKc: true,
    lineRepaintDays: 14,
    fieldCheckDays: 30,
    targetScore: 65,
    cultural: DEFAULT_CULTURAL[3],
  },
  4: {
    level: 4,
    name: LEVEL_NAMES[4],
    hocMm: hocRow({ default: IN.three, lawn: IN.threeHalf }, { default: IN.oneHalf, lawn: IN.two }),
    hocByGrassMm: { st_augustinegrass: IN.threeHalf },
    minMowingsPerWeek: 0.5,
    maxMowingIntervalDays: 14,
    annualNShare: 0.3,
    irrigationShareOfEtc: null,
    reducedKc: true,
    lineRepaintDays: null,
    fieldCheckDays: 60,
    targetScore: 50,
    cultural: DEFAULT_CULTURAL[4],
  },
};

/** The cultural programs of a level: its own, else the level's default, task by task. */
export function culturalProgramsOf(std: LevelStandard): CulturalPrograms {
  const base = DEFAULT_CULTURAL[std.level];
  return { ...base, ...(std.cultural ?? {}) };
}

/** The range of Gmax readings a department accepts from one tester. */
export interface HardnessRange {
  /** Below this the surface is soft or wet (null: no lower limit). */
  min: number | null;
  /** The level the department aims to stay at or under (null: only the limit). */
  target: number | null;
  /** Above this, consider closing the field. */
  max: number;
}

/** A mower as the engine needs it. */
export interface MowerSpec {
  kind: 'reel' | 'rotary';
  /** Cutting width, m. */
  widthM: number;
  /** Mowing speed, km/h. */
  speedKmh: number;
  /** Field efficiency 0–1 (ASAE D497: mowers 75–90 %, typical 80 % — from memory). */
  efficiency: number;
  /** Overlap between passes, m. */
  overlapM: number;
  /**
   * Time per headland turn, s: lift, turn and line up on the next pass. Defaults 15 s for a
   * ride-on reel, 10 s for a ride-on rotary (from memory; time a crew to set the department's own).
   */
  turnTimeS: number;
  hocMinMm: number;
  hocMaxMm: number;
}

/** The unit and step a department sets mower heights in, and where reel mowing stops. */
export interface MowerSettings {
  unit: 'in' | 'mm';
  /** Smallest change of setting, in `unit` (1/8 in; 1 mm). */
  step: number;
  /** Highest HOC cut with a reel mower, in `unit`; above it a rotary. */
  reelUpToHoc: number;
}

/** Department parameters: the engine's tunable numbers. */
export interface DepartmentParameters {
  /**
   * Maximum vertical growth, mm/day at GP = 1, per grass. No published source: these are
   * department parameters, replaced per field by calibration from field checks.
   */
  maxGrowthMmPerDay: Record<Grass, number>;
  /** Default mowers by kind (demo defaults). */
  mowers: Record<'reel' | 'rotary', MowerSpec>;
  /**
   * How the department sets its mowers: the unit (US departments: inches), the step of a
   * setting (an eighth of an inch; a millimetre) and the highest HOC cut with a reel mower
   * (common practice: reel at 1 in and below, rotary above).
   */
  mowerSettings: MowerSettings;
  /** Soluble-N limit per application, g N/m² (LSU AgCenter: ≤ 1 lb N/1000 ft² ≈ 4.88 g/m²). */
  solubleNLimitGPerM2: number;
  /** Ceiling per application with slow-release N, g N/m² (department rule, no published source). */
  slowReleaseNCeilingGPerM2: number;
  /**
   * Smallest N per application worth a spreader pass; smaller monthly amounts are carried into
   * the next application. Common practice: granular rates of about 0.5–1 lb N/1000 ft².
   */
  minNPerApplicationGPerM2: number;
  /** Trailer travel between sites. Road factor and speed are department settings. */
  travel: { roadFactor: number; speedKmh: number; loadUnloadMin: number };
  /** Invented demo costs — replace with the department's own prices. */
  costs: { currency: string; waterPerM3: number; labourPerHour: number; paintPerLitre: number; fertiliserPerKg: number };
  /**
   * Surface hardness range per tester, Gmax; readings from different testers are not
   * comparable. ASTM F1936 / F355 missile A: upper limit 200, 165 or lower as the common
   * target (REFERENCES, from memory). The 2.25 kg portable tester (ASTM F1702): no published
   * acceptance range was found, so its range is a department setting.
   */
  hardnessRangesG: Record<HardnessDevice, HardnessRange>;
  /**
   * Turf crop coefficients of the water budget: annual planning values for turf under
   * mowing, cool-season about 0.8 and warm-season about 0.6 (University of California ANR
   * turfgrass water guidance; Meyer et al. 1985). FAO-56 Table 12 (0.90–0.95 cool, 0.80–0.85
   * warm) describes a full grass cover and is kept only as a reference. `reducedBy` is taken
   * off where a level asks for a reduced Kc (FAO-56 Table 12 note: 0.10).
   */
  turfKc: TurfKcSettings;
  /**
   * Irrigation system defaults (department settings). DU is the lower-quarter distribution
   * uniformity of a catch-can audit; gross need = net × SM, SM = 1 ÷ (0.4 + 0.6 × DU).
   */
  irrigation: { distributionUniformity: number; precipRateMmPerH: number; maxRunMinPerCycle: number; maxCyclesPerDay: number };
  /**
   * Line marking: a first coat and a touch-up coat, each with its coverage of finished line
   * per litre of mixed paint (all passes of the coat), dilution and passes, and the marker.
   */
  lines: LineSettings;
  /**
   * Soil-test sufficiency (department parameter, not a published value): below the level,
   * apply the maintenance rate of P2O5 / K2O in g/m² per year.
   */
  soilTest: { pSufficientPpm: number; kSufficientPpm: number; p2o5RateGPerM2: number; k2oRateGPerM2: number };
  /** Fertiliser bag size, kg (demo default). */
  fertiliserBagKg: number;
  /** The department's usual N product (demo default): analysis in % and slow-release share of its N. */
  fertiliserProduct: { n: number; p: number; k: number; slowReleaseShare: number };
  /** Hours a crew works per week (demo default). */
  crewHoursPerWeek: number;
  /** Week plan settings (department settings; the defaults are demo choices, not published values). */
  planning: PlanningParameters;
}

/** How the week plan turns needs into work orders (department settings). */
export interface PlanningParameters {
  /** Weekdays the water provider allows watering (local restrictions decide). */
  wateringDays: Weekday[];
  /** Hours for one field check (walk, hardness and cover readings). */
  fieldCheckHours: number;
  /** Granular spreader for feeding: width (m), speed (km/h), field efficiency, set-up and fill (min). */
  spreader: { widthM: number; speedKmh: number; efficiency: number; setupMin: number };
  /** Hours per watering day to set and move quick-coupler sprinklers on a field. */
  quickCouplerHoursPerDay: number;
  /** Hours to set an automatic controller's run times for a field for the week. */
  controllerSetHours: number;
  /** Lines are painted this many days before a booking (0 = the same morning). */
  paintDaysBeforeEvent: number;
  /** A painting this many days or fewer before a booking already serves it. */
  paintFreshDays: number;
  /** Lines last painted longer ago than this no longer show: the next painting is a first coat, not a touch-up. */
  firstCoatAfterDays: number;
  /** Routine repaints and feeding wait while the week's mean growth potential is below this (dormant turf). */
  dormantGp: number;
  /** Least gross irrigation need in a week worth a watering order, mm. */
  minIrrigationMm: number;
  /**
   * Cultural work: the machine of each task (working width m, speed km/h, field efficiency,
   * set-up and clean-up min), the growth potential aeration and overseeding wait for (the
   * turf must grow to heal holes and take seed; common practice), and the share of a field
   * overseeded when no field check names its worn share. Demo defaults, not published values.
   */
  cultural?: CulturalPlanning;
}

/** How cultural work is sized and when it may go (department settings). */
export interface CulturalPlanning {
  machines: Record<'aerate' | 'overseed' | 'topdress' | 'weed_control', { widthM: number; speedKmh: number; efficiency: number; setupMin: number }>;
  /** Aeration and overseeding wait while the week's mean GP is below this; topdressing and weed control use `dormantGp`. */
  activeGrowthGp: number;
  /** Share of the field overseeded (worn goalmouths and centre) when no field check gives a bare share. */
  defaultOverseedShare: number;
  /** No aeration, overseeding or topdressing on a booking's day or this many days before it. */
  clearDaysBeforeBooking: number;
}

/** Demo defaults of the department parameters; every cost is invented. */
export const DEFAULT_PARAMETERS: DepartmentParameters = {
  maxGrowthMmPerDay: {
    kentucky_bluegrass: 4,
    perennial_ryegrass: 5,
    tall_fescue: 5,
    fine_fescue: 3,
    bermudagrass: 6,
    zoysiagrass: 3,
    st_augustinegrass: 4,
  },
  mowers: {
    // Setting ranges in inches as mowers are sold and set: reel ¼–1½ in, rotary 1–5 in.
    reel: { kind: 'reel', widthM: 2.8, speedKmh: 6, efficiency: 0.8, overlapM: 0.1, turnTimeS: 15, hocMinMm: 6.35, hocMaxMm: 38.1 },
    rotary: { kind: 'rotary', widthM: 1.83, speedKmh: 8, efficiency: 0.8, overlapM: 0.1, turnTimeS: 10, hocMinMm: 25.4, hocMaxMm: 127 },
  },
  mowerSettings: { unit: 'in', step: 1 / 8, reelUpToHoc: 1 },
  solubleNLimitGPerM2: G_PER_M2_PER_LB_PER_1000FT2,
  slowReleaseNCeilingGPerM2: 2 * G_PER_M2_PER_LB_PER_1000FT2,
  minNPerApplicationGPerM2: 0.5 * G_PER_M2_PER_LB_PER_1000FT2,
  travel: { roadFactor: 1.3, speedKmh: 35, loadUnloadMin: 15 },
  costs: { currency: 'USD', waterPerM3: 1.2, labourPerHour: 32, paintPerLitre: 4.5, fertiliserPerKg: 1.6 },
  hardnessRangesG: {
    // ASTM F1936 / F355 missile A: upper limit 200 Gmax, 165 or lower as a common target (from memory).
    f355_missile_a: { min: null, target: 165, max: 200 },
    // 2.25 kg portable tester: no published acceptance range; demo department setting.
    portable_2_25kg: { min: 20, target: null, max: 100 },
  },
  // University of California ANR turfgrass water guidance (Meyer et al. 1985): about 0.8
  // cool-season, 0.6 warm-season; FAO-56 Table 12 note for the reduction.
  turfKc: { cool: 0.8, warm: 0.6, reducedBy: 0.1 },
  irrigation: { distributionUniformity: 0.7, precipRateMmPerH: 12, maxRunMinPerCycle: 20, maxCyclesPerDay: 4 },
  lines: {
    // First coat: about 200 linear ft of 4 in line per mixed gallon (trade press), a finished
    // line painted in two directions (common practice): 66.7 ft² per US gallon → 1.64 m²/L;
    // mixed 1:1 for a first application (trade guidance, secondary sources).
    firstCoat: { coverageM2PerMixedL: (200 * 0.3048 * 0.1016) / 3.785411784, dilutionWaterPerPaint: 1, passes: 2 },
    // Touch-up over lines that still show: one pass at the first coat's rate per pass (so
    // 400 ft per mixed gallon), mixed 3:1 (trade guidance: 3:1 or 4:1 for touch-ups).
    touchUp: { coverageM2PerMixedL: (400 * 0.3048 * 0.1016) / 3.785411784, dilutionWaterPerPaint: 3, passes: 1 },
    markerSpeedKmh: 3,
    setupMin: 20,
  },
  soilTest: { pSufficientPpm: 25, kSufficientPpm: 120, p2o5RateGPerM2: 2.5, k2oRateGPerM2: 5 },
  fertiliserBagKg: 22.7,
  fertiliserProduct: { n: 28, p: 0, k: 6, slowReleaseShare: 0.5 },
  crewHoursPerWeek: 40,
  planning: {
    wateringDays: ['mon', 'wed', 'fri'],
    fieldCheckHours: 0.5,
    // 12 ft rotary spreader at a walking-to-utility-vehicle pace (demo default).
    spreader: { widthM: 3.7, speedKmh: 6, efficiency: 0.7, setupMin: 15 },
    quickCouplerHoursPerDay: 0.75,
    controllerSetHours: 0.25,
    paintDaysBeforeEvent: 1,
    paintFreshDays: 2,
    firstCoatAfterDays: 28,
    dormantGp: 0.1,
    minIrrigationMm: 2,
    cultural: {
      // Tractor-mounted core aerator, slit seeder, spinner topdresser and boom sprayer (demo defaults).
      machines: {
        aerate: { widthM: 1.5, speedKmh: 4, efficiency: 0.75, setupMin: 20 },
        overseed: { widthM: 1.5, speedKmh: 5, efficiency: 0.7, setupMin: 20 },
        topdress: { widthM: 2, speedKmh: 6, efficiency: 0.7, setupMin: 30 },
        weed_control: { widthM: 4.5, speedKmh: 6, efficiency: 0.65, setupMin: 30 },
      },
      activeGrowthGp: 0.5,
      defaultOverseedShare: 0.15,
      clearDaysBeforeBooking: 1,
    },
  },
};

/** What `hocFor` needs of a field. */
export interface HocFieldInput {
  sport: Sport;
  grass: Grass;
  maintenanceLevel: Level;
  /** Field override in mm; wins over the Standards when set. */
  hocOverrideMm?: number | null;
}

/** HOC in mm for a field: the override, else the grass's HOC at the level, else the sport × grass season value. */
export function hocFor(field: HocFieldInput, standards: Standards = DEFAULT_STANDARDS): number {
  if (field.hocOverrideMm !== null && field.hocOverrideMm !== undefined) {
    return requirePositive(field.hocOverrideMm, 'invalid_hoc', 'HOC override (mm)');
  }
  const std = levelStandard(field.maintenanceLevel, standards);
  const season = grassSeason(field.grass);
  if (!(SPORTS as readonly string[]).includes(field.sport)) fail('unknown_sport', `unknown sport ${JSON.stringify(field.sport)}`);
  return std.hocByGrassMm[field.grass] ?? std.hocMm[field.sport][season];
}

/** The Standards row of a level; throws `engine/unknown_level`. */
export function levelStandard(level: Level, standards: Standards = DEFAULT_STANDARDS): LevelStandard {
  if (!(LEVELS as readonly number[]).includes(level)) fail('unknown_level', `maintenance level must be 1–4 (got ${String(level)})`);
  return standards[level];
}

/** Cool or warm season of a grass; throws `engine/unknown_grass`. */
export function grassSeason(grass: Grass): GrassSeason {
  if (!(GRASSES as readonly string[]).includes(grass)) fail('unknown_grass', `unknown grass ${JSON.stringify(grass)}`, { grass });
  return GRASS_SEASON[grass];
}
