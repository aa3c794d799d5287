/**
 * Costs and rates: the starting values of a department that has not set its own, the rate of a
 * crew, and prices per the user's units (stored per L, m³ and kg; shown per gallon, 1,000
 * gallons and pound in imperial units).
 */
import type { CostSettings } from './schemas/costs.ts';
import { KG_PER_LB, L_PER_US_GALLON } from './engine/units.ts';
import type { UnitSystem } from './vocabulary.ts';

/**
 * Starting values until the department enters its own: invented round figures of the usual
 * order of magnitude for a US parks department (common practice, not quotes; every
 * department replaces them with its own).
 */
export const DEFAULT_COSTS: CostSettings = {
  currency: 'USD',
  labourRatePerHour: 38,
  crewRates: [],
  fuelPricePerL: 1.0,
  fuelLPerHour: { reel_mower: 4, rotary_mower: 6, flail_mower: 8, line_marker: 0.5, spreader: 1, sprayer: 2 },
  waterPricePerM3: 1.3,
  fertiliserPricePerKgN: 4.5,
  seedPricePerKg: 9,
  paintPricePerL: 3.2,
  colourantPricePerL: 8,
};

/** A crew's labour rate per hour: its own, else the department's. */
export function crewRatePerHour(costs: Pick<CostSettings, 'labourRatePerHour' | 'crewRates'>, crewId: number | null): number {
  return costs.crewRates.find((r) => r.crewId === crewId)?.ratePerHour ?? costs.labourRatePerHour;
}

/** What a price is per: the SI unit it is stored in, and the unit a user of each system reads. */
export type PriceBasis = 'litre' | 'cubic_metre' | 'kilogram';

/** How many stored units one shown unit holds (1 US gal = 3.785 L; 1,000 US gal = 3.785 m³; 1 lb = 0.4536 kg). */
const SHOWN_PER: Record<PriceBasis, { imperial: number; label: Record<UnitSystem, string> }> = {
  litre: { imperial: L_PER_US_GALLON, label: { metric: 'L', imperial: 'gal' } },
  cubic_metre: { imperial: L_PER_US_GALLON, label: { metric: 'm³', imperial: '1,000 gal' } },
  kilogram: { imperial: KG_PER_LB, label: { metric: 'kg', imperial: 'lb' } },
};

/** A stored price (per L, m³ or kg) as the user reads it (per gal, 1,000 gal or lb in imperial). */
export function priceForUnits(stored: number, basis: PriceBasis, units: UnitSystem): number {
  return units === 'imperial' ? stored * SHOWN_PER[basis].imperial : stored;
}

/** A price the user entered in his units, as stored (per L, m³ or kg). */
export function priceFromUnits(shown: number, basis: PriceBasis, units: UnitSystem): number {
  return units === 'imperial' ? shown / SHOWN_PER[basis].imperial : shown;
}

/** The unit a price is per, in the user's units ("gal", "1,000 gal", "lb"). */
export function priceUnit(basis: PriceBasis, units: UnitSystem): string {
  return SHOWN_PER[basis].label[units];
}

/** Fuel use per hour in the user's units (L/h or gal/h). */
export function fuelRateForUnits(lPerHour: number, units: UnitSystem): number {
  return units === 'imperial' ? lPerHour / L_PER_US_GALLON : lPerHour;
}

export function fuelRateFromUnits(shown: number, units: UnitSystem): number {
  return units === 'imperial' ? shown * L_PER_US_GALLON : shown;
}
