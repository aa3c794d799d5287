/**
 * The game-day checklist as a printable page (pdfkit): the event, the field, the date, each
 * step with its day, crew and hours and a box to tick, the colourant with its caution, and a
 * line to sign. One US Letter page for the five steps.
 */
import { CAUTIONS, colourantFacts, FIELD_EVENT_KIND_LABELS, STRIPE_PATTERN_LABELS, type GameDayPrepRow, type UnitSystem } from '@swardwise/domain';
import { pdfDocument, pdfTable, rule } from './pdf.ts';

const MARGIN = 54;
/** Crew time as h:mm, as the portal writes it. */
const hoursText = (h: number) => `${Math.floor(Math.round(h * 60) / 60)}:${String(Math.round(h * 60) % 60).padStart(2, '0')} h`;
const INK = '#1f2a1f';
const MUTED = '#55605a';

const longDate = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
const shortDate = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'short', month: 'short', day: 'numeric', timeZone: 'UTC' });

/** The PDF's bytes. `printedOn` is the department's date the sheet was made. */
export function gameDayChecklistPdf(prep: GameDayPrepRow, units: UnitSystem, printedOn: string): Promise<Buffer> {
  const { doc, done } = pdfDocument({ size: 'LETTER', margin: MARGIN, info: { Title: `Game-day checklist: ${prep.eventTitle}`, Author: 'Swardwise', Subject: `${prep.fieldName}, ${prep.eventOn}` } });
  const width = doc.page.width - 2 * MARGIN;

  doc.fillColor(MUTED).font('Helvetica').fontSize(10).text('GAME-DAY CHECKLIST', MARGIN, MARGIN);
  doc.fillColor(INK).font('Helvetica-Bold').fontSize(20).text(prep.eventTitle, { width });
  doc.font('Helvetica').fontSize(12).text(`${FIELD_EVENT_KIND_LABELS[prep.eventKind]} on ${longDate(prep.eventOn)}${prep.eventTime ? ` at ${prep.eventTime}` : ''}`);
  doc.text(`${prep.fieldName}, ${prep.siteName}`);
  doc.fillColor(MUTED).fontSize(10).text(`Mowing: ${prep.pattern ? STRIPE_PATTERN_LABELS[prep.pattern] : 'plain mowing'} · ${prep.progress.done} of ${prep.progress.total} steps done on ${shortDate(printedOn)}`);
  doc.moveDown(1);

  // The table: step, day, crew, hours, done box, initials.
  const { cols, y: top, cell } = pdfTable(doc, { left: MARGIN, width, y: doc.y, pad: 4, headerHeight: 16, fontSize: 10, ink: INK }, [
    { title: 'Step', w: 0.34 },
    { title: 'Day', w: 0.16 },
    { title: 'Crew', w: 0.2 },
    { title: 'Hours', w: 0.1 },
    { title: 'Done', w: 0.08 },
    { title: 'Initials', w: 0.12 },
  ]);
  let y = top;
  const ROW = 34;
  doc.font('Helvetica').fontSize(11);
  for (const s of prep.steps) {
    const mid = y + ROW / 2 - 6;
    const cells = [s.label, s.plannedDate ? shortDate(s.plannedDate) : '—', s.crewName ?? (s.workOrderId === null ? '—' : 'Not assigned'), s.plannedHours !== null ? hoursText(s.plannedHours) : '—'];
    cells.forEach((text, i) => cell(i, text, mid));
    // A box to tick by hand; a step already done is ticked.
    const bx = cols[4]!.x + 8;
    const by = y + ROW / 2 - 7;
    doc.rect(bx, by, 14, 14).lineWidth(1).strokeColor(INK).stroke();
    if (s.done) doc.moveTo(bx + 3, by + 7).lineTo(bx + 6, by + 11).lineTo(bx + 12, by + 3).lineWidth(2).stroke();
    doc.moveTo(cols[5]!.x + 4, y + ROW - 8).lineTo(cols[5]!.x + cols[5]!.px - 4, y + ROW - 8).lineWidth(0.5).strokeColor(MUTED).stroke();
    y += ROW;
    rule(doc, MARGIN, width, y, 0.5, '#b8c0ba');
  }
  doc.x = MARGIN;
  doc.y = y + 16;

  if (prep.colourant) {
    const c = colourantFacts(prep.colourant, units);
    doc.fillColor(INK).font('Helvetica-Bold').fontSize(12).text('Colourant', MARGIN, doc.y, { width });
    doc.font('Helvetica').fontSize(11).text(`${prep.colourant.product}: ${c.rate} over ${c.area} (${c.amount} of product).`, { width });
    doc.fillColor(MUTED).fontSize(10).text(CAUTIONS.colourant, { width });
    doc.moveDown(0.8);
  }
  if (prep.steps.some((s) => s.step === 'paint_lines' || s.step === 'logo')) {
    doc.fillColor(MUTED).font('Helvetica').fontSize(10).text(CAUTIONS.lines, MARGIN, doc.y, { width });
    doc.moveDown(0.8);
  }
  if (prep.steps.some((s) => s.step === 'mow')) {
    doc.fillColor(MUTED).font('Helvetica').fontSize(10).text(CAUTIONS.mowing, MARGIN, doc.y, { width });
    doc.moveDown(0.8);
  }
  doc.moveDown(1);
  doc.fillColor(INK).font('Helvetica').fontSize(11).text('Field ready for play, checked by: ______________________________   Time: ________', MARGIN, doc.y, { width });
  doc.fillColor(MUTED).fontSize(8).text(`Printed ${shortDate(printedOn)} · Swardwise`, MARGIN, doc.page.height - MARGIN - 10, { width, lineBreak: false });
  doc.end();
  return done;
}
