import { describe, expect, test } from 'vitest';
import { AppError, type Actor, type SessionUser } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import type { Clock } from '../services/clock.ts';
import { ctxAllowed, ctxOf } from './auth.ts';

const user: SessionUser = { id: 7, email: 'f@test.example', name: 'Rowan Field', role: 'foreman', districtId: 2, crewId: null, siteIds: [], units: 'metric', version: 1 };
const actor: Actor = { id: 7, role: 'foreman', districtId: 2, crewId: null, siteIds: [] };
const clock = {} as Clock;
const db = {} as Db;

describe('ctxOf', () => {
  test('should carry the signed-in person’s name with the actor, so no service looks it up', () => {
    const ctx = ctxOf(db, { actor, user, clock });
    expect(ctx.actor).toBe(actor);
    expect(ctx.actorName).toBe('Rowan Field');
    expect(ctx.ability.can('update', 'WorkOrder')).toBe(true);
  });

  test('should refuse a request without a signed-in user with 401', () => {
    for (const req of [{ clock }, { actor, clock }, { user, clock }]) {
      let thrown: unknown;
      try {
        ctxOf(db, req);
      } catch (err) {
        thrown = err;
      }
      expect(thrown).toBeInstanceOf(AppError);
      expect((thrown as AppError).code).toBe('auth/unauthenticated');
    }
  });
});

describe('ctxAllowed', () => {
  test('should give the context of a caller who may act on the subject, and refuse one who may not with 403', () => {
    expect(ctxAllowed(db, { actor, user, clock }, 'update', 'WorkOrder').actor).toBe(actor);
    expect(() => ctxAllowed(db, { actor, user, clock }, 'update', 'CostSettings')).toThrow(expect.objectContaining({ code: 'auth/forbidden' }));
    expect(() => ctxAllowed(db, { clock }, 'read', 'Site')).toThrow(expect.objectContaining({ code: 'auth/unauthenticated' }));
  });
});
