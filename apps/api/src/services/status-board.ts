/**
 * The public status board: every kept field of the department with its status, the reason in
 * plain words and the last change. Read without signing in, so it says nothing else: no ids,
 * no people, no internal notes. Built in one query and kept as JSON with its ETag until a
 * field, site, district or closure changes.
 */
import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { CLOSURE_REASON_PUBLIC, type ClosureReason, type ClosureStatus, type FieldStatus, type Sport, type StatusBoard, type StatusBoardDistrict } from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import { districts, fieldClosures, fields, sites } from '../db/schema/index.ts';

export interface BuiltBoard {
  json: string;
  etag: string;
}

/** Changes with any write to the tables the board reads (a closure always bumps its field's version). */
async function fingerprint(db: Queryable): Promise<string> {
  const res = await db.execute<{ v: string }>(sql`select concat_ws('|',
    (select count(*) || ':' || coalesce(sum(${fields.version}), 0) || ':' || coalesce(max(${fields.updatedAt})::text, '') || ':' || coalesce(max(${fields.id}), 0) from ${fields}),
    (select count(*) || ':' || coalesce(sum(${sites.version}), 0) || ':' || coalesce(max(${sites.updatedAt})::text, '') from ${sites}),
    (select count(*) || ':' || coalesce(max(${districts.updatedAt})::text, '') from ${districts}),
    (select count(*) || ':' || coalesce(max(${fieldClosures.id}), 0) from ${fieldClosures})
  ) as v`);
  return String(res.rows[0]!.v);
}

type BoardRow = {
  district: string;
  site: string;
  address: string;
  field: string;
  sport: Sport;
  status: FieldStatus;
  reason: ClosureReason | null;
  since: string | null;
  reopen: string | null;
};

/** The one query: fields with their site, district and the decision in force (at most one per field, a unique index). */
async function readRows(db: Queryable): Promise<BoardRow[]> {
  const res = await db.execute<BoardRow>(sql`
    select d.name as district, s.name as site, s.address as address, f.name as field, f.sport as sport, f.status as status,
      c.reason as reason, to_char(c.from_at at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') as since, c.expected_reopen_on::text as reopen
    from ${fields} f
    join ${sites} s on s.id = f.site_id
    join ${districts} d on d.id = s.district_id
    left join ${fieldClosures} c on c.field_id = f.id and c.to_at is null
    where f.status <> 'retired'
    order by d.name, d.id, s.name, s.id, f.name, f.id`);
  return res.rows;
}

function build(rows: BoardRow[], at: Date): StatusBoard {
  const counts: Record<ClosureStatus, number> = { open: 0, restricted: 0, closed: 0 };
  const out: StatusBoardDistrict[] = [];
  for (const r of rows) {
    const status = r.status as ClosureStatus;
    counts[status]++;
    let d = out.at(-1);
    if (!d || d.name !== r.district) out.push((d = { name: r.district, sites: [] }));
    let s = d.sites.at(-1);
    if (!s || s.name !== r.site) d.sites.push((s = { name: r.site, address: r.address, fields: [] }));
    const closed = status !== 'open';
    s.fields.push({
      name: r.field,
      sport: r.sport,
      status,
      // A status set on the field without a recorded closure still gets words, never its internal note.
      reason: closed ? (r.reason ? CLOSURE_REASON_PUBLIC[r.reason] : CLOSURE_REASON_PUBLIC.other) : null,
      since: r.since,
      expectedReopenOn: closed ? r.reopen : null,
    });
  }
  return { at: at.toISOString(), counts, districts: out };
}

const boards = new WeakMap<object, { key: string; board: BuiltBoard }>();

/** The board as JSON and its ETag, rebuilt only when the data changed. */
export async function statusBoard(db: Queryable, now: Date): Promise<BuiltBoard> {
  const key = await fingerprint(db);
  const cached = boards.get(db);
  if (cached && cached.key === key) return cached.board;
  const json = JSON.stringify(build(await readRows(db), now));
  // The ETag follows the data, not the build time, so an unchanged board answers 304 after a restart too.
  const etag = `"${createHash('sha256').update(key).digest('base64url').slice(0, 27)}"`;
  const board = { json, etag };
  boards.set(db, { key, board });
  return board;
}
