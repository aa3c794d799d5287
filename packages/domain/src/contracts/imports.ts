/** Uploads of sites, fields and outlines, previewed then committed. */
import type { ImportKind, ImportRow, ImportStatus, ImportSummary } from '../schemas/imports.ts';
import type { Instant } from './common.ts';

/** A row of `GET /api/imports`. */
export interface ImportListItem<At extends Instant = string> {
  id: number;
  kind: ImportKind;
  status: ImportStatus;
  userId: number;
  userName: string | null;
  districtId: number | null;
  fileName: string;
  summary: ImportSummary;
  createdAt: At;
  committedAt: At | null;
  undoneAt: At | null;
}

/** `GET /api/imports`: the recent imports, and the caller's last committed one (what undo undoes). */
export interface ImportList<At extends Instant = string> {
  items: ImportListItem<At>[];
  lastCommittedId: number | null;
}

/** One import with its rows, as previewed, committed or undone. */
export interface ImportRecord<At extends Instant = string> extends ImportListItem<At> {
  rows: ImportRow[];
  /** How many rows the commit created and updated; null before a commit. */
  changes: { created: number; updated: number } | null;
}

/** `POST /api/imports`, `GET /api/imports/:id`, `…/commit`, `…/undo`. */
export interface ImportAnswer<At extends Instant = string> {
  import: ImportRecord<At>;
}
