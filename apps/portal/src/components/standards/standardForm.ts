/** The Standards form of one level: its model, the rules from the shared zod schema, and the body it sends. */
import { levelStandardChangesSchema, SPORTS, standardHocMmSchema, type LevelStandard, type Sport, type UpdateLevelStandardInput } from '@swardwise/domain';
import type { FormItemRule } from 'element-plus';
import { zodRules } from '../../utils/zodRules.ts';

export interface StandardFormModel {
  name: string;
  hocMm: Record<Sport, { cool: number; warm: number }>;
  minMowingsPerWeek: number;
  maxMowingIntervalDays: number;
  annualNShare: number;
  irrigated: boolean;
  irrigationShareOfEtc: number;
  reducedKc: boolean;
  linesKept: boolean;
  lineRepaintDays: number;
  fieldCheckDays: number;
  targetScore: number;
}

export function formFrom(data: LevelStandard): StandardFormModel {
  return {
    name: data.name,
    hocMm: Object.fromEntries(SPORTS.map((s) => [s, { ...data.hocMm[s] }])) as StandardFormModel['hocMm'],
    minMowingsPerWeek: data.minMowingsPerWeek,
    maxMowingIntervalDays: data.maxMowingIntervalDays,
    annualNShare: data.annualNShare,
    irrigated: data.irrigationShareOfEtc !== null,
    irrigationShareOfEtc: data.irrigationShareOfEtc ?? 0.5,
    reducedKc: data.reducedKc,
    linesKept: data.lineRepaintDays !== null,
    lineRepaintDays: data.lineRepaintDays ?? 14,
    fieldCheckDays: data.fieldCheckDays,
    targetScore: data.targetScore,
  };
}

/** The PATCH body: every editable value, with the version the form was opened at. */
export function bodyFrom(m: StandardFormModel, version: number): UpdateLevelStandardInput {
  return {
    version,
    name: m.name,
    hocMm: m.hocMm,
    minMowingsPerWeek: m.minMowingsPerWeek,
    maxMowingIntervalDays: m.maxMowingIntervalDays,
    annualNShare: m.annualNShare,
    irrigationShareOfEtc: m.irrigated ? m.irrigationShareOfEtc : null,
    reducedKc: m.reducedKc,
    lineRepaintDays: m.linesKept ? m.lineRepaintDays : null,
    fieldCheckDays: m.fieldCheckDays,
    targetScore: m.targetScore,
  };
}

const hocRule = (trigger: 'blur' | 'change' = 'change'): FormItemRule[] => [
  {
    required: true,
    trigger,
    validator: (_rule, value, callback) => {
      const r = standardHocMmSchema.safeParse(value);
      callback(r.success ? undefined : new Error(r.error.issues[0]?.message ?? 'invalid height of cut'));
    },
  },
];

/** Element Plus rules, nested like the model, from the same schema the API parses with. */
export function standardRules() {
  const top = zodRules(levelStandardChangesSchema, { trigger: 'change' });
  return {
    ...top,
    hocMm: Object.fromEntries(SPORTS.map((s) => [s, { cool: hocRule(), warm: hocRule() }])),
  };
}
