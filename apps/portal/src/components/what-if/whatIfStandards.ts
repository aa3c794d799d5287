/**
 * The Standards a what-if may change, as a form holds them (shares as percent, blank = keep
 * the stored value), and back to the API's shape.
 */
import type { LevelStandard, WhatIfInput } from '@swardwise/domain';

export type StandardKey = 'minMowingsPerWeek' | 'maxMowingIntervalDays' | 'annualNShare' | 'irrigationShareOfEtc' | 'lineRepaintDays';

export const STANDARD_INPUTS: ReadonlyArray<{ key: StandardKey; label: string; unit: string; min: number; max: number; step: number; percent: boolean }> = [
  { key: 'minMowingsPerWeek', label: 'Least mowings per week', unit: 'a week', min: 0, max: 14, step: 1, percent: false },
  { key: 'maxMowingIntervalDays', label: 'Longest interval between mowings', unit: 'days', min: 1, max: 60, step: 1, percent: false },
  { key: 'annualNShare', label: 'Feed share of upper annual N', unit: '%', min: 0, max: 100, step: 5, percent: true },
  { key: 'irrigationShareOfEtc', label: 'Irrigation: share of ETc', unit: '%', min: 0, max: 100, step: 5, percent: true },
  { key: 'lineRepaintDays', label: 'Repaint lines every', unit: 'days', min: 1, max: 120, step: 1, percent: false },
];

/** Per level ("1"–"4"), the values typed; undefined keeps the stored one. */
export type StandardsDraft = Record<string, Partial<Record<StandardKey, number | undefined>>>;

type Changes = NonNullable<WhatIfInput['standards']>;

export function draftToChanges(draft: StandardsDraft): Changes {
  const out: Record<string, Record<string, number>> = {};
  for (const [level, values] of Object.entries(draft)) {
    for (const input of STANDARD_INPUTS) {
      const v = values[input.key];
      if (v === undefined || v === null || Number.isNaN(v)) continue;
      (out[level] ??= {})[input.key] = input.percent ? Math.round(v * 10) / 1000 : v;
    }
  }
  return out as Changes;
}

export function changesToDraft(changes: Changes | undefined): StandardsDraft {
  const out: StandardsDraft = {};
  for (const [level, values] of Object.entries(changes ?? {})) {
    const row: Partial<Record<StandardKey, number>> = {};
    for (const input of STANDARD_INPUTS) {
      const v = (values as Partial<Record<StandardKey, number | null | boolean>>)[input.key];
      if (typeof v === 'number') row[input.key] = input.percent ? Math.round(v * 1000) / 10 : v;
    }
    out[level] = row;
  }
  return out;
}

/** A stored Standard as the form shows it ("2", "85 %", "not irrigated"). */
export function storedText(data: LevelStandard | undefined, key: StandardKey): string {
  if (!data) return '';
  const v = data[key];
  if (v === null || v === undefined) return key === 'irrigationShareOfEtc' ? 'not irrigated' : 'none';
  const input = STANDARD_INPUTS.find((i) => i.key === key)!;
  return input.percent ? `${Math.round(Number(v) * 100)} %` : String(v);
}

/** The changes in words, for a list of what a scenario holds ("Level 2: least mowings per week 3"). */
export function changesWords(changes: Changes | undefined): string[] {
  const words: string[] = [];
  for (const [level, values] of Object.entries(changes ?? {})) {
    const parts = STANDARD_INPUTS.flatMap((i) => {
      const v = (values as Partial<Record<StandardKey, number | null>>)[i.key];
      if (v === undefined) return [];
      const label = i.label.charAt(0).toLowerCase() + i.label.slice(1);
      if (v === null) return [`${label}: none`];
      return [`${label}: ${i.percent ? `${Math.round(v * 100)} %` : i.unit === 'days' ? `${v} days` : v}`];
    });
    if (parts.length) words.push(`Level ${level}: ${parts.join('; ')}`);
  }
  return words;
}

/** The Standards a what-if works out the season with (the others — HOC, checks, cultural work — leave the outlook as it is). */
const OUTLOOK_KEYS = ['minMowingsPerWeek', 'maxMowingIntervalDays', 'annualNShare', 'irrigationShareOfEtc', 'reducedKc', 'lineRepaintDays'] as const;

/** A level's edit as a what-if change: the outlook's Standards that differ from the stored ones. */
export function standardsEditChange(level: number, edited: Partial<Pick<LevelStandard, (typeof OUTLOOK_KEYS)[number]>>, stored: LevelStandard): Changes {
  const changed: Record<string, unknown> = {};
  for (const key of OUTLOOK_KEYS) if (edited[key] !== undefined && edited[key] !== stored[key]) changed[key] = edited[key];
  return { [String(level)]: changed } as Changes;
}
