/**
 * The cached answers' fingerprint is the change counters of `answer_versions`, bumped by
 * triggers in the writing transaction. Any write to a table the answers read, by this API or
 * another process on the same database (a second connection here; on PostgreSQL a real second
 * client), gives a new fingerprint on the next request, and a write rolled back gives none.
 */
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { localWriteCount, openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { cachedAnswer, sharedFingerprint } from '../../apps/api/src/services/answer-cache.ts';
import type { Ctx } from '../../apps/api/src/services/context.ts';
import { applications, equipment, fieldChecks, settings } from '../../apps/api/src/db/schema/index.ts';
import { clonePostgresDatabase, startTestApi, type TestApi } from '../support/app.ts';
import { giveWork, type Fixture } from '../support/fixture.ts';

/** Every table a cached answer (field list, map, a field's needs, the sites compare) reads. */
const TABLES = ['districts', 'sites', 'fields', 'field_checks', 'weather_stations', 'weather_days', 'standards', 'work_orders', 'settings', 'applications', 'equipment'];

let api: TestApi | undefined;
let clone: { url: string; drop(): Promise<void> } | undefined;
/** The reader asks for fingerprints; on PostgreSQL the writer is a client of its own, as another API process. */
let reader: Database;
let other: Database;

beforeAll(async () => {
  const pg = inject('postgres');
  let fixture: Fixture;
  if (pg) {
    clone = await clonePostgresDatabase('fixture');
    reader = await openDatabase({ databaseUrl: clone.url });
    other = await openDatabase({ databaseUrl: clone.url });
    fixture = pg.fixture;
  } else {
    api = await startTestApi();
    reader = other = api.database;
    fixture = api.fixture;
  }
  // The test city has no rows in these yet: one each, to write again below.
  await giveWork(other.db, fixture.fields.northSoccer, fixture.crews.north, 1);
  await other.db.insert(fieldChecks).values({ fieldId: fixture.fields.northSoccer, checkedOn: '2026-05-20', turfCoverPct: 90, weedsPct: 5, barePct: 5, score: 80 });
  await other.db.insert(settings).values({ key: 'answer_versions_test', value: true });
  await other.db.insert(equipment).values({ districtId: fixture.districts.north, kind: 'rotary_mower', name: 'Counter test mower' });
  await other.db.insert(applications).values({
    fieldId: fixture.fields.northSoccer, siteId: fixture.sites.northPark, districtId: fixture.districts.north, task: 'overseed', product: 'Counter test seed',
    rate: 4, rateUnit: 'lb/1000 ft²', areaM2: 100, appliedOn: '2026-05-20', applicator: 'Counter test',
  });
});
afterAll(async () => {
  if (clone) {
    await reader.close();
    await other.close();
    await clone.drop();
  }
  await api?.close();
});

const writer = () => other.db;

/** One row of the table written again unchanged: the cheapest write there is, and one the old sums missed. */
async function touchOneRow(table: string): Promise<number> {
  const db = writer();
  const column = (
    await db.execute(
      sql`select column_name as c from information_schema.columns where table_schema = current_schema() and table_name = ${table} and is_identity = 'NO' and is_generated = 'NEVER' order by ordinal_position limit 1`,
    )
  ).rows[0] as { c: string };
  const res = await db.execute(
    sql`update ${sql.identifier(table)} set ${sql.identifier(column.c)} = ${sql.identifier(column.c)} where ctid = (select ctid from ${sql.identifier(table)} limit 1) returning 1 as one`,
  );
  return res.rows.length;
}

describe('answer fingerprint', () => {
  test.each(TABLES)('should change after a write to %s', async (table) => {
    const before = await sharedFingerprint(reader.db);
    expect(await sharedFingerprint(reader.db)).toBe(before);
    expect(await touchOneRow(table)).toBe(1);
    expect(await sharedFingerprint(reader.db)).not.toBe(before);
  });

  test('should not change for a write rolled back, nor for tables no answer reads', async () => {
    const before = await sharedFingerprint(reader.db);
    await writer()
      .transaction(async (tx) => {
        await tx.execute(sql`update fields set name = name || ' (draft)'`);
        throw new Error('rolled back');
      })
      .catch(() => undefined);
    await writer().execute(sql`update sessions set expires_at = expires_at`);
    expect(await sharedFingerprint(reader.db)).toBe(before);
  });
});

describe('the counters of the tables a work order links', () => {
  const counters = async () =>
    Object.fromEntries(((await writer().execute(sql`select scope, version from answer_versions`)).rows as { scope: string; version: string | number }[]).map((r) => [r.scope, Number(r.version)]));

  test('should stay when a statement changes no row, and rise when one does', async () => {
    const { fieldId, crewId } = (await writer().execute(sql`select field_id as "fieldId", crew_id as "crewId" from work_orders where crew_id is not null limit 1`)).rows[0] as { fieldId: number; crewId: number };
    // A generated order no check or seed record names, removed as a week is generated anew:
    // the database clears the links to it in both tables, finding none to clear.
    const loose = await giveWork(writer(), fieldId, crewId, 2);
    let before = await counters();
    await writer().execute(sql`delete from work_orders where id = ${loose}`);
    let after = await counters();
    expect(after.work_orders).toBeGreaterThan(before.work_orders!);
    expect(after.field_checks).toBe(before.field_checks);
    expect(after.applications).toBe(before.applications);
    // An update that matches nothing (a stale version, say) is no write either.
    before = after;
    await writer().execute(sql`update fields set name = name where id = -1`);
    expect((await counters()).fields).toBe(before.fields);

    // An order a check names: clearing the check's link is a change to the checks.
    const named = await giveWork(writer(), fieldId, crewId, 3);
    await writer().execute(sql`update field_checks set work_order_id = ${named} where id = (select min(id) from field_checks)`);
    before = await counters();
    await writer().execute(sql`delete from work_orders where id = ${named}`);
    after = await counters();
    expect(after.field_checks).toBeGreaterThan(before.field_checks!);
    expect(after.applications).toBe(before.applications);
    // Insert, update and delete of a row each still count.
    for (const [table, write] of [
      ['settings', sql`insert into settings (key, value) values ('answer_versions_rows', 'true'::jsonb)`],
      ['settings', sql`update settings set value = 'false'::jsonb where key = 'answer_versions_rows'`],
      ['settings', sql`delete from settings where key = 'answer_versions_rows'`],
    ] as const) {
      before = await counters();
      await writer().execute(write);
      expect((await counters())[table], String(write.queryChunks)).toBeGreaterThan(before[table]!);
    }
  });
});

describe('write count of a PGlite database', () => {
  test.skipIf(Boolean(inject('postgres')))('should count a write to a table an answer reads, and neither a read nor a session’s expiry', async () => {
    const db = reader.db;
    const count = () => localWriteCount(db)!;
    expect(count()).toEqual(expect.any(Number));
    let before = count();
    await db.execute(sql`select count(*) from fields`);
    await db.execute(sql`update sessions set expires_at = expires_at`);
    expect(count()).toBe(before);
    await db.execute(sql`with w as (update work_orders set notes = notes returning 1) select count(*) from w`);
    expect(count()).toBeGreaterThan(before);
    before = count();
    await db.transaction(async (tx) => {
      await tx.execute(sql`update sites set name = name`);
    });
    expect(count()).toBeGreaterThan(before);
  });
});

describe('an answer that names the tables it reads', () => {
  test('should be kept over writes to other tables and built again after a write to one of its own', async () => {
    const ctx = { db: reader.db, actor: { role: 'head', districtId: null, crewId: null, siteIds: [] }, clock: { today: () => '2026-05-20' } } as unknown as Ctx;
    let builds = 0;
    const read = () => cachedAnswer(ctx, 'tables-test', 'k', async () => ++builds, { tables: ['fields', 'weather_days'] });
    expect(await read()).toBe(1);
    expect(await read()).toBe(1);
    // Work logged, a field check, a seed record, a machine: none of its tables.
    for (const table of ['work_orders', 'field_checks', 'applications', 'equipment']) {
      expect(await touchOneRow(table)).toBe(1);
      expect(await read(), table).toBe(1);
    }
    expect(await touchOneRow('fields')).toBe(1);
    expect(await read()).toBe(2);
    expect(await touchOneRow('weather_days')).toBe(1);
    expect(await read()).toBe(3);
    expect(await read()).toBe(3);
  });
});
