/** The field page's needs cards, built from the API's answer in the user's units. */
import { LEVEL_NAMES, type FieldNeeds, type Level, type NeedInput, type UnitSystem } from '@swardwise/domain';
import { depthText, hocText, hoursText, lengthText, massText, nRateText, volumeText } from '../../utils/needUnits.ts';
import { DAY_MONTH_YEAR, formatDay } from '../../utils/calendarDate.ts';

export interface Figure {
  label: string;
  value: string;
  test?: string;
}

export interface NeedCardModel {
  key: string;
  title: string;
  figures: Figure[];
  /** Plain-language lines under the figures (warnings, why a block does not apply). */
  notes: { text: string; type: 'info' | 'warning' }[];
  inputs: NeedInput[];
  how: string;
  cautions: string[];
}

const levelName = (l: number) => `${l} ${LEVEL_NAMES[l as Level] ?? ''}`.trim();
const dateText = (iso: string | null) =>
  iso ? formatDay(iso, DAY_MONTH_YEAR) : '—';
const n = (v: number, digits = 1) => v.toLocaleString('en-US', { maximumFractionDigits: digits });

export function buildNeedCards(x: FieldNeeds, u: UnitSystem): NeedCardModel[] {
  const { hoc, growth, mowing, labour, water, feed, lines, level } = x;
  const hocSource = { override: 'field override', standards_grass: 'Standards, for this grass', standards_sport: 'Standards, by sport and grass season' }[hoc.source];
  return [
    {
      key: 'hoc',
      title: 'Height of cut and mower',
      figures: [
        { label: 'HOC', value: hocText(hoc.hocMm, u), test: 'needs-hoc' },
        { label: 'Source', value: hocSource },
        { label: 'Mow before', value: hocText(hoc.triggerHeightMm, u) },
        { label: 'Mower', value: hoc.mowerKind === 'reel' ? 'Reel' : 'Rotary', test: 'needs-mower' },
      ],
      notes: hoc.mowerWarnings.map((w) => ({ text: `The department's default mower: ${w.message}.`, type: 'warning' as const })),
      inputs: hoc.inputs,
      how: hoc.how,
      cautions: hoc.cautions,
    },
    {
      key: 'mowing',
      title: 'Growth and mowing',
      figures: [
        { label: 'Growth potential (mean)', value: n(growth.gpMean, 2) },
        { label: 'Predicted growth', value: `${depthText(growth.growthMmPerDay, u)}/day` },
        { label: 'Mow at least every', value: `${mowing.intervalDays} days (Standards)`, test: 'needs-mowing-interval' },
        ...(mowing.plannedThisWeek
          ? [{ label: `Week plan, week of ${dateText(mowing.plannedThisWeek.weekStart)}`, value: `${mowing.plannedThisWeek.done} of ${mowing.plannedThisWeek.asked} mowings done`, test: 'needs-mowings-planned' }]
          : []),
        { label: 'Predicted mowings per week', value: n(mowing.mowingsPerWeek, 1), test: 'needs-mowings-per-week' },
        { label: 'Next mowing', value: dateText(mowing.nextMowingOn), test: 'needs-next-mowing' },
        { label: 'Overdue from', value: dateText(mowing.overdueOn) },
        { label: 'Last mowed', value: dateText(mowing.lastMowedOn) },
      ],
      notes: [
        ...(mowing.overdueNow ? [{ text: 'Overdue: the grass is predicted above 1.5 × HOC.', type: 'warning' as const }] : []),
        ...(mowing.nextMowingNote ? [{ text: mowing.nextMowingNote, type: 'info' as const }] : []),
      ],
      inputs: [...growth.inputs, ...mowing.inputs],
      how: `${growth.how} ${mowing.how}`,
      cautions: mowing.cautions,
    },
    {
      key: 'labour',
      title: 'Labour',
      figures: [
        { label: 'Per mowing', value: hoursText(labour.hoursPerMowing), test: 'needs-hours-per-mowing' },
        { label: 'Per week', value: hoursText(labour.hoursPerWeek) },
        { label: 'Season', value: hoursText(labour.seasonHours) },
        ...(labour.passPlan
          ? [{ label: 'Passes', value: `${labour.passPlan.passes} × ${lengthText(labour.passPlan.passLengthM, u)}, side to side` }]
          : [{ label: 'Method', value: 'Area ÷ field capacity' }]),
      ],
      notes: [],
      inputs: labour.inputs,
      how: labour.how,
      cautions: labour.cautions,
    },
    {
      key: 'water',
      title: 'Water budget',
      figures: water.irrigated
        ? [
            { label: 'ET0 (week)', value: depthText(water.et0Mm, u) },
            { label: 'ETc (week)', value: depthText(water.etcMm, u) },
            { label: 'Effective rain', value: depthText(water.effectiveRainMm, u) },
            { label: 'Net need', value: depthText(water.netMm, u) },
            { label: 'Gross need', value: depthText(water.grossMm, u), test: 'needs-water-gross' },
            { label: 'Run time', value: `${n(water.runTimeMin, 0)} min` },
            { label: 'Volume', value: volumeText(water.volumeL, u) },
          ]
        : [
            { label: 'Irrigation', value: 'Not irrigated', test: 'needs-water-gross' },
            { label: 'ET0 (week)', value: depthText(water.et0Mm, u) },
            { label: 'Rain (week)', value: depthText(water.rainMm, u) },
          ],
      notes: [
        ...(water.notIrrigatedReason ? [{ text: water.notIrrigatedReason, type: 'info' as const }] : []),
        ...(water.et0Method !== 'penman_monteith' ? [{ text: 'Some days had temperatures only: ET0 by Hargreaves on those days.', type: 'info' as const }] : []),
      ],
      inputs: water.inputs,
      how: water.how,
      cautions: water.cautions,
    },
    {
      key: 'feed',
      title: 'Feed plan',
      figures: [
        { label: 'Annual N', value: nRateText(feed.annualNGPerM2, u), test: 'needs-annual-n' },
        { label: 'Applications', value: String(feed.applications.length) },
        { label: 'Next', value: feed.nextApplication ? `${dateText(feed.nextApplication.date)}: ${nRateText(feed.nextApplication.nGPerM2, u)}` : 'None left this season' },
        { label: `Product ${feed.product.analysis} (season)`, value: `${massText(feed.productKgSeason, u)}` },
      ],
      notes: feed.reasons.map((text) => ({ text, type: 'info' as const })),
      inputs: feed.inputs,
      how: feed.how,
      cautions: feed.cautions,
    },
    {
      key: 'lines',
      title: 'Line plan',
      figures: lines.kept
        ? [
            { label: 'Layout', value: lines.template?.name ?? '—' },
            { label: 'Total line length', value: lengthText(lines.lineLengthM, u), test: 'needs-line-length' },
            { label: 'First coat', value: `${volumeText(lines.firstCoat.concentrateLitres, u)} paint + ${volumeText(lines.firstCoat.waterLitres, u)} water, ${hoursText(lines.firstCoat.hours)}` },
            { label: 'Per touch-up', value: `${volumeText(lines.concentrateLitres, u)} paint + ${volumeText(lines.waterLitres, u)} water` },
            { label: 'Labour per touch-up', value: hoursText(lines.hoursPerRepaint) },
            { label: 'Repaints in season', value: `${lines.repaints} (every ${lines.repaintDays} days)` },
          ]
        : [{ label: 'Lines', value: 'None kept', test: 'needs-line-length' }],
      notes: [
        ...(lines.reason ? [{ text: lines.reason, type: 'info' as const }] : []),
        ...(lines.elements.length
          ? [{ text: `The totals include, as line of the layout\u2019s width: ${lines.elements.map((e) => `${e.label} ×${e.count} ${lengthText(e.equivalentLengthM, u)}`).join('; ')}.`, type: 'info' as const }]
          : []),
      ],
      inputs: lines.inputs,
      how: lines.how,
      cautions: lines.cautions,
    },
    {
      key: 'level',
      title: 'Level and compliance',
      figures: [
        { label: 'Assigned', value: levelName(level.assigned) },
        { label: 'Recommended', value: levelName(level.recommended), test: 'needs-recommended-level' },
        { label: 'Target score', value: String(level.targetScore) },
        { label: 'Latest surface score', value: level.latestCheck ? `${n(level.latestCheck.score, 0)} (${dateText(level.latestCheck.checkedOn)})` : 'No field check on file' },
        ...(level.workCompliance.tally
          ? [
              { label: 'Work orders done', value: `${level.workCompliance.tally.ordersDone} of ${level.workCompliance.tally.ordersDone + level.workCompliance.tally.ordersOpen + level.workCompliance.tally.ordersSkipped}`, test: 'needs-orders-done' },
              { label: 'Mowings done', value: `${level.workCompliance.tally.mowingsDone} of ${level.workCompliance.tally.mowingsAsked} asked`, test: 'needs-mowings-done' },
              { label: 'Hours, planned / actual', value: `${hoursText(level.workCompliance.tally.plannedHoursDone)} / ${hoursText(level.workCompliance.tally.actualHours)}` },
            ]
          : []),
      ],
      notes: [
        ...(level.scoreMet === null ? [] : [{ text: level.scoreMet ? 'The latest surface score meets the level\u2019s target.' : 'The latest surface score is below the level\u2019s target.', type: level.scoreMet ? ('info' as const) : ('warning' as const) }]),
        ...(level.recommended !== level.assigned ? [{ text: `The rubric points to level ${levelName(level.recommended)}.`, type: 'info' as const }] : []),
        { text: level.workCompliance.note, type: 'info' as const },
      ],
      inputs: level.inputs,
      how: `${level.how} Rubric: ${level.reasons.join('; ')}.`,
      cautions: level.cautions,
    },
  ];
}
