/**
 * The season budget: the lines a head defends (labour, fuel, fertiliser, water, paint, seed,
 * equipment hours), what the turf engine's outlook says each will take, and what the work
 * records show was used, both priced with the department's cost settings.
 */
import type { CostSettings } from './schemas/costs.ts';
import { crewRatePerHour } from './costs.ts';
import type { EquipmentKind } from './vocabulary.ts';

export const BUDGET_LINES = ['labour', 'fuel', 'fertiliser', 'water', 'paint', 'seed', 'equipment'] as const;
export type BudgetLine = (typeof BUDGET_LINES)[number];

/** What each line counts and what its budget is entered in: money, except equipment (machine hours). */
export const BUDGET_LINE_FACTS: Record<BudgetLine, { label: string; quantityUnit: string; money: boolean }> = {
  labour: { label: 'Labour', quantityUnit: 'h', money: true },
  fuel: { label: 'Fuel', quantityUnit: 'L', money: true },
  fertiliser: { label: 'Fertiliser', quantityUnit: 'kg N', money: true },
  water: { label: 'Water', quantityUnit: 'm³', money: true },
  paint: { label: 'Paint', quantityUnit: 'L concentrate', money: true },
  seed: { label: 'Seed', quantityUnit: 'kg', money: true },
  equipment: { label: 'Equipment hours', quantityUnit: 'h', money: false },
};

/** A line's quantity and, for the money lines, its cost in the department's currency (null for equipment hours). */
export interface BudgetFigure {
  quantity: number;
  cost: number | null;
}
export type BudgetFigures = Record<BudgetLine, BudgetFigure>;

/** The part of a field's season outlook the budget prices (`FieldOutlook` has all of it). */
export interface OutlookForBudget {
  mowingHours: number;
  lineHours: number;
  labourHours: number;
  nKg: number;
  waterM3: number;
  paintConcentrateL: number;
  mowerKind: 'reel' | 'rotary';
}

const MOWER_EQUIPMENT: Record<OutlookForBudget['mowerKind'], EquipmentKind> = { reel: 'reel_mower', rotary: 'rotary_mower' };

/**
 * The outlook of some fields as budget lines, priced with the cost settings: labour hours ×
 * the department's labour rate; fuel = mowing hours × the mower kind's L/h + line hours × the
 * line marker's L/h, × the fuel price; N (kg) × price per kg N; water (m³) × price per m³;
 * paint concentrate (L) × price per L; equipment = mowing + line-marking machine hours. The
 * outlook plans no overseeding, so its seed is 0.
 */
export function outlookBudgetFigures(outlooks: readonly OutlookForBudget[], costs: CostSettings): BudgetFigures {
  let labourH = 0;
  let fuelL = 0;
  let nKg = 0;
  let waterM3 = 0;
  let paintL = 0;
  let machineH = 0;
  const fuelOf = (kind: EquipmentKind) => costs.fuelLPerHour[kind] ?? 0;
  for (const o of outlooks) {
    labourH += o.labourHours;
    fuelL += o.mowingHours * fuelOf(MOWER_EQUIPMENT[o.mowerKind]) + o.lineHours * fuelOf('line_marker');
    nKg += o.nKg;
    waterM3 += o.waterM3;
    paintL += o.paintConcentrateL;
    machineH += o.mowingHours + o.lineHours;
  }
  return {
    labour: { quantity: labourH, cost: labourH * costs.labourRatePerHour },
    fuel: { quantity: fuelL, cost: fuelL * costs.fuelPricePerL },
    fertiliser: { quantity: nKg, cost: nKg * costs.fertiliserPricePerKgN },
    water: { quantity: waterM3, cost: waterM3 * costs.waterPricePerM3 },
    paint: { quantity: paintL, cost: paintL * costs.paintPricePerL },
    seed: { quantity: 0, cost: 0 },
    equipment: { quantity: machineH, cost: null },
  };
}

/** What the work records show was used, before pricing (the API sums them in SQL). */
export interface ActualUse {
  /** Hours of done work orders per crew (null: no crew). */
  hoursByCrew: ReadonlyArray<{ crewId: number | null; hours: number }>;
  /** Hours of done work orders per kind of machine they were done with. */
  hoursByEquipment: ReadonlyArray<{ kind: EquipmentKind; hours: number }>;
  nKg: number;
  waterM3: number;
  paintConcentrateL: number;
  seedKg: number;
}

/**
 * Actual use priced with the cost settings: each crew's hours at its own rate (else the
 * department's), fuel = machine hours × the kind's L/h × the fuel price, and the products at
 * their prices.
 */
export function actualBudgetFigures(use: ActualUse, costs: CostSettings): BudgetFigures {
  let labourH = 0;
  let labourCost = 0;
  for (const c of use.hoursByCrew) {
    labourH += c.hours;
    labourCost += c.hours * crewRatePerHour(costs, c.crewId);
  }
  let fuelL = 0;
  let machineH = 0;
  for (const e of use.hoursByEquipment) {
    fuelL += e.hours * (costs.fuelLPerHour[e.kind] ?? 0);
    machineH += e.hours;
  }
  return {
    labour: { quantity: labourH, cost: labourCost },
    fuel: { quantity: fuelL, cost: fuelL * costs.fuelPricePerL },
    fertiliser: { quantity: use.nKg, cost: use.nKg * costs.fertiliserPricePerKgN },
    water: { quantity: use.waterM3, cost: use.waterM3 * costs.waterPricePerM3 },
    paint: { quantity: use.paintConcentrateL, cost: use.paintConcentrateL * costs.paintPricePerL },
    seed: { quantity: use.seedKg, cost: use.seedKg * costs.seedPricePerKg },
    equipment: { quantity: machineH, cost: null },
  };
}

/** 1 lb = 0.45359237 kg; 1 oz = 0.028349523125 kg; 1,000 ft² = 92.90304 m² (exact definitions). */
const KG_PER_LB = 0.45359237;
const KG_PER_OZ = 0.028349523125;
const M2_PER_1000_FT2 = 92.90304;

/**
 * Kilograms of a dry product put down at a label rate over an area (m²); null for rates that
 * are not by weight (L/ha, mL/100 m², fl oz/1000 ft², mm depth).
 */
export function productKgApplied(rate: number, rateUnit: string, areaM2: number): number | null {
  switch (rateUnit) {
    case 'g/m²':
      return (rate * areaM2) / 1000;
    case 'kg/ha':
      return (rate * areaM2) / 10_000;
    case 'lb/1000 ft²':
      return (rate * KG_PER_LB * areaM2) / M2_PER_1000_FT2;
    case 'oz/1000 ft²':
      return (rate * KG_PER_OZ * areaM2) / M2_PER_1000_FT2;
    default:
      return null;
  }
}
