/** The line plan card. */
import { CAUTIONS, defaultTemplateFor, linePlan } from '@swardwise/domain';
import { input, type NeedsBasis } from './basis.ts';

export function linesCard(b: NeedsBasis) {
  const { field, level, std, params, prepared } = b;
  const template = std.lineRepaintDays === null ? null : defaultTemplateFor(field.sport);
  const lp = template ? linePlan(template, params.lines, { days: prepared.dates.length, repaintDays: std.lineRepaintDays }) : null;
  return {
    kept: lp !== null,
    reason: lp ? null : field.sport === 'lawn' || field.sport === 'multi_use' ? 'No lines are kept on this kind of field.' : `Level ${level} (${std.name}) keeps no lines in the Standards.`,
    template: template && lp ? { id: template.id, name: template.name, source: template.source, lineWidthM: template.lineWidthM } : null,
    lineLengthM: lp?.lineLengthM ?? 0,
    /** What the totals include, element by element (lines, marks, numerals, team areas). */
    elements: lp?.elements ?? [],
    paintedAreaM2: lp?.paintedAreaM2 ?? 0,
    // One repaint: a touch-up over lines that still show (the usual repaint).
    mixedLitres: lp?.touchUp.mixedLitres ?? 0,
    concentrateLitres: lp?.touchUp.concentrateLitres ?? 0,
    waterLitres: lp?.touchUp.waterLitres ?? 0,
    hoursPerRepaint: lp?.touchUp.hours ?? 0,
    /** The first coat of the season (the layout painted afresh). */
    firstCoat: { mixedLitres: lp?.firstCoat.mixedLitres ?? 0, concentrateLitres: lp?.firstCoat.concentrateLitres ?? 0, waterLitres: lp?.firstCoat.waterLitres ?? 0, hours: lp?.firstCoat.hours ?? 0 },
    repaintDays: std.lineRepaintDays,
    repaints: lp?.repaints ?? 0,
    firstCoats: lp?.firstCoats ?? 0,
    touchUps: lp?.touchUps ?? 0,
    seasonMixedLitres: lp?.seasonMixedLitres ?? 0,
    seasonConcentrateLitres: lp?.seasonConcentrateLitres ?? 0,
    seasonHours: lp?.seasonHours ?? 0,
    inputs: [
      input('coverageFirst', 'First coat: finished line per litre of mixed paint', params.lines.firstCoat.coverageM2PerMixedL, 'm2/L'),
      input('dilutionFirst', 'First coat: parts water per part paint', params.lines.firstCoat.dilutionWaterPerPaint),
      input('passesFirst', 'First coat: passes', params.lines.firstCoat.passes),
      input('coverageTouchUp', 'Touch-up: finished line per litre of mixed paint', params.lines.touchUp.coverageM2PerMixedL, 'm2/L'),
      input('dilutionTouchUp', 'Touch-up: parts water per part paint', params.lines.touchUp.dilutionWaterPerPaint),
      input('passesTouchUp', 'Touch-up: passes', params.lines.touchUp.passes),
      input('markerSpeed', 'Marker speed', params.lines.markerSpeedKmh, 'km/h'),
      input('repaintDays', 'Standards: days between repaints', std.lineRepaintDays, 'd'),
      input('seasonDays', 'Days of the season', prepared.dates.length, 'd'),
    ],
    how: 'Line length from the sport\u2019s layout template (straight lines, arcs, marks, numerals and team areas, listed element by element). Mixed paint = painted area ÷ the coat\u2019s coverage of finished line (about 200 linear ft of 4 in line per mixed gallon for a first coat painted in both directions; a touch-up is one pass, so about twice that); concentrate = mixed ÷ (1 + parts water); labour = length × passes ÷ marker speed + set-up. The season: one first coat at the start, then a touch-up every repaint interval.',
    cautions: lp ? [CAUTIONS.lines] : [],
  };
}
