/** Private calendar feeds: a partner's of their fields, a crew's made by its foreman. */
import type { Instant } from './common.ts';

/** A feed that works now (its secret address was shown once, when it was made). */
export interface CalendarFeedRow<At extends Instant = string> {
  id: number;
  createdAt: At;
}

/** One feed the caller may have: the partner's own, or one per crew of a foreman's district. */
export interface CalendarFeedSlot<At extends Instant = string> {
  kind: 'partner' | 'crew';
  /** The crew of a crew feed; null for a partner's. */
  crewId: number | null;
  /** What the feed shows, in words: "Your fields" or the crew's name. */
  name: string;
  /** The working feed, or null when none was made or it was revoked. */
  feed: CalendarFeedRow<At> | null;
}

/** `GET /api/calendar-feeds`. */
export interface CalendarFeedList<At extends Instant = string> {
  items: CalendarFeedSlot<At>[];
}

/** `POST /api/calendar-feeds`: the new feed and its secret address, shown this once. */
export interface CalendarFeedCreated<At extends Instant = string> {
  feed: CalendarFeedRow<At>;
  url: string;
}
