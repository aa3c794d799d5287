/**
 * Logos painted on a field: where an uploaded picture lands in the field frame once placed,
 * scaled and rotated; the string grid a crew lays out to paint it square by square; the
 * colours it is made of and the paint each takes.
 *
 * Frame: metres in the field's own frame (`fieldFrame`), x along the long axis from one end
 * line, y across from one side line, as `lines.ts` and `stripes.ts`. The picture's top is
 * towards +y and a positive rotation turns it anticlockwise (seen with +y up, as the plan
 * view and the set-out sheet draw the field).
 */
import { fail, requireFinite, requirePositive, requireRange } from './check.ts';
import type { PaintSettings } from './lines.ts';

export type XY = readonly [number, number];

/** A logo as placed on a field. */
export interface LogoPlacement {
  /** Centre of the logo, m from the end line (x) and from the side line (y). */
  centerXM: number;
  centerYM: number;
  /** Width of the picture on the ground before rotation, m. */
  widthM: number;
  /** Height on the ground, m (width × the picture's height ÷ its width). */
  heightM: number;
  /** Anticlockwise turn, degrees. */
  rotationDeg: number;
}

/** Height on the ground of a picture of `pixelWidth × pixelHeight` placed `widthM` wide, m. */
export function logoHeightM(widthM: number, pixelWidth: number, pixelHeight: number): number {
  requirePositive(widthM, 'invalid_logo_width', 'logo width (m)');
  requirePositive(pixelWidth, 'invalid_logo_pixels', 'picture width (px)');
  requirePositive(pixelHeight, 'invalid_logo_pixels', 'picture height (px)');
  return (widthM * pixelHeight) / pixelWidth;
}

function checkPlacement(p: LogoPlacement) {
  requireFinite(p.centerXM, 'invalid_logo_center', 'logo centre x (m)');
  requireFinite(p.centerYM, 'invalid_logo_center', 'logo centre y (m)');
  requirePositive(p.widthM, 'invalid_logo_width', 'logo width (m)');
  requirePositive(p.heightM, 'invalid_logo_height', 'logo height (m)');
  requireRange(p.rotationDeg, -360, 360, 'invalid_logo_rotation', 'logo rotation (°)');
}

/**
 * Field-frame point (m) of a point of the picture given as fractions of its width `u` (0 left,
 * 1 right) and height `v` (0 top, 1 bottom): scale to the placed size about the centre, turn
 * by the rotation, move to the centre. x = cx + lx·cosθ − ly·sinθ, y = cy + lx·sinθ + ly·cosθ
 * with lx = (u − ½)·W, ly = (½ − v)·H.
 */
export function logoPoint(p: LogoPlacement, u: number, v: number): XY {
  checkPlacement(p);
  const t = (p.rotationDeg * Math.PI) / 180;
  const lx = (u - 0.5) * p.widthM;
  const ly = (0.5 - v) * p.heightM;
  return [p.centerXM + lx * Math.cos(t) - ly * Math.sin(t), p.centerYM + lx * Math.sin(t) + ly * Math.cos(t)];
}

/** The picture's corners in the field frame, m: top left, top right, bottom right, bottom left. */
export function logoCorners(p: LogoPlacement): [XY, XY, XY, XY] {
  return [logoPoint(p, 0, 0), logoPoint(p, 1, 0), logoPoint(p, 1, 1), logoPoint(p, 0, 1)];
}

/** Inverse of `logoPoint`: the picture fractions (u, v) of a field-frame point. */
export function logoFractions(p: LogoPlacement, point: XY): { u: number; v: number } {
  checkPlacement(p);
  const t = (p.rotationDeg * Math.PI) / 180;
  const dx = point[0] - p.centerXM;
  const dy = point[1] - p.centerYM;
  const lx = dx * Math.cos(t) + dy * Math.sin(t);
  const ly = -dx * Math.sin(t) + dy * Math.cos(t);
  return { u: lx / p.widthM + 0.5, v: 0.5 - ly / p.heightM };
}

/** Largest number of grid squares along one side a set-out sheet shows. */
export const LOGO_GRID_MAX_LINES = 80;

