/** The field-check form's model, what it sends, and the words for the engine's flags. */
import type { FieldCheckBody, FieldCheckFlag, HardnessDevice, UnitSystem, WearArea } from '@swardwise/domain';
import { hocToMm } from '../../utils/units.ts';

export interface FieldCheckModel {
  turfCoverPct: number | null;
  weedsPct: number | null;
  bareWornPct: number | null;
  bareAreas: WearArea[];
  /** In the person's unit (in or mm), as the form shows it. */
  height: number | null;
  hardnessDevice: HardnessDevice | null;
  /** One entry per point tested; empty entries are left out. */
  readings: (number | null)[];
  evenness: number | null;
  divots: number | null;
  tornLeafTips: boolean;
  notes: string;
  actualHours: number | null;
}

export const emptyFieldCheck = (plannedHours: number | null = null): FieldCheckModel => ({
  turfCoverPct: null,
  weedsPct: null,
  bareWornPct: null,
  bareAreas: [],
  height: null,
  hardnessDevice: null,
  readings: [null, null, null, null, null],
  evenness: null,
  divots: null,
  tornLeafTips: false,
  notes: '',
  actualHours: plannedHours,
});

/** The body the API parses (`fieldCheckSchema`); the server checks it again. */
export function fieldCheckBody(m: FieldCheckModel, units: UnitSystem): Record<keyof FieldCheckBody, unknown> {
  const readings = m.readings.filter((r): r is number => typeof r === 'number');
  return {
    turfCoverPct: m.turfCoverPct,
    weedsPct: m.weedsPct,
    bareWornPct: m.bareWornPct,
    bareAreas: m.bareAreas,
    heightMm: m.height === null ? null : hocToMm(m.height, units),
    hardnessReadingsG: readings,
    // A tester without readings was not used.
    hardnessDevice: readings.length ? m.hardnessDevice : null,
    evenness: m.evenness,
    divots: m.divots,
    tornLeafTips: m.tornLeafTips,
    notes: m.notes,
    actualHours: m.actualHours,
  };
}

/** What each flag of a check means, in a line. */
export const FLAG_LABELS: Record<FieldCheckFlag, string> = {
  close_field_caution: 'Hardness above the tester’s limit: consider closing the field (local policy decides)',
  hardness_above_target: 'Hardness above the target',
  soft_surface: 'Soft or wet surface: restrict play until it drains',
  overdue_mowing: 'Grass above 1.5 × HOC: lower it in steps',
  scalped: 'Cut below HOC',
  low_cover: 'Turf cover below 60 %',
  cover_below_target: 'Turf cover below the level’s target',
  check_blade_sharpness: 'Torn or browned leaf tips: check blade sharpness before suspecting disease',
  divots_to_repair: 'Many divots to repair',
};
