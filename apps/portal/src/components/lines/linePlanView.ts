/** What the line plan page draws and lists, from the engine's figures; kept apart so it is tested without a DOM. */
import { LAYOUT_DIMENSIONS, LINE_LAYOUTS, type LineLayout, type LineSegment, type PlanLayout } from '@swardwise/domain';

/** An SVG path of one segment in the plan view (y flipped so the drawing is not a mirror image of the map). */
export function segmentPath(s: LineSegment, widthM: number): string {
  const y = (v: number) => widthM - v;
  const f = (v: number) => v.toFixed(2);
  if (s.kind === 'line') return `M${f(s.from[0])} ${f(y(s.from[1]))}L${f(s.to[0])} ${f(y(s.to[1]))}`;
  const sweep = s.endRad - s.startRad;
  const at = (a: number) => [s.center[0] + s.radiusM * Math.cos(a), y(s.center[1] + s.radiusM * Math.sin(a))] as const;
  if (Math.abs(sweep) >= 2 * Math.PI - 1e-9) {
    // A full circle: two half arcs (one arc command cannot end where it starts).
    const [x0, y0] = at(s.startRad);
    const [x1, y1] = at(s.startRad + Math.PI);
    return `M${f(x0)} ${f(y0)}A${f(s.radiusM)} ${f(s.radiusM)} 0 0 0 ${f(x1)} ${f(y1)}A${f(s.radiusM)} ${f(s.radiusM)} 0 0 0 ${f(x0)} ${f(y0)}`;
  }
  const [x0, y0] = at(s.startRad);
  const [x1, y1] = at(s.endRad);
  // Counter-clockwise in the field frame is anticlockwise on screen once y is flipped: sweep flag 0.
  return `M${f(x0)} ${f(y0)}A${f(s.radiusM)} ${f(s.radiusM)} 0 ${Math.abs(sweep) > Math.PI ? 1 : 0} ${sweep > 0 ? 0 : 1} ${f(x1)} ${f(y1)}`;
}

/** Points along a segment (arcs in steps of about 5°), for a polyline on the map. */
export function segmentPoints(s: LineSegment): Array<[number, number]> {
  if (s.kind === 'line') return [[s.from[0], s.from[1]], [s.to[0], s.to[1]]];
  const n = Math.max(4, Math.ceil(Math.abs(s.endRad - s.startRad) / (Math.PI / 36)));
  return Array.from({ length: n + 1 }, (_, i) => {
    const a = s.startRad + ((s.endRad - s.startRad) * i) / n;
    return [s.center[0] + s.radiusM * Math.cos(a), s.center[1] + s.radiusM * Math.sin(a)] as [number, number];
  });
}

/** The allowed range of a layout's dimension in words: "90–120 m (IFAB Laws of the Game, Law 1)" or "fixed at …". */
export function rangeText(layout: LineLayout, key: 'lengthM' | 'widthM'): string | null {
  const d = LAYOUT_DIMENSIONS[layout].find((x) => x.key === key);
  if (!d) return null;
  return d.minM === d.maxM ? `fixed at ${d.minM} m (${d.source})` : `${d.minM}–${d.maxM} m (${d.source})`;
}

/** A new layout for the plan: the layout's default size, centred, in the next colour. */
export function newLayout(layout: LineLayout, colour: string): PlanLayout {
  const dims = LAYOUT_DIMENSIONS[layout];
  const dim = (key: 'lengthM' | 'widthM') => dims.find((d) => d.key === key)?.defaultM ?? null;
  return { layout, lengthM: dim('lengthM'), widthM: dim('widthM'), colour, alongM: 0, acrossM: 0, rotationDeg: 0 };
}

export const LAYOUT_OPTIONS = (Object.keys(LINE_LAYOUTS) as LineLayout[]).map((id) => ({ value: id, label: LINE_LAYOUTS[id].name }));
