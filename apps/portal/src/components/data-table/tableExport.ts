import Papa from 'papaparse';

/** A column as the export sees it: its CSV header and how to read a row's value. */
export interface ExportColumn<Row> {
  header: string;
  value: (row: Row) => string | number | null;
}

/** The rows as CSV text (papaparse quotes what needs quoting), one header line first. */
export function rowsToCsv<Row>(columns: ExportColumn<Row>[], rows: Row[]): string {
  return Papa.unparse({ fields: columns.map((c) => c.header), data: rows.map((r) => columns.map((c) => c.value(r) ?? '')) }, { newline: '\r\n' });
}

/** Offers the text as a file download in the browser. */
export function downloadText(fileName: string, text: string, type = 'text/csv;charset=utf-8') {
  // A BOM so spreadsheet programs read the file as UTF-8 (ft², names with accents).
  const url = URL.createObjectURL(new Blob(['\uFEFF', text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

const key = (table: string) => `swardwise.table.${table}.columns`;

/** The columns a person hid in a table, remembered in this browser. */
export function loadHiddenColumns(table: string): Record<string, boolean> {
  try {
    const raw = localStorage.getItem(key(table));
    const parsed: unknown = raw ? JSON.parse(raw) : {};
    if (!parsed || typeof parsed !== 'object') return {};
    return Object.fromEntries(Object.entries(parsed).filter(([, v]) => typeof v === 'boolean')) as Record<string, boolean>;
  } catch {
    return {};
  }
}

export function saveHiddenColumns(table: string, visibility: Record<string, boolean>) {
  try {
    localStorage.setItem(key(table), JSON.stringify(visibility));
  } catch {
    // Private windows may refuse storage; the choice then lasts for the page only.
  }
}
