/**
 * The costs form in the user's units and back: prices per L, m³ and kg are shown per gallon,
 * 1,000 gallons and pound in imperial units. A value the user did not touch is sent back
 * exactly as stored, so rounding for display never changes a price on its own.
 */
import {
  EQUIPMENT_KINDS,
  fuelRateForUnits,
  fuelRateFromUnits,
  priceForUnits,
  priceFromUnits,
  type CostSettings,
  type EquipmentKind,
  type PriceBasis,
  type UnitSystem,
  type UpdateCostSettingsInput,
} from '@swardwise/domain';

/** The priced products and what each price is per. */
export const PRICES = [
  { key: 'fuelPricePerL', label: 'Fuel', basis: 'litre' },
  { key: 'waterPricePerM3', label: 'Water', basis: 'cubic_metre' },
  { key: 'fertiliserPricePerKgN', label: 'Fertiliser, per unit of nitrogen', basis: 'kilogram' },
  { key: 'seedPricePerKg', label: 'Seed', basis: 'kilogram' },
  { key: 'paintPricePerL', label: 'Line paint concentrate', basis: 'litre' },
  { key: 'colourantPricePerL', label: 'Turf colourant', basis: 'litre' },
] as const satisfies readonly { key: keyof CostSettings; label: string; basis: PriceBasis }[];
export type PriceKey = (typeof PRICES)[number]['key'];

export interface CostsModel {
  currency: string;
  labourRatePerHour: number | null;
  /** A crew's own rate; null when it uses the department's. */
  crewRates: Record<number, number | null>;
  prices: Record<PriceKey, number | null>;
  fuel: Record<EquipmentKind, number | null>;
}

const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;

export function modelFrom(costs: CostSettings, crewIds: readonly number[], units: UnitSystem): CostsModel {
  return {
    currency: costs.currency,
    labourRatePerHour: costs.labourRatePerHour,
    crewRates: Object.fromEntries(crewIds.map((id) => [id, costs.crewRates.find((r) => r.crewId === id)?.ratePerHour ?? null])),
    prices: Object.fromEntries(PRICES.map((p) => [p.key, round(priceForUnits(costs[p.key], p.basis, units), 2)])) as Record<PriceKey, number>,
    fuel: Object.fromEntries(EQUIPMENT_KINDS.map((k) => [k, costs.fuelLPerHour[k] === undefined ? null : round(fuelRateForUnits(costs.fuelLPerHour[k], units), 2)])) as Record<EquipmentKind, number | null>,
  };
}

/** The body to send: changed values converted back to SI, untouched ones as stored. */
export function bodyFrom(model: CostsModel, stored: CostSettings, version: number, units: UnitSystem): UpdateCostSettingsInput {
  const shown = modelFrom(stored, Object.keys(model.crewRates).map(Number), units);
  const price = (p: (typeof PRICES)[number]) => {
    const v = model.prices[p.key];
    if (v === shown.prices[p.key]) return stored[p.key];
    return v === null ? NaN : round(priceFromUnits(v, p.basis, units), 6);
  };
  const fuelLPerHour: Partial<Record<EquipmentKind, number>> = {};
  for (const k of EQUIPMENT_KINDS) {
    const v = model.fuel[k];
    if (v === null) continue;
    fuelLPerHour[k] = v === shown.fuel[k] && stored.fuelLPerHour[k] !== undefined ? stored.fuelLPerHour[k] : round(fuelRateFromUnits(v, units), 6);
  }
  // Crews not on this page (another district's, for a foreman) keep their rates.
  const others = stored.crewRates.filter((r) => !(r.crewId in model.crewRates));
  const crewRates = [
    ...others,
    ...Object.entries(model.crewRates)
      .filter((e): e is [string, number] => e[1] !== null)
      .map(([id, ratePerHour]) => ({ crewId: Number(id), ratePerHour })),
  ];
  return {
    currency: model.currency.trim().toUpperCase(),
    labourRatePerHour: model.labourRatePerHour ?? NaN,
    crewRates,
    fuelLPerHour,
    ...(Object.fromEntries(PRICES.map((p) => [p.key, price(p)])) as Record<PriceKey, number>),
    version,
  };
}
