import { describe, expect, test } from 'vitest';
import type { Ctx } from './context.ts';
import { sharedFingerprint } from './answer-cache.ts';

/** A database whose fingerprint queries answer when the test says, numbered in the order they were sent. */
function fakeDb() {
  const pending: ((v: string) => void)[] = [];
  const db = {
    execute: () => new Promise((resolve) => pending.push((v) => resolve({ rows: [{ v }] }))),
  } as unknown as Ctx['db'];
  return { db, pending };
}

describe('sharedFingerprint', () => {
  test('should run its own query when none is running', async () => {
    const { db, pending } = fakeDb();
    const a = sharedFingerprint(db);
    expect(pending).toHaveLength(1);
    pending[0]!('one');
    expect(await a).toBe('one');
  });

  test('should make callers arriving during a query wait for one query begun after them, shared by all', async () => {
    const { db, pending } = fakeDb();
    const first = sharedFingerprint(db);
    // Arrived while the first query runs: it may have read the tables before their writes.
    const second = sharedFingerprint(db);
    const third = sharedFingerprint(db);
    expect(pending).toHaveLength(1);
    pending[0]!('before');
    expect(await first).toBe('before');
    await Promise.resolve();
    expect(pending).toHaveLength(2);
    // Arrived after the second query began: not served by it either.
    const fourth = sharedFingerprint(db);
    pending[1]!('after');
    expect(await second).toBe('after');
    expect(await third).toBe('after');
    await Promise.resolve();
    expect(pending).toHaveLength(3);
    pending[2]!('latest');
    expect(await fourth).toBe('latest');
  });
});
