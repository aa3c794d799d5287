/** The department's costs and rates, kept in the settings table; every change audited. */
import { eq, inArray, sql } from 'drizzle-orm';
import { costSettingsSchema, DEFAULT_COSTS, errors, type CostSettings, type CostSettingsAnswer, type UpdateCostSettingsInput } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { crews, settings } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';

export const COSTS_KEY = 'costs';

/** The stored costs and their version, or the starting values (version 1) while none are stored. */
export async function readCosts(db: Queryable): Promise<CostSettingsAnswer> {
  const [row] = await db.select({ value: settings.value }).from(settings).where(eq(settings.key, COSTS_KEY));
  if (!row) return { costs: DEFAULT_COSTS, source: 'default', version: 1 };
  const { version, ...stored } = row.value as CostSettings & { version: number };
  // A stored row from an older release may lack a newer price: the starting value fills it.
  const parsed = costSettingsSchema.safeParse({ ...DEFAULT_COSTS, ...stored });
  return { costs: parsed.success ? parsed.data : DEFAULT_COSTS, source: 'setting', version: Number(version) || 1 };
}

export async function getCosts(ctx: Ctx): Promise<CostSettingsAnswer> {
  authorize(ctx, 'read', 'CostSettings');
  return readCosts(ctx.db);
}

/** Sets every cost and rate at once; the version must be the one read (else 409). Crew rates must name crews that exist. */
export async function updateCosts(ctx: Ctx, input: UpdateCostSettingsInput): Promise<CostSettingsAnswer> {
  authorize(ctx, 'update', 'CostSettings');
  const { version, ...costs } = input;
  return (ctx.db as Db).transaction(async (tx) => {
    const ids = costs.crewRates.map((r) => r.crewId);
    if (ids.length) {
      const known = new Set((await tx.select({ id: crews.id }).from(crews).where(inArray(crews.id, ids))).map((r) => r.id));
      const missing = costs.crewRates.findIndex((r) => !known.has(r.crewId));
      if (missing >= 0) throw errors.noSuch('crew', `body.crewRates.${missing}.crewId`);
    }
    const before = await readCosts(tx);
    const value = { ...costs, version: version + 1 };
    // Unset reads as version 1; the conditional upsert makes two changes from the same version meet a 409.
    const [row] = await tx
      .insert(settings)
      .values({ key: COSTS_KEY, value })
      .onConflictDoUpdate({ target: settings.key, set: { value, updatedAt: new Date() }, setWhere: sql`coalesce((${settings.value}->>'version')::int, 1) = ${version}` })
      .returning();
    if (!row || (before.source === 'default' && version !== 1)) throw errors.versionConflict('settings');
    await writeAudit(tx, {
      actorId: ctx.actor.id,
      action: before.source === 'setting' ? 'update' : 'create',
      entity: 'cost_settings',
      entityId: null,
      districtId: null,
      before: { ...before.costs, version: before.version },
      after: value,
    });
    return { costs, source: 'setting', version: value.version };
  });
}
