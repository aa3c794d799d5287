/** The department's costs and rates: what an hour, a litre of fuel, water and each product cost. */
import { z } from 'zod';
import { EQUIPMENT_KINDS } from '../vocabulary.ts';
import { idSchema, versionSchema } from './common.ts';

/** Largest price or rate the form takes: far above any real one, so a slip of the keyboard is caught. */
export const MAX_PRICE = 100_000;

const price = (what: string) =>
  z
    .number({ error: `${what} is a number` })
    .finite(`${what} is a number`)
    .min(0, `${what} cannot be negative`)
    .max(MAX_PRICE, `${what} is at most ${MAX_PRICE.toLocaleString('en-US')}`);

/** Prices are stored per SI unit (L, m³, kg); the portal shows them per the user's units. */
export const costSettingsSchema = z.object({
  /** ISO 4217 code of the department's currency. */
  currency: z.string().trim().regex(/^[A-Z]{3}$/, 'the currency is a three-letter code such as USD'),
  /** Labour cost per crew hour, wages and overheads, when the crew has no rate of its own. */
  labourRatePerHour: price('the labour rate'),
  /** A crew's own rate per hour (a crew of three costs more than a crew of two). */
  crewRates: z
    .array(z.object({ crewId: idSchema, ratePerHour: price('the crew rate') }))
    .max(500, 'at most 500 crew rates')
    .refine((rows) => new Set(rows.map((r) => r.crewId)).size === rows.length, 'each crew has one rate'),
  fuelPricePerL: price('the fuel price'),
  /** Fuel burnt per machine hour, by kind of machine, L/h. */
  fuelLPerHour: z.partialRecord(z.enum(EQUIPMENT_KINDS), price('fuel per hour')),
  waterPricePerM3: price('the water price'),
  /** Fertiliser priced by the kilogram of nitrogen it carries (how feed programmes are compared). */
  fertiliserPricePerKgN: price('the fertiliser price'),
  seedPricePerKg: price('the seed price'),
  /** Line-marking paint concentrate, before dilution. */
  paintPricePerL: price('the paint price'),
  colourantPricePerL: price('the colourant price'),
});
export type CostSettings = z.infer<typeof costSettingsSchema>;

export const updateCostSettingsSchema = costSettingsSchema.extend({ version: versionSchema });
export type UpdateCostSettingsInput = z.infer<typeof updateCostSettingsSchema>;
