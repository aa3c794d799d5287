/**
 * How the budget and what-if pages show a line's quantity: season hours as whole hours (a
 * season's 2,000 machine hours are not a duration a crew clocks, so not h:mm), volumes and
 * weights in the user's units with the unit written out.
 */
import { KG_PER_LB, L_PER_US_GALLON, type BudgetLineRow, type UnitSystem } from '@swardwise/domain';

const IMPERIAL: Record<string, { unit: string; per: number }> = {
  L: { unit: 'gal', per: L_PER_US_GALLON },
  'L concentrate': { unit: 'gal concentrate', per: L_PER_US_GALLON },
  // 1 m³ = 0.2642 thousand US gallons: m³ ÷ 3.785 (exact definition of the gallon).
  'm³': { unit: 'thousand gal', per: L_PER_US_GALLON },
  kg: { unit: 'lb', per: KG_PER_LB },
  'kg N': { unit: 'lb N', per: KG_PER_LB },
};

/** A quantity as a number in the user's units and the unit it is in ("h", "thousand gal", "lb N"). */
export function quantityInUnits(quantity: number, quantityUnit: string, units: UnitSystem): { value: number; unit: string } {
  const conv = units === 'imperial' ? IMPERIAL[quantityUnit] : undefined;
  return conv ? { value: quantity / conv.per, unit: conv.unit } : { value: quantity, unit: quantityUnit };
}

function numberText(value: number): string {
  return value.toLocaleString('en-US', { maximumFractionDigits: Math.abs(value) >= 100 ? 0 : 1 });
}

export function quantityText(quantity: number, row: Pick<BudgetLineRow, 'quantityUnit'>, units: UnitSystem): string {
  const { value, unit } = quantityInUnits(quantity, row.quantityUnit, units);
  return `${numberText(value)} ${unit}`;
}

/** A change with its sign ("+1,250 h", "−38 lb N", "no change"). */
export function signedQuantityText(quantity: number, quantityUnit: string, units: UnitSystem): string {
  const { value, unit } = quantityInUnits(quantity, quantityUnit, units);
  const text = numberText(Math.abs(value));
  if (text === '0') return 'no change';
  return `${value > 0 ? '+' : '−'}${text} ${unit}`;
}

export function moneyText(value: number | null, currency: string): string {
  if (value === null) return '—';
  return new Intl.NumberFormat('en-US', { style: 'currency', currency, maximumFractionDigits: 0 }).format(value);
}

/** A change of money with its sign ("+$1,200", "−$350", "no change"). */
export function signedMoneyText(value: number | null, currency: string): string {
  if (value === null) return '—';
  const text = moneyText(Math.abs(value), currency);
  if (Math.round(value) === 0) return 'no change';
  return `${value > 0 ? '+' : '−'}${text}`;
}
