/** One cell: text, a number already rounded to what the screen prints, or empty. */
export type CsvCell = string | number | null | undefined;

// A cell a spreadsheet would run as a formula (=, +, -, @, tab, CR at the start) gets a
// leading apostrophe (OWASP "CSV injection"; common practice). Numbers are never touched.
const FORMULA_START = /^[=+\-@\t\r]/;

function cell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** RFC 4180 text: a header row, then the rows; CRLF line ends, quotes doubled. */
export function toCsv(header: readonly string[], rows: ReadonlyArray<readonly CsvCell[]>): string {
  return [header, ...rows].map((r) => r.map(cell).join(',')).join('\r\n') + '\r\n';
}
