/** Logos placed on a field, with their grid set-out and paint. */
import type { LogoGrid, LogoPaint, PaletteColour } from '../engine/logos.ts';
import type { Instant } from './common.ts';

/** One placed logo with what the crew needs to paint it. */
export interface FieldLogo<At extends Instant = string> {
  id: number;
  fieldId: number;
  name: string;
  /** 'image/svg+xml' or 'image/png': what was uploaded (after cleaning). */
  mime: string;
  pixelWidth: number;
  pixelHeight: number;
  centerXM: number;
  centerYM: number;
  widthM: number;
  /** Width × the picture's aspect, m. */
  heightM: number;
  rotationDeg: number;
  gridSpacingM: number;
  colours: PaletteColour[];
  backgroundHex: string | null;
  /** The grid over the placed logo; null when the spacing is too fine for its size. */
  grid: LogoGrid | null;
  /** Paint per colour (first coat) with the white base under the colours. */
  paint: LogoPaint;
  /** Whether the whole turned logo lies on the field. */
  insideField: boolean;
  /** PNG rendering of the picture. */
  imageUrl: string;
  /** The set-out sheet (PDF). */
  pdfUrl: string;
  version: number;
  createdAt: At;
  updatedAt: At;
}

/** `GET /api/fields/:id/logos`. */
export interface FieldLogos<At extends Instant = string> {
  fieldId: number;
  fieldName: string;
  /** The field rectangle of its outline (`fieldFrame`), m. */
  lengthM: number;
  widthM: number;
  logos: Array<FieldLogo<At>>;
  /** The dark-pigment caution. */
  caution: string;
}
