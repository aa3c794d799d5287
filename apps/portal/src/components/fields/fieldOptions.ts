/** The select options of a field's kind: what both the new-field form and the edit dialog offer. */
import { GRASS_LABELS, GRASSES, IRRIGATION_KINDS, IRRIGATION_LABELS, LEVEL_NAMES, LEVELS, ROOTZONE_LABELS, ROOTZONES, SPORT_LABELS, SPORTS } from '@swardwise/domain';
import { optionsOf } from '../../utils/options.ts';

export const SPORT_OPTIONS = optionsOf(SPORTS, SPORT_LABELS);
export const LEVEL_OPTIONS = optionsOf(LEVELS, (l) => `${l} ${LEVEL_NAMES[l]}`);
export const GRASS_OPTIONS = optionsOf(GRASSES, GRASS_LABELS);
export const ROOTZONE_OPTIONS = optionsOf(ROOTZONES, ROOTZONE_LABELS);
export const IRRIGATION_OPTIONS = optionsOf(IRRIGATION_KINDS, IRRIGATION_LABELS);
