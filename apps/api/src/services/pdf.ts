/**
 * What the printable sheets (budget, game-day checklist, logo and line set-out) share: a
 * pdfkit document whose bytes arrive as one buffer, and a table laid out in columns that
 * share the page width.
 */
import PDFDocument from 'pdfkit';

/** A pdfkit document and the promise of its bytes once `doc.end()` is called. */
export function pdfDocument(options: PDFKit.PDFDocumentOptions): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument(options);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return { doc, done };
}

export interface PdfColumn {
  title: string;
  /** Left edge in points. */
  x: number;
  /** Width in points. */
  px: number;
}

/**
 * A table whose columns take their share `w` (fractions summing to 1) of `width` from `left`,
 * with its header row drawn at `y` and ruled beneath. `pad` is the gap inside each cell
 * either side; `headerHeight` the header row's height. Answers the columns, the y under the
 * rule, and `cell` to write a one-line cell (cut with an ellipsis) in a column.
 */
export function pdfTable(
  doc: PDFKit.PDFDocument,
  spec: { left: number; width: number; y: number; pad: number; headerHeight: number; fontSize: number; ink: string },
  columns: readonly { title: string; w: number }[],
) {
  const cols: PdfColumn[] = [];
  let x = spec.left;
  for (const c of columns) {
    const px = c.w * spec.width;
    cols.push({ title: c.title, x, px });
    x += px;
  }
  doc.fillColor(spec.ink).font('Helvetica-Bold').fontSize(spec.fontSize);
  cols.forEach((c) => doc.text(c.title, c.x + spec.pad, spec.y, { width: c.px - 2 * spec.pad, lineBreak: false }));
  const y = spec.y + spec.headerHeight;
  rule(doc, spec.left, spec.width, y, 1, spec.ink);
  const cell = (i: number, text: string, at: number) => doc.fillColor(spec.ink).text(text, cols[i]!.x + spec.pad, at, { width: cols[i]!.px - 2 * spec.pad, lineBreak: false, ellipsis: true });
  return { cols, y, cell };
}

/** A horizontal line across the table at `y`. */
export function rule(doc: PDFKit.PDFDocument, left: number, width: number, y: number, lineWidth: number, colour: string): void {
  doc.moveTo(left, y).lineTo(left + width, y).lineWidth(lineWidth).strokeColor(colour).stroke();
}
