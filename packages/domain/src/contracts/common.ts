/**
 * What the API answers, shared by the API (its services are annotated with these types, so a
 * service that drifts fails `tsc`) and the portal (which declares no answer shape of its own).
 *
 * A point in time travels as text: a `Date` inside the API becomes its ISO 8601 string when
 * the answer is serialised (`JSON.stringify` calls `toJSON`). Shapes that carry one take it as
 * a parameter: the API checks its services against `FieldRow<Date>`, the portal reads
 * `FieldRow` (strings). Calendar days (`YYYY-MM-DD`) are strings on both sides.
 */
export type Instant = Date | string;

/** The answer of a list route: `{ items: [...] }`. */
export interface Items<T> {
  items: T[];
}

/** Where a row about one field is: the field, its site and its district, with their names. */
export interface OnField {
  fieldId: number;
  fieldName: string;
  siteId: number;
  siteName: string;
  districtId: number;
}

/** A stored photo (re-encoded, its metadata dropped): its size in pixels and bytes, and where the portal loads it from. */
export interface StoredPhoto<At extends Instant = string> {
  id: number;
  width: number;
  height: number;
  bytes: number;
  createdAt: At;
  url: string;
}
