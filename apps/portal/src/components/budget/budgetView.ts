/** How the budget page shows a line's quantity: hours as h:mm, volumes and weights in the user's units. */
import { KG_PER_LB, L_PER_US_GALLON, type BudgetLineRow, type UnitSystem } from '@swardwise/domain';
import { hoursMinutes } from '../../utils/units.ts';

const IMPERIAL: Record<string, { unit: string; per: number }> = {
  L: { unit: 'gal', per: L_PER_US_GALLON },
  'L concentrate': { unit: 'gal concentrate', per: L_PER_US_GALLON },
  'm³': { unit: 'thousand gal', per: L_PER_US_GALLON },
  kg: { unit: 'lb', per: KG_PER_LB },
  'kg N': { unit: 'lb N', per: KG_PER_LB },
};

export function quantityText(quantity: number, row: Pick<BudgetLineRow, 'quantityUnit'>, units: UnitSystem): string {
  if (row.quantityUnit === 'h') return `${hoursMinutes(quantity)} h`;
  const conv = units === 'imperial' ? IMPERIAL[row.quantityUnit] : undefined;
  const value = conv ? quantity / conv.per : quantity;
  return `${value.toLocaleString('en-US', { maximumFractionDigits: value >= 100 ? 0 : 1 })} ${conv ? conv.unit : row.quantityUnit}`;
}

export function moneyText(value: number | null, currency: string): string {
  if (value === null) return '—';
  return new Intl.NumberFormat('en-US', { style: 'currency', currency, maximumFractionDigits: 0 }).format(value);
}