/** The string grid over a placed logo. */
export interface LogoGrid {
  spacingM: number;
  /**
   * Reference corner in the field frame, m: the corner of the logo's field-aligned box nearest
   * the field's origin corner (the end line x = 0 and the side line y = 0). The crew measures
   * it from that corner of the field and strings the grid from it, parallel to the lines.
   */
  reference: XY;
  /** Squares along x (columns, lettered A, B, …) and along y (rows, numbered 1, 2, …). */
  columns: number;
  rows: number;
  /** Size of the grid, m (columns × spacing, rows × spacing). */
  lengthM: number;
  widthM: number;
  /** The logo's corners as grid coordinates, m from the reference corner along x and y. */
  corners: Array<{ name: string; alongM: number; acrossM: number }>;
}

/** Column letter of a grid column: A … Z, AA, AB, … */
export function gridColumnName(index: number): string {
  let n = index;
  let s = '';
  do {
    s = String.fromCharCode(65 + (n % 26)) + s;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return s;
}

/**
 * Grid set-out of a placed logo: a square grid of `spacingM`, parallel to the field's lines,
 * from the reference corner (the low-x, low-y corner of the box around the turned logo) over
 * the whole logo; the logo's corners as grid coordinates (along = x − x₀, across = y − y₀).
 * Squares of 1 m are common practice for a logo painted by hand; the grid is capped at
 * `LOGO_GRID_MAX_LINES` squares a side.
 */
export function logoGrid(p: LogoPlacement, spacingM: number): LogoGrid {
  requireRange(spacingM, 0.1, 10, 'invalid_grid_spacing', 'grid spacing (m)');
  const corners = logoCorners(p);
  const xs = corners.map((c) => c[0]);
  const ys = corners.map((c) => c[1]);
  const reference: XY = [Math.min(...xs), Math.min(...ys)];
  // A corner exactly on a grid line counts as inside (no extra empty square from rounding).
  const columns = Math.max(1, Math.ceil((Math.max(...xs) - reference[0]) / spacingM - 1e-9));
  const rows = Math.max(1, Math.ceil((Math.max(...ys) - reference[1]) / spacingM - 1e-9));
  if (columns > LOGO_GRID_MAX_LINES || rows > LOGO_GRID_MAX_LINES) {
    fail('grid_too_fine', `a ${spacingM} m grid over this logo needs ${columns} × ${rows} squares; choose a spacing that gives at most ${LOGO_GRID_MAX_LINES} a side`);
  }
  const names = ['top left', 'top right', 'bottom right', 'bottom left'];
  return {
    spacingM,
    reference,
    columns,
    rows,
    lengthM: columns * spacingM,
    widthM: rows * spacingM,
    corners: corners.map((c, i) => ({ name: names[i]!, alongM: c[0] - reference[0], acrossM: c[1] - reference[1] })),
  };
}

/** Field-frame point of a grid coordinate (m from the reference corner along x and y). */
export function gridToField(grid: Pick<LogoGrid, 'reference'>, alongM: number, acrossM: number): XY {
  return [grid.reference[0] + alongM, grid.reference[1] + acrossM];
}

/** Whether the whole turned logo lies inside the field rectangle `lengthM × widthM`. */
export function logoInsideField(p: LogoPlacement, lengthM: number, widthM: number): boolean {
  return logoCorners(p).every(([x, y]) => x >= -1e-9 && y >= -1e-9 && x <= lengthM + 1e-9 && y <= widthM + 1e-9);
}

/** One colour of a picture and its share of the picture's pixels. */
export interface PaletteColour {
  /** `#rrggbb`. */
  hex: string;
  /** Share of all the picture's pixels (painted or not), 0–1. */
  share: number;
}

/** What a picture is made of: its painted colours and what is left as turf. */
export interface LogoPalette {
  colours: PaletteColour[];
  /** Share of pixels left unpainted (transparent, or the background colour), 0–1. */
  turfShare: number;
  /** An opaque background colour taken as turf (all four corner pixels of it); null when none. */
  backgroundHex: string | null;
}

/** Most colours a logo is reduced to. */
export const LOGO_MAX_COLOURS = 6;

const hexOf = (r: number, g: number, b: number) => `#${[r, g, b].map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;

/**
 * Reduces a picture (RGBA bytes, row by row) to at most `maxColours` paint colours. Pixels
 * with alpha below half are turf; when the four corner pixels are one opaque colour it is
 * taken as the background and left as turf too. Colours are binned to 4 bits a channel; the
 * most common bins (each at least 2 % of the painted pixels) become the palette, each the
 * mean of its bin, and every painted pixel goes to the nearest palette colour (RGB distance),
 * so anti-aliased edges join the colour they border.
 */
export function logoPalette(rgba: Uint8Array | Uint8ClampedArray, width: number, height: number, maxColours = LOGO_MAX_COLOURS): LogoPalette {
  if (!(width > 0 && height > 0) || rgba.length !== width * height * 4) fail('invalid_picture', 'picture bytes do not match its size');
  const n = width * height;
  const at = (i: number) => [rgba[i * 4]!, rgba[i * 4 + 1]!, rgba[i * 4 + 2]!, rgba[i * 4 + 3]!] as const;
  const cornerIdx = [0, width - 1, (height - 1) * width, n - 1].map(at);
  const [c0] = cornerIdx;
  const background = cornerIdx.every((c) => c[3] >= 250 && c[0] === c0![0] && c[1] === c0![1] && c[2] === c0![2]) ? hexOf(c0![0], c0![1], c0![2]) : null;
  const isTurf = (i: number) => {
    const a = rgba[i * 4 + 3]!;
    if (a < 128) return true;
    return background !== null && hexOf(rgba[i * 4]!, rgba[i * 4 + 1]!, rgba[i * 4 + 2]!) === background;
  };
  const bins = new Map<number, { count: number; r: number; g: number; b: number }>();
  let painted = 0;
  for (let i = 0; i < n; i++) {
    if (isTurf(i)) continue;
    painted++;
    const r = rgba[i * 4]!;
    const g = rgba[i * 4 + 1]!;
    const b = rgba[i * 4 + 2]!;
    const key = ((r >> 4) << 8) | ((g >> 4) << 4) | (b >> 4);
    const bin = bins.get(key);
    if (bin) {
      bin.count++;
      bin.r += r;
      bin.g += g;
      bin.b += b;
    } else bins.set(key, { count: 1, r, g, b });
  }
  if (painted === 0) return { colours: [], turfShare: 1, backgroundHex: background };
  const palette = [...bins.values()]
    .filter((b) => b.count >= painted * 0.02)
    .sort((a, b) => b.count - a.count)
    .slice(0, maxColours)
    .map((b) => [b.r / b.count, b.g / b.count, b.b / b.count] as const);
  const counts = palette.map(() => 0);
  for (let i = 0; i < n; i++) {
    if (isTurf(i)) continue;
    const r = rgba[i * 4]!;
    const g = rgba[i * 4 + 1]!;
    const b = rgba[i * 4 + 2]!;
    let best = 0;
    let bestD = Infinity;
    for (let k = 0; k < palette.length; k++) {
      const p = palette[k]!;
      const d = (p[0] - r) ** 2 + (p[1] - g) ** 2 + (p[2] - b) ** 2;
      if (d < bestD) {
        bestD = d;
        best = k;
      }
    }
    counts[best]!++;
  }
  const colours = palette.map((p, k) => ({ hex: hexOf(p[0], p[1], p[2]), share: counts[k]! / n })).filter((c) => c.share > 0);
  return { colours, turfShare: (n - painted) / n, backgroundHex: background };
}

/** Whether a colour is white enough to be painted as white (each channel ≥ 230; common practice). */
export function isWhitePaint(hex: string): boolean {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) return false;
  return [m[1], m[2], m[3]].every((c) => parseInt(c!, 16) >= 230);
}

/**
 * A dark colour (low lightness, or a strong red or blue) is one whose pigment load can harm
 * the grass under it: relative luminance below 0.2, or the red or blue channel more than twice
 * the green. A rule of thumb (common practice), used to show the caution beside it.
 */
export function isDarkPigment(hex: string): boolean {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) return false;
  const [r, g, b] = [m[1], m[2], m[3]].map((c) => parseInt(c!, 16));
  const lin = (c: number) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  };
  const luminance = 0.2126 * lin(r!) + 0.7152 * lin(g!) + 0.0722 * lin(b!);
  return luminance < 0.2 || r! > 2 * g! || b! > 2 * g!;
}

/** Paint of one colour (or the base coat). */
export interface LogoPaintRow {
  /** `#rrggbb`, or 'base' for the white base coat under the colours. */
  hex: string;
  /** 'colour' for the logo's colours, 'base' for the white under them. */
  kind: 'colour' | 'base';
  areaM2: number;
  mixedLitres: number;
  concentrateLitres: number;
  waterLitres: number;
  /** Dark pigment: show the turf caution beside it. */
  dark: boolean;
}

