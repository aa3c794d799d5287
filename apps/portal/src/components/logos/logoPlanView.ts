/** What the logo page draws, from the engine's placement and grid; kept apart so it is tested without a DOM. */
import { defaultTemplateFor, type FieldLogo, type LineSegment, type Sport } from '@swardwise/domain';

export const PLAN_PAD_M = 4;

/** A field-frame point (y up) on the plan's SVG (y down): the plan reads like the map and the printed sheet. */
export const flipY = (widthM: number) => (y: number) => widthM - y;

/**
 * SVG path of the sport's default line layout centred on the field rectangle, for context;
 * shrunk evenly to fit a smaller field (a youth pitch), never stretched.
 */
export function templatePath(sport: Sport, lengthM: number, widthM: number): string {
  const t = defaultTemplateFor(sport);
  if (!t) return '';
  const k = Math.min(1, lengthM / t.lengthM, widthM / t.widthM);
  const dx = (lengthM - t.lengthM * k) / 2;
  const dy = (widthM - t.widthM * k) / 2;
  const y = flipY(widthM);
  const X = (v: number) => (v * k + dx).toFixed(2);
  const Y = (v: number) => y(v * k + dy).toFixed(2);
  const part = (s: LineSegment) => {
    if (s.kind === 'line') return `M${X(s.from[0])} ${Y(s.from[1])}L${X(s.to[0])} ${Y(s.to[1])}`;
    const p = (a: number) => [(s.center[0] + s.radiusM * Math.cos(a)) * k + dx, y((s.center[1] + s.radiusM * Math.sin(a)) * k + dy)] as const;
    const [x0, y0] = p(s.startRad);
    const sweep = s.endRad - s.startRad;
    // An SVG arc cannot draw a full circle in one piece: split at the half.
    const mid = p(s.startRad + sweep / 2);
    const [x1, y1] = p(s.endRad);
    const r = (s.radiusM * k).toFixed(2);
    // y is flipped, so an anticlockwise sweep in the field frame is clockwise on screen (sweep flag 0).
    const flag = sweep > 0 ? 0 : 1;
    return `M${x0.toFixed(2)} ${y0.toFixed(2)}A${r} ${r} 0 0 ${flag} ${mid[0].toFixed(2)} ${mid[1].toFixed(2)}A${r} ${r} 0 0 ${flag} ${x1.toFixed(2)} ${y1.toFixed(2)}`;
  };
  return t.segments.map(part).join('');
}

/** SVG transform placing the logo image (drawn at −W/2, −H/2, W × H) on the plan. */
export function logoTransform(logo: Pick<FieldLogo, 'centerXM' | 'centerYM' | 'rotationDeg'>, widthM: number): string {
  // Anticlockwise in the field frame is a negative SVG rotation once y is flipped.
  return `translate(${logo.centerXM} ${flipY(widthM)(logo.centerYM)}) rotate(${-logo.rotationDeg})`;
}

/** The grid's lines on the plan (field frame, y flipped). */
export function gridLines(logo: Pick<FieldLogo, 'grid'>, widthM: number) {
  const g = logo.grid;
  if (!g) return [];
  const y = flipY(widthM);
  const [x0, y0] = g.reference;
  const lines: Array<{ key: string; x1: number; y1: number; x2: number; y2: number }> = [];
  for (let i = 0; i <= g.columns; i++) lines.push({ key: `c${i}`, x1: x0 + i * g.spacingM, y1: y(y0), x2: x0 + i * g.spacingM, y2: y(y0 + g.widthM) });
  for (let j = 0; j <= g.rows; j++) lines.push({ key: `r${j}`, x1: x0, y1: y(y0 + j * g.spacingM), x2: x0 + g.lengthM, y2: y(y0 + j * g.spacingM) });
  return lines;
}

/** The logo in words, for the plan's description. */
export function logoDescription(logo: FieldLogo, fieldName: string): string {
  const g = logo.grid;
  const where = `centre ${logo.centerXM.toFixed(2)} m from the end line and ${logo.centerYM.toFixed(2)} m from the side line, ${logo.widthM.toFixed(2)} × ${logo.heightM.toFixed(2)} m, turned ${logo.rotationDeg}°`;
  const grid = g ? `; grid of ${g.spacingM} m squares, ${g.columns} × ${g.rows}, from the reference corner ${g.reference[0].toFixed(2)} m along and ${g.reference[1].toFixed(2)} m across` : '';
  return `${logo.name} on ${fieldName}: ${where}${grid}.${logo.insideField ? '' : ' Part of it lies outside the field.'}`;
}
