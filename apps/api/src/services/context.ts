/** The caller's identity, passed explicitly into every service. */
import { asSubject, errors, defineAbilityFor, type Action, type Actor, type AppAbility, type ScopedRow, type SubjectName } from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import type { Clock } from './clock.ts';

export interface Ctx {
  db: Queryable;
  actor: Actor;
  /** The signed-in person's name, for what a service writes in their name (a crew lead's e-mail). */
  actorName: string;
  ability: AppAbility;
  /** The department clock: every "today" and local date comes from here. */
  clock: Clock;
}

export function contextFor(db: Queryable, actor: Actor, actorName: string, clock: Clock): Ctx {
  return { db, actor, actorName, ability: abilityOf(actor), clock };
}

/**
 * One ability per actor object: a signed-in user's actor lives as long as the auth cache keeps
 * the user (http/auth.ts), so the rules are built once, not on every request. Abilities are
 * never changed after they are built.
 */
const abilities = new WeakMap<Actor, AppAbility>();
function abilityOf(actor: Actor): AppAbility {
  let ability = abilities.get(actor);
  if (!ability) abilities.set(actor, (ability = defineAbilityFor(actor)));
  return ability;
}

/** Throws 403 unless the actor may do `action` on the subject (or on this row of it). */
export function authorize(ctx: Ctx, action: Action, type: SubjectName, row?: ScopedRow): void {
  const allowed = row ? ctx.ability.can(action, asSubject(type, row)) : ctx.ability.can(action, type);
  if (!allowed) {
    throw errors.forbidden(`Your role may not ${action} this ${type.toLowerCase()}`);
  }
}

export function can(ctx: Ctx, action: Action, type: SubjectName, row: ScopedRow): boolean {
  return ctx.ability.can(action, asSubject(type, row));
}
