/** The department's Standards, one row per maintenance level. */
import type { DepartmentParameters, LevelStandard } from '../engine/standards.ts';
import type { Level } from '../vocabulary.ts';
import type { Instant } from './common.ts';

export interface StandardsRow<At extends Instant = string> {
  level: Level;
  data: LevelStandard;
  version: number;
  updatedAt: At;
  updatedBy: number | null;
}

/** `GET /api/standards`: every level and the engine's department parameters. */
export interface StandardsAnswer<At extends Instant = string> {
  levels: StandardsRow<At>[];
  parameters: DepartmentParameters;
}

/** `PATCH /api/standards/:level`. */
export interface StandardAnswer<At extends Instant = string> {
  standard: StandardsRow<At>;
}
