import { describe, expect, test } from 'vitest';
import type { Ctx } from './context.ts';
import { cachedAnswer, sharedFingerprint } from './answer-cache.ts';

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

describe('cachedAnswer', () => {
  test('should build an answer missed by several callers at once only once, and keep it', async () => {
    const db = { execute: async () => ({ rows: [{ v: 'same' }] }) } as unknown as Ctx['db'];
    const ctx = { db, actor: { role: 'head', districtId: null, crewId: null, siteIds: [] } } as unknown as Ctx;
    let builds = 0;
    let finish!: (v: string) => void;
    const build = () => {
      builds += 1;
      return new Promise<string>((resolve) => (finish = resolve));
    };
    const waiting = [1, 2, 3].map(() => cachedAnswer(ctx, 'fields', 'k', build));
    // Let every caller read the fingerprint and find the build under way.
    for (let i = 0; i < 10; i += 1) await Promise.resolve();
    expect(builds).toBe(1);
    finish('answer');
    expect(await Promise.all(waiting)).toEqual(['answer', 'answer', 'answer']);
    expect(await cachedAnswer(ctx, 'fields', 'k', build)).toBe('answer');
    expect(builds).toBe(1);
  });

  test('should not keep a failed build: the next caller builds again', async () => {
    const db = { execute: async () => ({ rows: [{ v: 'same' }] }) } as unknown as Ctx['db'];
    const ctx = { db, actor: { role: 'head', districtId: null, crewId: null, siteIds: [] } } as unknown as Ctx;
    await expect(cachedAnswer(ctx, 'fields', 'k', () => Promise.reject(new Error('no')))).rejects.toThrow('no');
    expect(await cachedAnswer(ctx, 'fields', 'k', async () => 'built')).toBe('built');
  });
});
