/**
 * Uploaded logo pictures: an SVG is cleaned (DOMPurify over jsdom, SVG profile) and refused if
 * anything could still reach outside the file; a PNG is re-encoded without its metadata. Both
 * are rendered to a PNG by sharp (librsvg for SVG) that the portal and the set-out sheet show,
 * and reduced to their paint colours by the engine's `logoPalette`.
 */
import createDOMPurify from 'dompurify';
import { JSDOM } from 'jsdom';
import sharp from 'sharp';
import { appError, LOGO_MAX_COLOURS, logoPalette, type LogoPalette } from '@swardwise/domain';

/** Largest upload, bytes: a logo is a few shapes, not a photo. */
export const LOGO_MAX_BYTES = 2 * 1024 * 1024;
/** Largest picture: declared SVG size or PNG pixels. */
const MAX_PIXELS = 50_000_000;
/** Elements an SVG may keep after cleaning (a logo needs hundreds; `use` fans need far more). */
const MAX_SVG_ELEMENTS = 5000;
/** Long side of the stored rendering, px. */
const RENDER_LONG_SIDE_PX = 1024;
/** Long side the colours are counted on, px. */
const PALETTE_LONG_SIDE_PX = 256;

const window = new JSDOM('').window;
const purify = createDOMPurify(window);
// Any link that is not to a part of the same file goes: external images, fonts, styles,
// `javascript:` and `data:` alike (librsvg would load a data: or file: image).
purify.addHook('uponSanitizeAttribute', (_node, data) => {
  const name = data.attrName.toLowerCase();
  if ((name === 'href' || name === 'xlink:href' || name === 'src') && !data.attrValue.trim().startsWith('#')) data.keepAttr = false;
  if (name === 'style' && /url\s*\(|@import|expression\s*\(/i.test(data.attrValue)) data.keepAttr = false;
});

export interface CleanedLogo {
  /** What is stored: the cleaned SVG text or the re-encoded PNG. */
  stored: Buffer;
  mime: 'image/svg+xml' | 'image/png';
  ext: 'svg' | 'png';
  /** PNG rendering, long side at most 1,024 px, with its transparency. */
  render: Buffer;
  pixelWidth: number;
  pixelHeight: number;
  palette: LogoPalette;
}

const unsafe = (why: string) => appError('field_logo/unsafe_svg', `This SVG cannot be used: ${why}. Save it again as a plain SVG (shapes only) or as a PNG`);

/**
 * The cleaned text of an SVG: no DOCTYPE or entities (entity expansion), no scripts, event
 * handlers, `foreignObject`, styles or links outside the file; refused when something that
 * could reach outside is still there after cleaning.
 */
export function cleanSvg(text: string): string {
  if (/<!DOCTYPE|<!ENTITY/i.test(text)) throw unsafe('it declares a DOCTYPE or entities');
  const clean = purify.sanitize(text, {
    USE_PROFILES: { svg: true, svgFilters: true },
    FORBID_TAGS: ['script', 'foreignObject', 'style', 'iframe', 'object', 'embed', 'image', 'feImage', 'animate', 'set', 'animateMotion', 'animateTransform'],
    FORBID_ATTR: ['style'],
  });
  if (!/^\s*<svg[\s>]/i.test(clean)) throw appError('field_logo/not_an_image', 'This file is not an SVG picture; send an SVG or a PNG logo');
  // Belt and braces: whatever DOMPurify kept, nothing may still point outside the file.
  if (/(?:href|src)\s*=\s*["']?\s*(?!#)[^"'\s>]/i.test(clean) || /url\s*\(\s*["']?\s*(?!#)/i.test(clean) || /@import|javascript:/i.test(clean)) {
    throw unsafe('it still refers to something outside the file');
  }
  const elements = (clean.match(/<[a-z]/gi) ?? []).length;
  if (elements > MAX_SVG_ELEMENTS) throw unsafe(`it has ${elements} elements (at most ${MAX_SVG_ELEMENTS})`);
  return clean;
}

const looksLikeSvg = (buffer: Buffer) => /^\s*(?:<\?xml[^>]*>\s*)?(?:<!--[\s\S]*?-->\s*)*<(?:svg|!DOCTYPE)/i.test(buffer.subarray(0, 4096).toString('utf8'));

/** Reads, cleans and renders an uploaded logo (SVG or PNG); every refusal is a 4xx. */
export async function readLogo(buffer: Buffer): Promise<CleanedLogo> {
  if (looksLikeSvg(buffer)) {
    const svg = Buffer.from(cleanSvg(buffer.toString('utf8')), 'utf8');
    let meta: sharp.Metadata;
    try {
      meta = await sharp(svg, { limitInputPixels: false }).metadata();
    } catch {
      throw appError('field_logo/unreadable', 'The SVG could not be read (it may be damaged); save it again or send a PNG');
    }
    const w = meta.width ?? 0;
    const h = meta.height ?? 0;
    if (!(w > 0 && h > 0)) throw appError('field_logo/unreadable', 'The SVG has no size; give it a width and height or a viewBox');
    if (w * h > MAX_PIXELS) throw appError('field_logo/too_many_pixels', `The SVG declares a size of ${w} × ${h}; at most 50 megapixels`);
    // Render at the density that gives the stored size: librsvg draws the shapes, not a bitmap scaled up.
    const density = Math.min(100_000, Math.max(1, (72 * RENDER_LONG_SIDE_PX) / Math.max(w, h)));
    return finish(svg, 'image/svg+xml', 'svg', sharp(svg, { density, limitInputPixels: MAX_PIXELS }));
  }
  let meta: sharp.Metadata;
  try {
    meta = await sharp(buffer, { limitInputPixels: false }).metadata();
  } catch {
    throw appError('field_logo/not_an_image', 'This file is not a picture; send an SVG or a PNG logo');
  }
  if (meta.format !== 'png') throw appError('field_logo/unsupported_format', `A ${String(meta.format ?? 'file of this kind').toUpperCase()} file cannot be used; send an SVG or a PNG logo`);
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_PIXELS) throw appError('field_logo/too_many_pixels', 'The picture is larger than 50 megapixels; send a smaller one');
  let png: Buffer;
  try {
    png = await sharp(buffer, { limitInputPixels: MAX_PIXELS }).png().toBuffer();
  } catch {
    throw appError('field_logo/unreadable', 'The PNG could not be read (the file may be damaged); save it again');
  }
  return finish(png, 'image/png', 'png', sharp(png, { limitInputPixels: MAX_PIXELS }));
}

async function finish(stored: Buffer, mime: CleanedLogo['mime'], ext: CleanedLogo['ext'], image: sharp.Sharp): Promise<CleanedLogo> {
  let render: { data: Buffer; info: sharp.OutputInfo };
  try {
    render = await image
      .timeout({ seconds: 20 })
      .resize({ width: RENDER_LONG_SIDE_PX, height: RENDER_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: ext === 'png' })
      .ensureAlpha()
      .png()
      .toBuffer({ resolveWithObject: true });
  } catch {
    throw appError('field_logo/unreadable', 'The picture could not be drawn (it may be damaged or too complex); save it again or send a PNG');
  }
  // Nearest-pixel sampling keeps the picture's own colours (no blends made by the shrink).
  const small = await sharp(render.data)
    .resize({ width: PALETTE_LONG_SIDE_PX, height: PALETTE_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true, kernel: 'nearest' })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  const palette = logoPalette(new Uint8Array(small.data.buffer, small.data.byteOffset, small.data.length), small.info.width, small.info.height, LOGO_MAX_COLOURS);
  if (!palette.colours.length) throw appError('field_logo/no_colours', 'The picture has nothing to paint: it is all transparent or all one background colour');
  return { stored, mime, ext, render: render.data, pixelWidth: render.info.width, pixelHeight: render.info.height, palette };
}
