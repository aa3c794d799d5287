/**
 * The brute force the long axis had before rotating calipers: the rectangle on every edge of
 * the hull, measured against every hull point, O(h²). The minimum-area enclosing rectangle
 * has a side on a hull edge (H. Freeman and R. Shapira, Communications of the ACM 18 (1975)
 * 409–413), so the least of these is it. Kept to check `longAxis` against and to time it by.
 */
export type XY = [number, number];

/** For each edge of the closed ring `hull` (in metres), its direction (radians) and the enclosing rectangle's sides along it (`w`) and across it (`h`), in the edges' order. */
export function rectanglesOnEdges(hull: XY[]): { angle: number; w: number; h: number }[] {
  return hull.map((a, i) => {
    const b = hull[(i + 1) % hull.length]!;
    const angle = Math.atan2(b[1] - a[1], b[0] - a[0]);
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
    for (const p of hull) {
      const x = p[0] * c + p[1] * s;
      const y = -p[0] * s + p[1] * c;
      minX = Math.min(minX, x); maxX = Math.max(maxX, x);
      minY = Math.min(minY, y); maxY = Math.max(maxY, y);
    }
    return { angle, w: maxX - minX, h: maxY - minY };
  });
}
