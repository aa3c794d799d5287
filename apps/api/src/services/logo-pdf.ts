/**
 * The logo set-out sheet a crew takes onto the field: the string grid to scale with its
 * columns lettered and rows numbered and each line's distance from the reference corner, the
 * logo drawn over it as placed, where the reference corner is on the field, the grid
 * coordinates of the logo's corners, paint per colour and the dark-pigment caution.
 */
import { gridColumnName, LOGO_PIGMENT_CAUTION, type FieldLogo } from '@swardwise/domain';
import { pdfDocument } from './pdf.ts';

const A4_LANDSCAPE: [number, number] = [841.89, 595.28];
const MARGIN = 36;
const INK = '#1f2933';

const m = (v: number) => `${v.toFixed(2)} m`;
const litres = (v: number) => `${v.toFixed(1)} L`;

/** The sheet as a PDF buffer. `render` is the logo's PNG rendering. */
export function logoGridPdf(field: { name: string }, logo: FieldLogo<Date>, render: Buffer, printedOn: string): Promise<Buffer> {
  const { doc, done } = pdfDocument({ size: A4_LANDSCAPE, margin: MARGIN, info: { Title: `Logo set-out: ${logo.name}`, Author: 'Swardwise' } });

  doc.fillColor(INK).font('Helvetica-Bold').fontSize(16).text(`Logo set-out: ${logo.name}`, MARGIN, MARGIN);
  doc.font('Helvetica').fontSize(9).fillColor(INK).text(`${field.name}  ·  logo ${m(logo.widthM)} × ${m(logo.heightM)}, turned ${logo.rotationDeg}°, centre ${m(logo.centerXM)} from the end line and ${m(logo.centerYM)} from the side line  ·  printed ${printedOn}`);

  const grid = logo.grid;
  const drawTop = MARGIN + 48;
  const drawLeft = MARGIN + 30;
  const drawW = 470;
  const drawH = A4_LANDSCAPE[1] - drawTop - MARGIN - 30;
  if (!grid) {
    doc.fontSize(11).text('The grid spacing is too fine for this logo; choose a larger spacing and print again.', drawLeft, drawTop);
  } else {
    const scale = Math.min(drawW / grid.lengthM, drawH / grid.widthM);
    const ox = drawLeft;
    // y up on paper, as the plan view: row 1 and the reference corner at the bottom left.
    const oy = drawTop + grid.widthM * scale;
    const px = (along: number) => ox + along * scale;
    const py = (across: number) => oy - across * scale;

    // The logo under the grid lines, so the lines stay readable over dark colours.
    doc.save();
    doc.translate(px(logo.centerXM - grid.reference[0]), py(logo.centerYM - grid.reference[1]));
    doc.rotate(-logo.rotationDeg);
    doc.image(render, (-logo.widthM * scale) / 2, (-logo.heightM * scale) / 2, { width: logo.widthM * scale, height: logo.heightM * scale });
    doc.restore();

    doc.lineWidth(0.5).strokeColor(INK).fontSize(7).fillColor(INK);
    for (let i = 0; i <= grid.columns; i++) {
      doc.moveTo(px(i * grid.spacingM), py(0)).lineTo(px(i * grid.spacingM), py(grid.widthM)).stroke();
      doc.text(m(i * grid.spacingM).replace(' m', ''), px(i * grid.spacingM) - 12, py(0) + 3, { width: 24, align: 'center', lineBreak: false });
      if (i < grid.columns) doc.font('Helvetica-Bold').text(gridColumnName(i), px((i + 0.5) * grid.spacingM) - 10, py(grid.widthM) - 10, { width: 20, align: 'center', lineBreak: false }).font('Helvetica');
    }
    for (let j = 0; j <= grid.rows; j++) {
      doc.moveTo(px(0), py(j * grid.spacingM)).lineTo(px(grid.lengthM), py(j * grid.spacingM)).stroke();
      doc.text(m(j * grid.spacingM).replace(' m', ''), px(0) - 28, py(j * grid.spacingM) - 3, { width: 24, align: 'right', lineBreak: false });
      if (j < grid.rows) doc.font('Helvetica-Bold').text(String(j + 1), px(grid.lengthM) + 3, py((j + 0.5) * grid.spacingM) - 3, { width: 20, lineBreak: false }).font('Helvetica');
    }
    // The logo's outline, and the reference corner.
    const corners = grid.corners.map((c) => [px(c.alongM), py(c.acrossM)] as const);
    doc.lineWidth(1).strokeColor('#b42318').dash(3, { space: 2 });
    doc.moveTo(corners[0]![0], corners[0]![1]);
    for (const c of corners.slice(1)) doc.lineTo(c[0], c[1]);
    doc.closePath().stroke().undash();
    doc.circle(px(0), py(0), 4).fillColor('#b42318').fill();
    doc.fillColor(INK).fontSize(8).font('Helvetica-Bold').text('R', px(0) - 12, py(0) + 10, { lineBreak: false }).font('Helvetica');
  }

  // The right column: where to start, the corners, the paint, the caution.
  const col = MARGIN + 540;
  const colW = A4_LANDSCAPE[0] - col - MARGIN;
  doc.fillColor(INK).fontSize(10).font('Helvetica-Bold').text('Reference corner R', col, drawTop, { width: colW });
  doc.font('Helvetica').fontSize(8.5);
  if (grid) {
    doc.text(`${m(grid.reference[0])} from the end line (x), ${m(grid.reference[1])} from the side line (y). Strings every ${m(grid.spacingM)} parallel to the lines: ${grid.columns} columns (A to ${gridColumnName(grid.columns - 1)}) along x, ${grid.rows} rows across y; grid ${m(grid.lengthM)} × ${m(grid.widthM)}.`, { width: colW });
    doc.moveDown(0.5).font('Helvetica-Bold').fontSize(10).text('Logo corners from R (along, across)', { width: colW }).font('Helvetica').fontSize(8.5);
    for (const c of grid.corners) doc.text(`${c.name}: ${m(c.alongM)}, ${m(c.acrossM)}`, { width: colW });
  }
  doc.moveDown(0.5).font('Helvetica-Bold').fontSize(10).text('Paint, first coat', { width: colW }).font('Helvetica').fontSize(8.5);
  for (const r of logo.paint.rows) {
    const y = doc.y;
    if (r.kind === 'colour') doc.rect(col, y + 1, 9, 9).fillAndStroke(r.hex, INK).fillColor(INK);
    else doc.rect(col, y + 1, 9, 9).fillAndStroke('#ffffff', INK).fillColor(INK);
    const label = r.kind === 'base' ? 'White base coat under colours' : `${r.hex}${r.dark ? ' (dark pigment)' : ''}`;
    doc.text(`${label}: ${r.areaM2.toFixed(1)} m², ${litres(r.mixedLitres)} mixed (${litres(r.concentrateLitres)} paint + ${litres(r.waterLitres)} water)`, col + 14, y, { width: colW - 14 });
  }
  doc.font('Helvetica-Bold').text(`Total: ${logo.paint.total.areaM2.toFixed(1)} m², ${litres(logo.paint.total.mixedLitres)} mixed (${litres(logo.paint.total.concentrateLitres)} paint + ${litres(logo.paint.total.waterLitres)} water)`, col, doc.y, { width: colW }).font('Helvetica');
  doc.moveDown(0.5).fillColor(INK).font('Helvetica-Bold').fontSize(10).text('Caution', { width: colW }).font('Helvetica').fontSize(8.5).text(LOGO_PIGMENT_CAUTION, { width: colW });
  if (!logo.insideField) doc.moveDown(0.3).fillColor('#b42318').text('Part of the logo lies outside the field as placed.', { width: colW }).fillColor(INK);
  doc.end();
  return done;
}
