/** The one audit writer: one entry or many, each stored without passwords, tokens or secrets. */
import { desc } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog } from '../../apps/api/src/db/schema/index.ts';
import { writeAudit, type AuditInput } from '../../apps/api/src/services/audit.ts';
import { useEmptyDatabase } from '../support/app.ts';

const database = useEmptyDatabase();

const entry = (entityId: number): AuditInput => ({
  actorId: null,
  action: 'update',
  entity: 'user',
  entityId,
  districtId: 2,
  before: { id: entityId, name: 'Before', passwordHash: '$argon2id$secret-hash', token: 'one-time-token-1' },
  after: { id: entityId, name: 'After', password: 'plain-password-1', tokenHash: 'hash-of-token', details: { apiKey: 'key-1', clientSecret: 'secret-1', kept: true } },
});
const stored = { before: { id: 0, name: 'Before' }, after: { id: 0, name: 'After', details: { kept: true } } };
const latest = (n: number) => database.db.select().from(auditLog).orderBy(desc(auditLog.id)).limit(n);

describe('writeAudit', () => {
  test('should store one entry without its secrets', async () => {
    await writeAudit(database.db, entry(1));
    const [row] = await latest(1);
    expect(row).toMatchObject({ action: 'update', entity: 'user', entityId: 1, districtId: 2, before: { ...stored.before, id: 1 }, after: { ...stored.after, id: 1 } });
    expect(JSON.stringify(row)).not.toMatch(/secret|token|password|key-1/i);
  });

  test('should store many entries in one statement without their secrets, in order', async () => {
    const entries = [entry(11), entry(12), entry(13)];
    await database.db.transaction((tx) => writeAudit(tx, entries));
    const rows = (await latest(3)).reverse();
    expect(rows.map((r) => r.entityId)).toEqual([11, 12, 13]);
    for (const row of rows) {
      expect(row.before).toEqual({ ...stored.before, id: row.entityId });
      expect(row.after).toEqual({ ...stored.after, id: row.entityId });
      expect(JSON.stringify(row)).not.toMatch(/secret|token|password|key-1/i);
    }
    expect(entries[0]!.after).toHaveProperty('password');
  });

  test('should store the same row for an entry whether written alone or with others', async () => {
    const one = { ...entry(21), before: null };
    await writeAudit(database.db, one);
    await writeAudit(database.db, [{ ...one, entityId: 22 }, { ...one, entityId: 23 }]);
    const [alone, , last] = (await latest(3)).reverse();
    expect(alone!.before).toBeNull();
    expect(last!.before).toBeNull();
    const { id: _a, at: _b, entityId: _c, ...a } = alone!;
    const { id: _d, at: _e, entityId: _f, ...b } = last!;
    expect(b).toEqual(a);
  });

  test('should write nothing for no entries', async () => {
    const before = (await latest(1))[0]!.id;
    await writeAudit(database.db, []);
    expect((await latest(1))[0]!.id).toBe(before);
  });
});