/** Paint for a placed logo. */
export interface LogoPaint {
  /** Logo area on the ground (width × height), m². */
  logoAreaM2: number;
  paintedAreaM2: number;
  rows: LogoPaintRow[];
  /** Sums of the rows. */
  total: { areaM2: number; mixedLitres: number; concentrateLitres: number; waterLitres: number };
}

/**
 * Paint for solid areas in one coat: mixed = area ÷ the coat's coverage (m² of finished paint
 * per litre of mix, all passes); concentrate = mixed ÷ (1 + dilution); water = mixed −
 * concentrate, as `paintNeed` in lines.ts for a line.
 */
export function areaPaint(areaM2: number, coat: PaintSettings): { mixedLitres: number; concentrateLitres: number; waterLitres: number } {
  requirePositive(coat.coverageM2PerMixedL, 'invalid_coverage', 'coverage (m²/L)');
  requireRange(coat.dilutionWaterPerPaint, 0, 10, 'invalid_dilution', 'dilution (parts water per part paint)');
  const mixedLitres = areaM2 / coat.coverageM2PerMixedL;
  const concentrateLitres = mixedLitres / (1 + coat.dilutionWaterPerPaint);
  return { mixedLitres, concentrateLitres, waterLitres: mixedLitres - concentrateLitres };
}

