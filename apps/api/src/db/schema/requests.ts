/** Partners' requests of the department, their threads and photos. */
import { date, index, integer, pgTable, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { LineLayout, RequestKind, RequestState } from '@swardwise/domain';
import { districtRef, fieldRef, sites } from './city.ts';
import { createdBy, storedPhoto, users } from './people.ts';
import { fieldEvents, workOrders } from './work.ts';
import { createdAt, id, instant, versioned } from './columns.ts';

/**
 * A partner's request about a field: lines for a game, a wet area, damaged turf, a safety
 * concern. It carries its field's site and district so scope checks need no join. A game
 * request the foreman schedules becomes a booking (`event_id`), which the week plan paints
 * before; any other kind becomes one work order (`work_order_id`).
 */
export const fieldRequests = pgTable(
  'field_requests',
  {
    ...id,
    ...fieldRef,
    siteId: integer('site_id')
      .notNull()
      .references(() => sites.id),
    ...districtRef,
    kind: text('kind').$type<RequestKind>().notNull(),
    gameOn: date('game_on', { mode: 'string' }),
    startTime: text('start_time'),
    layout: text('layout').$type<LineLayout>(),
    description: text('description').notNull(),
    state: text('state').$type<RequestState>().notNull().default('requested'),
    /** Why it was declined, or the foreman's word on scheduling or closing it. */
    reason: text('reason').notNull().default(''),
    eventId: integer('event_id').references(() => fieldEvents.id, { onDelete: 'set null' }),
    workOrderId: integer('work_order_id').references(() => workOrders.id, { onDelete: 'set null' }),
    ...createdBy,
    decidedBy: integer('decided_by').references(() => users.id),
    scheduledAt: instant('scheduled_at'),
    closedAt: instant('closed_at'),
    ...versioned,
  },
  (t) => [
    index('field_requests_district_idx').on(t.districtId, t.state),
    index('field_requests_site_idx').on(t.siteId, t.state),
    index('field_requests_event_idx').on(t.eventId),
    index('field_requests_order_idx').on(t.workOrderId),
  ],
);

const requestRef = {
  requestId: integer('request_id')
    .notNull()
    .references(() => fieldRequests.id, { onDelete: 'cascade' }),
};

/** The thread of a request: the foreman's answers and the partner's replies, oldest first. */
export const fieldRequestMessages = pgTable(
  'field_request_messages',
  {
    ...id,
    ...requestRef,
    authorId: integer('author_id').references(() => users.id),
    body: text('body').notNull(),
    ...createdAt,
  },
  (t) => [index('field_request_messages_request_idx').on(t.requestId)],
);

/** Photos a partner adds to a request, stored like crews' work photos (re-encoded JPEG, no metadata). */
export const fieldRequestPhotos = pgTable(
  'field_request_photos',
  {
    ...id,
    ...requestRef,
    ...storedPhoto,
  },
  (t) => [index('field_request_photos_request_idx').on(t.requestId), uniqueIndex('field_request_photos_file_key').on(t.requestId, t.fileName)],
);
