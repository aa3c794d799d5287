/**
 * The season budget as a CSV (papaparse) and as a printable report (pdfkit) with its chart,
 * drawn here: budget, outlook and actual to date per money line, the axis in the currency.
 * Both carry the same rounded figures the API answers, so a CSV read back gives them again.
 */
import Papa from 'papaparse';
import type { BudgetAnswer } from '@swardwise/domain';
import { pdfDocument, pdfTable, rule } from './pdf.ts';

export const BUDGET_CSV_COLUMNS = ['line', 'label', 'quantity_unit', 'budget', 'budget_unit', 'outlook_quantity', 'outlook_cost', 'actual_quantity', 'actual_cost'] as const;

const blank = (v: number | null) => (v === null ? '' : v);

export function budgetCsv(b: BudgetAnswer): string {
  const rows = b.lines.map((l) => [l.line, l.label, l.quantityUnit, blank(l.budget), l.money ? b.currency : 'h', l.outlook.quantity, blank(l.outlook.cost), l.actual.quantity, blank(l.actual.cost)]);
  return Papa.unparse({ fields: [...BUDGET_CSV_COLUMNS], data: rows }, { newline: '\n' });
}

const MARGIN = 54;
const INK = '#1f2a1f';
const MUTED = '#55605a';
/** Budget, outlook and actual: one colour each, told apart in print by the legend and the labels. */
const SERIES = [
  { key: 'budget', label: 'Budget', colour: '#2f5d8a' },
  { key: 'outlook', label: 'Outlook (season)', colour: '#8a6d1f' },
  { key: 'actual', label: 'Actual to date', colour: '#2e7d4f' },
] as const;

const money = (v: number, currency: string) => `${currency} ${Math.round(v).toLocaleString('en-US')}`;
const qty = (v: number) => (Math.abs(v) >= 100 ? Math.round(v).toLocaleString('en-US') : v.toLocaleString('en-US', { maximumFractionDigits: 1 }));

/** A round step for an axis up to `max`, about five ticks. */
function niceStep(max: number): number {
  const raw = max / 5;
  const p = 10 ** Math.floor(Math.log10(raw));
  return [1, 2, 2.5, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
}

/** The PDF's bytes. `printedOn` is the department's date the report was made. */
export function budgetPdf(b: BudgetAnswer, printedOn: string): Promise<Buffer> {
  const { doc, done } = pdfDocument({ size: 'LETTER', margin: MARGIN, info: { Title: `Season budget ${b.season}: ${b.scopeName}`, Author: 'Swardwise' } });
  const width = doc.page.width - 2 * MARGIN;
  doc.fillColor(MUTED).font('Helvetica').fontSize(10).text('SEASON BUDGET', MARGIN, MARGIN);
  doc.fillColor(INK).font('Helvetica-Bold').fontSize(20).text(`${b.scopeName}, season ${b.season}`, { width });
  doc.font('Helvetica').fontSize(10).fillColor(MUTED).text(`Actual to date: done work up to ${b.actualTo}. Printed ${printedOn}. Money in ${b.currency}.`, { width });
  doc.text(b.outlook.note, { width });
  doc.moveDown(0.8);

  // The chart: grouped bars per money line.
  const lines = b.lines.filter((l) => l.money);
  const values = lines.map((l) => [l.budget ?? 0, l.outlook.cost ?? 0, l.actual.cost ?? 0]);
  const max = Math.max(1, ...values.flat());
  const step = niceStep(max);
  const top = Math.ceil(max / step) * step;
  const chartX = MARGIN + 62;
  const chartW = width - 62;
  const chartY = doc.y + 10;
  const chartH = 220;
  doc.fillColor(INK).font('Helvetica-Bold').fontSize(11).text('Budget, outlook and actual to date per line', MARGIN, doc.y);
  doc.font('Helvetica').fontSize(8).fillColor(MUTED);
  for (let v = 0; v <= top + 1e-9; v += step) {
    const y = chartY + 14 + chartH - (v / top) * chartH;
    doc.moveTo(chartX, y).lineTo(chartX + chartW, y).lineWidth(0.5).strokeColor('#d5d9d5').stroke();
    doc.fillColor(MUTED).text(Math.round(v).toLocaleString('en-US'), MARGIN, y - 4, { width: 56, align: 'right', lineBreak: false });
  }
  // Axis names with their units.
  doc.save().rotate(-90, { origin: [MARGIN - 14, chartY + 14 + chartH / 2] });
  doc.fillColor(INK).fontSize(9).text(`Cost (${b.currency})`, MARGIN - 64, chartY + 14 + chartH / 2 - 4, { width: 100, align: 'center', lineBreak: false });
  doc.restore();
  const base = chartY + 14 + chartH;
  doc.moveTo(chartX, base).lineTo(chartX + chartW, base).lineWidth(1).strokeColor(INK).stroke();
  const groupW = chartW / lines.length;
  const barW = (groupW * 0.7) / SERIES.length;
  lines.forEach((l, i) => {
    const gx = chartX + i * groupW + groupW * 0.15;
    SERIES.forEach((s, k) => {
      const h = (values[i]![k]! / top) * chartH;
      if (h > 0) doc.rect(gx + k * barW, base - h, barW - 2, h).fillColor(s.colour).fill();
    });
    doc.fillColor(INK).fontSize(9).text(l.label, chartX + i * groupW, base + 4, { width: groupW, align: 'center', lineBreak: false });
  });
  doc.fillColor(INK).fontSize(9).text('Budget line', chartX, base + 18, { width: chartW, align: 'center', lineBreak: false });
  let lx = chartX;
  const ly = base + 34;
  for (const s of SERIES) {
    doc.rect(lx, ly, 10, 10).fillColor(s.colour).fill();
    doc.fillColor(INK).fontSize(9).text(s.label, lx + 14, ly + 1, { lineBreak: false });
    lx += 130;
  }

  // The table.
  const table = pdfTable(doc, { left: MARGIN, width, y: ly + 30, pad: 2, headerHeight: 14, fontSize: 9, ink: INK }, [
    { title: 'Line', w: 0.2 },
    { title: 'Budget', w: 0.15 },
    { title: 'Outlook', w: 0.16 },
    { title: 'Outlook qty', w: 0.17 },
    { title: 'Actual', w: 0.15 },
    { title: 'Actual qty', w: 0.17 },
  ]);
  let y = table.y;
  doc.font('Helvetica').fontSize(9);
  for (const l of b.lines) {
    y += 5;
    const fmt = (v: number | null) => (v === null ? '—' : l.money ? money(v, b.currency) : `${qty(v)} h`);
    const cells = [l.label, fmt(l.budget), l.money ? fmt(l.outlook.cost) : `${qty(l.outlook.quantity)} h`, `${qty(l.outlook.quantity)} ${l.quantityUnit}`, l.money ? fmt(l.actual.cost) : `${qty(l.actual.quantity)} h`, `${qty(l.actual.quantity)} ${l.quantityUnit}`];
    cells.forEach((t, i) => table.cell(i, t, y));
    y += 14;
    rule(doc, MARGIN, width, y, 0.5, '#d5d9d5');
  }
  y += 6;
  doc.font('Helvetica-Bold').fillColor(INK).text(`Total (money lines): budget ${money(b.totals.budget, b.currency)} · outlook ${money(b.totals.outlook, b.currency)} · actual to date ${money(b.totals.actual, b.currency)}`, MARGIN, y, { width });
  doc.end();
  return done;
}