/**
 * Painted area and paint per colour of a placed logo: area of a colour = its share of the
 * picture's pixels × the logo's area on the ground (width × height); every colour that is not
 * white gets a white base coat of its own area under it (common practice: colours show truer
 * and need one coat less over white); paint from the department's first coat (`areaPaint`).
 */
export function logoPaint(widthM: number, heightM: number, colours: readonly PaletteColour[], coat: PaintSettings): LogoPaint {
  requirePositive(widthM, 'invalid_logo_width', 'logo width (m)');
  requirePositive(heightM, 'invalid_logo_height', 'logo height (m)');
  const logoAreaM2 = widthM * heightM;
  const rows: LogoPaintRow[] = colours.map((c) => {
    requireRange(c.share, 0, 1, 'invalid_share', 'colour share');
    const areaM2 = c.share * logoAreaM2;
    return { hex: c.hex, kind: 'colour' as const, areaM2, ...areaPaint(areaM2, coat), dark: isDarkPigment(c.hex) };
  });
  const baseArea = rows.filter((r) => !isWhitePaint(r.hex)).reduce((s, r) => s + r.areaM2, 0);
  if (baseArea > 0) rows.push({ hex: 'base', kind: 'base', areaM2: baseArea, ...areaPaint(baseArea, coat), dark: false });
  const sum = (k: 'areaM2' | 'mixedLitres' | 'concentrateLitres' | 'waterLitres') => rows.reduce((s, r) => s + r[k], 0);
  return {
    logoAreaM2,
    paintedAreaM2: rows.filter((r) => r.kind === 'colour').reduce((s, r) => s + r.areaM2, 0),
    rows,
    total: { areaM2: sum('areaM2'), mixedLitres: sum('mixedLitres'), concentrateLitres: sum('concentrateLitres'), waterLitres: sum('waterLitres') },
  };
}

/** The caution shown with every logo's paint. */
export const LOGO_PIGMENT_CAUTION =
  'Dark pigments (reds, blues, blacks) hold heat and can yellow or kill the grass under them, above all in hot weather or on stressed turf (common practice). Keep dark areas small, dilute as the label allows, do not paint a logo on the same spot week after week, and follow the paint maker’s label.';
