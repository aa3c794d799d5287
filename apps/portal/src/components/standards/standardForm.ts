/** The Standards form of one level: its model, the rules from the shared zod schema, and the body it sends. */
import {
  CULTURAL_TASKS,
  culturalProgramSchema,
  culturalProgramsOf,
  levelStandardChangesSchema,
  SPORTS,
  standardHocMmSchema,
  type CulturalPrograms,
  type CulturalTask,
  type LevelStandard,
  type Sport,
  type UnitSystem,
  type UpdateLevelStandardInput,
} from '@swardwise/domain';
import type { FormItemRule } from 'element-plus';
import { hocToMm, hocValue } from '../../utils/units.ts';
import { zodRules } from '../../utils/zodRules.ts';

export interface StandardFormModel {
  name: string;
  /** Heights of cut in the person's unit: inches (to 0.001, so eighths stay exact) or millimetres. */
  hoc: Record<Sport, { cool: number; warm: number }>;
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
  /** Aeration, overseeding, topdressing and weed control: times a season and months (no units to convert). */
  cultural: CulturalPrograms;
}

type SeasonHoc = { cool: number; warm: number };
const mapHoc = (hoc: Record<Sport, SeasonHoc>, f: (v: number) => number) =>
  Object.fromEntries(SPORTS.map((s) => [s, { cool: f(hoc[s].cool), warm: f(hoc[s].warm) }])) as Record<Sport, SeasonHoc>;

const copyPrograms = (p: CulturalPrograms): CulturalPrograms =>
  Object.fromEntries(CULTURAL_TASKS.map((t) => [t, { ...p[t], cool: { ...p[t].cool }, warm: { ...p[t].warm } }])) as CulturalPrograms;

export function formFrom(data: LevelStandard, units: UnitSystem): StandardFormModel {
  return {
    name: data.name,
    hoc: mapHoc(data.hocMm, (mm) => hocValue(mm, units)),
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
    // A copy per task (the row may be a reactive proxy, which structuredClone refuses).
    cultural: copyPrograms(culturalProgramsOf(data)),
  };
}

/**
 * The PATCH body: every editable value (heights of cut back in millimetres), with the version
 * the form was opened at. A height shown as it was stored goes back as stored, so saving in
 * inches does not nudge the millimetres of heights nobody touched.
 */
export function bodyFrom(m: StandardFormModel, version: number, units: UnitSystem, stored?: LevelStandard['hocMm']): UpdateLevelStandardInput {
  const back = (sport: Sport, season: keyof SeasonHoc) => {
    const was = stored?.[sport]?.[season];
    const now = m.hoc[sport][season];
    return was !== undefined && hocValue(was, units) === now ? was : hocToMm(now, units);
  };
  return {
    version,
    name: m.name,
    hocMm: Object.fromEntries(SPORTS.map((s) => [s, { cool: back(s, 'cool'), warm: back(s, 'warm') }])) as Record<Sport, SeasonHoc>,
    minMowingsPerWeek: m.minMowingsPerWeek,
    maxMowingIntervalDays: m.maxMowingIntervalDays,
    annualNShare: m.annualNShare,
    irrigationShareOfEtc: m.irrigated ? m.irrigationShareOfEtc : null,
    reducedKc: m.reducedKc,
    lineRepaintDays: m.linesKept ? m.lineRepaintDays : null,
    fieldCheckDays: m.fieldCheckDays,
    targetScore: m.targetScore,
    cultural: copyPrograms(m.cultural),
  };
}

/** The schema judges millimetres; an imperial entry is converted first and the message says so. */
const hocRule = (units: UnitSystem, trigger: 'blur' | 'change' = 'change'): FormItemRule[] => [
  {
    required: true,
    trigger,
    validator: (_rule, value, callback) => {
      const r = standardHocMmSchema.safeParse(typeof value === 'number' ? hocToMm(value, units) : value);
      const message = r.success ? undefined : (r.error.issues[0]?.message ?? 'invalid height of cut');
      callback(message ? new Error(units === 'imperial' ? `${message} (checked after converting to millimetres)` : message) : undefined);
    },
  },
];

/** A rule judging one key of a task's program by the shared schema, given the whole program (a window's end depends on its start). */
const culturalRule = (program: () => unknown, path: string): FormItemRule[] => [
  {
    trigger: 'change',
    validator: (_rule, _value, callback) => {
      const r = culturalProgramSchema.safeParse(program());
      const issue = r.success ? undefined : r.error.issues.find((i) => i.path.join('.') === path);
      callback(issue ? new Error(issue.message) : undefined);
    },
  },
];

/** Element Plus rules, nested like the model, from the same schema the API parses with. */
export function standardRules(units: UnitSystem, model?: StandardFormModel) {
  const top = zodRules(levelStandardChangesSchema, { trigger: 'change' });
  const program = (t: CulturalTask) => () => model?.cultural[t];
  return {
    ...top,
    hoc: Object.fromEntries(SPORTS.map((s) => [s, { cool: hocRule(units), warm: hocRule(units) }])),
    cultural: Object.fromEntries(
      CULTURAL_TASKS.map((t) => [t, { timesPerSeason: culturalRule(program(t), 'timesPerSeason'), cool: { toMonth: culturalRule(program(t), 'cool.toMonth') }, warm: { toMonth: culturalRule(program(t), 'warm.toMonth') } }]),
    ),
  };
}

/** The form's path of an API issue path: the API names heights `hocMm.<sport>.<season>`, the form `hoc.…`. */
export const formPathOf = (apiPath: string) => apiPath.replace(/^hocMm\./, 'hoc.');
