/** What the Stripes card draws and lists, from the engine's pass plan; kept apart so it is tested without a DOM. */
import { STRIPE_PATTERN_LABELS, type StripeMower, type StripePlan, type UnitSystem } from '@swardwise/domain';
import { distanceText, hoursMinutes } from '../../utils/units.ts';

const M_PER_FT = 0.3048;
const M_PER_YD = 0.9144;
const KM_PER_MI = 1.609344;

/** A length in metres in the person's unit: feet or metres, whole. */
export function lengthText(m: number, units: UnitSystem): string {
  return units === 'imperial' ? `${Math.round(m / M_PER_FT).toLocaleString('en-US')} ft` : `${Math.round(m).toLocaleString('en-US')} m`;
}

/** A cutting width or overlap: feet to a tenth, or metres to the centimetre. */
export function widthText(m: number, units: UnitSystem): string {
  return units === 'imperial' ? `${(m / M_PER_FT).toFixed(1)} ft` : `${m.toFixed(2)} m`;
}

export function mowerText(m: StripeMower, units: UnitSystem): string {
  const speed = units === 'imperial' ? `${(m.speedKmh / KM_PER_MI).toFixed(1)} mph` : `${m.speedKmh} km/h`;
  return `${widthText(m.widthM, units)} cut, ${widthText(m.overlapM, units)} overlap, ${speed}, ${Math.round(m.efficiency * 100)} % efficiency, ${m.turnTimeS} s a turn`;
}

const DIRECTION_NAMES: Record<number, string> = { 0: 'length-wise', 90: 'side-to-side', 45: 'diagonal' };

/** Passes of each direction in words: "34 length-wise + 53 side-to-side". */
export function passesText(plan: StripePlan): string {
  return plan.directions.map((d) => `${d.passes.length} ${DIRECTION_NAMES[d.angleDeg] ?? `${d.angleDeg}°`}`).join(' + ');
}

export function planFacts(plan: StripePlan, mower: StripeMower, units: UnitSystem) {
  return [
    { label: 'Passes', value: `${plan.passes} (${passesText(plan)})`, test: 'stripes-passes' },
    { label: 'Distance driven', value: distanceText(plan.distanceM / 1000, units), test: 'stripes-distance' },
    { label: 'Time', value: `${hoursMinutes(plan.hours)} h`, test: 'stripes-time' },
    { label: 'Of which turns', value: `${plan.turns} × ${plan.turnTimeS} s = ${hoursMinutes(plan.turnHours)} h` },
    { label: 'Mower', value: mowerText(mower, units) },
  ];
}

/** The scale bar: 20 m, or 20 yd under imperial units. */
export function scaleBar(units: UnitSystem): { lengthM: number; label: string } {
  return units === 'imperial' ? { lengthM: 20 * M_PER_YD, label: '20 yd' } : { lengthM: 20, label: '20 m' };
}

/** The plan view's text alternative. */
export function planDescription(fieldName: string, plan: StripePlan, lengthM: number, widthM: number, units: UnitSystem): string {
  return `${STRIPE_PATTERN_LABELS[plan.pattern]} on ${fieldName}, drawn to scale with the long axis (${lengthText(lengthM, units)}) left to right and the width (${lengthText(widthM, units)}) top to bottom: ${plan.passes} passes (${passesText(plan)}), alternate passes shown light and dark as the stripes they leave.`;
}
