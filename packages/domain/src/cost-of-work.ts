/**
 * Money from quantities: what recorded work cost, from the hours, machine hours and inputs put
 * down, priced with the department's cost settings. Pure: the API sums the quantities in SQL
 * and this prices the sums, so a site's cost is the same wherever it is shown.
 */
import { crewRatePerHour } from './costs.ts';
import type { CostSettings } from './schemas/costs.ts';
import type { EquipmentKind, WorkTask } from './vocabulary.ts';

/** Quantities recorded on work orders and applications over a period (SI units). */
export interface WorkQuantities {
  /** Hours done per crew (null: no crew named, priced at the department's rate). */
  labour: ReadonlyArray<{ crewId: number | null; hours: number }>;
  /** Machine hours per machine kind (h). */
  machineHours: Partial<Record<EquipmentKind, number>>;
  /** Nitrogen applied (kg N). */
  fertiliserKgN: number;
  /** Water applied (m³). */
  waterM3: number;
  /** Line-paint concentrate (L). */
  paintL: number;
  /** Seed sown (kg). */
  seedKg: number;
  /** Turf colourant (L). */
  colourantL: number;
}

/** Money per heading, in the department's currency. `inputs` is fertiliser + water + paint + seed + colourant. */
export interface WorkCost {
  labour: number;
  fuel: number;
  fertiliser: number;
  water: number;
  paint: number;
  seed: number;
  colourant: number;
  inputs: number;
  total: number;
}

/** Nothing recorded. */
export const NO_QUANTITIES: WorkQuantities = { labour: [], machineHours: {}, fertiliserKgN: 0, waterM3: 0, paintL: 0, seedKg: 0, colourantL: 0 };

/**
 * Prices recorded work:
 * - labour = Σ hours × the crew's rate per hour (its own, else the department's), currency/h;
 * - fuel = Σ machine hours × fuel use of the kind (L/h) × fuel price (currency/L);
 * - inputs = kg N × price per kg N + m³ water × price per m³ + L paint × price per L
 *   + kg seed × price per kg + L colourant × price per L.
 * Plain unit arithmetic (common practice for a parks department's job costing); the prices
 * and rates are the department's own (DEFAULT_COSTS until it sets them).
 */
export function costOfWork(q: WorkQuantities, costs: CostSettings): WorkCost {
  const labour = q.labour.reduce((sum, l) => sum + l.hours * crewRatePerHour(costs, l.crewId), 0);
  let fuelL = 0;
  for (const [kind, hours] of Object.entries(q.machineHours) as [EquipmentKind, number][]) fuelL += hours * (costs.fuelLPerHour[kind] ?? 0);
  const fuel = fuelL * costs.fuelPricePerL;
  const fertiliser = q.fertiliserKgN * costs.fertiliserPricePerKgN;
  const water = q.waterM3 * costs.waterPricePerM3;
  const paint = q.paintL * costs.paintPricePerL;
  const seed = q.seedKg * costs.seedPricePerKg;
  const colourant = q.colourantL * costs.colourantPricePerL;
  const inputs = fertiliser + water + paint + seed + colourant;
  return { labour, fuel, fertiliser, water, paint, seed, colourant, inputs, total: labour + fuel + inputs };
}

/**
 * The machine a task runs when its order names none: mowing on the mower of its kind (a reel
 * mower when the order says so, else a rotary), lines on the marker, feed and seed through the
 * spreader, weed control and colourant through the sprayer; the rest by hand or on a
 * controller, burning no fuel on the bill (common practice).
 */
export const MACHINE_OF_TASK: Record<WorkTask, EquipmentKind | null> = {
  mow: 'rotary_mower',
  paint_lines: 'line_marker',
  feed: 'spreader',
  overseed: 'spreader',
  weed_control: 'sprayer',
  colourant: 'sprayer',
  irrigate: null,
  // Sharpening is at the yard's grinder: the mower itself does not run.
  sharpen_blades: null,
  field_check: null,
  aerate: null,
  topdress: null,
};
