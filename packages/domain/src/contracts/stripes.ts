/** A field's stripe pattern and what its pass plan needs. */
import type { StripeMower } from '../engine/stripes.ts';
import type { EquipmentKind, StripePattern } from '../vocabulary.ts';
import type { Instant } from './common.ts';

/** A mower of the field's district the pattern may be planned for, with the figures of its pass plan. */
export interface StripeMowerChoice extends StripeMower {
  id: number;
  name: string;
  kind: EquipmentKind;
}

/** `GET /api/fields/:id/stripes` and the answer of `PATCH`. */
export interface FieldStripes<At extends Instant = string> {
  fieldId: number;
  /** The pattern asked for; null when none is. */
  pattern: StripePattern | null;
  /** The mower chosen for the pass plan; null: the week plan's pick. */
  mowerId: number | null;
  /** The stripe row's version (null while the field has none). */
  version: number | null;
  updatedAt: At | null;
  setByName: string | null;
  /** The district's active mowers, with the department's overlap and turn time of their kind. */
  mowers: StripeMowerChoice[];
  /** The department's mower used when none is chosen (rotary, as the week plan's default). */
  defaultMower: StripeMower;
}
