import { AnswerRecorder } from './answers';
import { VariantData } from './series';
import { HeaderSpan, PAGE, Sheet, TableColumn } from './sheet';
import { Field } from './types';

/** Building blocks that every invented datasheet shares: cover, rating tables, notes. */

export interface CoverText {
  title: string;
  subtitle: string;
  description: string;
  features: string[];
  applications?: string[];
}

export function cover(sheet: Sheet, c: CoverText): number {
  sheet.text(c.title, PAGE.left, 62, { size: 18, bold: true });
  sheet.text(c.subtitle, PAGE.left, 88, { size: 11 });
  let y = sheet.paragraph(c.description, PAGE.left, 112, PAGE.right - PAGE.left, { size: 9 }) + 6;
  y = sheet.heading('Features', y, 10);
  y = sheet.bullets(c.features, PAGE.left + 4, y, 300);
  if (c.applications) {
    y = sheet.heading('Applications', y + 4, 10);
    y = sheet.bullets(c.applications, PAGE.left + 4, y, 300);
  }
  return y + 6;
}

/** A short block of "Label: text" lines (mechanical data and the like). */
export function infoLines(sheet: Sheet, y: number, heading: string, lines: string[]): number {
  let cy = sheet.heading(heading, y, 10);
  for (const line of lines) {
    cy = sheet.paragraph(line, PAGE.left + 4, cy, PAGE.right - PAGE.left - 4, { size: 9 }) - 1;
  }
  return cy + 6;
}

export interface RatingRow {
  label: string;
  symbol: string;
  condition?: string;
  /** One value, or [min, max] for tables with min and max columns. */
  value: string | [string, string];
  unit: string;
  /** The device-wide card field this row prints, if any. */
  field?: 'pdMax' | 'tjMax' | 'rthJA';
  /** What the answer key records when the row prints the value differently (a range's end, "C" for °C). */
  printedAs?: { value?: string; unit?: string };
}

/** Absolute maximum ratings / thermal tables: Parameter | Symbol | Conditions | Value | Unit. */
export function ratingTable(sheet: Sheet, rec: AnswerRecorder, y: number, heading: string, rows: RatingRow[], minMax = false): number {
  let cy = sheet.heading(heading, y, 10);
  const columns: TableColumn[] = minMax
    ? [
        { width: 175, align: 'left' },
        { width: 50, align: 'center' },
        { width: 150, align: 'left' },
        { width: 40, align: 'center' },
        { width: 40, align: 'center' },
        { width: 40, align: 'center' },
      ]
    : [
        { width: 190, align: 'left' },
        { width: 50, align: 'center' },
        { width: 150, align: 'left' },
        { width: 65, align: 'center' },
        { width: 40, align: 'center' },
      ];
  const header: HeaderSpan[] = minMax
    ? ['Parameter', 'Symbol', 'Conditions', 'Min', 'Max', 'Unit'].map((text, i) => ({ text, from: i, to: i }))
    : ['Parameter', 'Symbol', 'Conditions', 'Value', 'Unit'].map((text, i) => ({ text, from: i, to: i }));
  cy = sheet.tableHeader(PAGE.left, cy, columns, [header], { size: 8, bold: true, lineHeight: 12 });
  for (const row of rows) {
    const values = Array.isArray(row.value) ? row.value : minMax ? ['', row.value] : [row.value];
    sheet.tableRow(PAGE.left, cy, columns, [row.label, row.symbol, row.condition ?? '', ...values, row.unit], { size: 8 });
    if (row.field) rec.device(row.field, sheet.page, row.printedAs);
    cy += 13;
  }
  sheet.rule(PAGE.left, PAGE.left + columns.reduce((s, c) => s + c.width, 0), cy - 2, 0.5);
  return cy + 6;
}

export function notes(sheet: Sheet, y: number, lines: string[], size = 7.5): number {
  let cy = y;
  for (const line of lines) cy = sheet.paragraph(line, PAGE.left, cy, PAGE.right - PAGE.left, { size }) - 2;
  return cy + 6;
}

/** Package outline dimensions: Dim | Min | Max (mm). */
export function dimensionTable(sheet: Sheet, y: number, heading: string, rows: Array<[string, string, string]>, remark: string): number {
  let cy = sheet.heading(heading, y, 10);
  const columns: TableColumn[] = [
    { width: 50, align: 'left' },
    { width: 50, align: 'center' },
    { width: 50, align: 'center' },
  ];
  cy = sheet.tableHeader(PAGE.left, cy, columns, [['Dim.', 'Min (mm)', 'Max (mm)'].map((text, i) => ({ text, from: i, to: i }))], {
    size: 8,
    bold: true,
    lineHeight: 12,
  });
  for (const row of rows) {
    sheet.tableRow(PAGE.left, cy, columns, row, { size: 8 });
    cy += 12;
  }
  sheet.box(330, y + 20, 200, 110);
  sheet.text('outline drawing: see dimensions', 350, y + 70, { size: 7 });
  return notes(sheet, cy + 6, [remark]);
}

export interface SeriesColumn {
  width: number;
  align: 'left' | 'right' | 'center';
  cell: (v: VariantData) => string;
  /** The card field printed in this column (recorded on the row's page). */
  field?: Field;
  /** This column prints the package (recorded on the row's page). */
  isPackage?: boolean;
}

export interface SeriesTableOptions {
  columns: SeriesColumn[];
  header: HeaderSpan[][];
  rows: number[];
  y: number;
  bottom?: number;
  rowHeight?: number;
  fontSize?: number;
  /** Repeat the header on the continuation page (some vendors do not). */
  repeatHeader: boolean;
  continuedCaption?: string;
  /** Start a new page after this many rows on one page. */
  maxRowsPerPage?: number;
  /** Fields given once in the header (e.g. "VZ at IZT = 5 mA"): recorded on the header's page. */
  headerFields?: Field[];
}

/** A series table, one row per part number, continued on new pages as needed. */
export function seriesTable(sheet: Sheet, rec: AnswerRecorder, o: SeriesTableOptions): number {
  const rowHeight = o.rowHeight ?? 12;
  const size = o.fontSize ?? 7.5;
  const bottom = o.bottom ?? PAGE.bottom;
  const columns: TableColumn[] = o.columns.map((c) => ({ width: c.width, align: c.align }));
  const width = columns.reduce((s, c) => s + c.width, 0);
  const drawHeader = (y: number) => sheet.tableHeader(PAGE.left, y, columns, o.header, { size, bold: true, condensed: true, lineHeight: 10 });
  let y = drawHeader(o.y);
  // Rows take header-given conditions from the header above them (repeated or not).
  let headerPage = sheet.page;
  let onPage = 0;
  for (const index of o.rows) {
    if (y + rowHeight > bottom || onPage === o.maxRowsPerPage) {
      onPage = 0;
      sheet.rule(PAGE.left, PAGE.left + width, y - 2, 0.8);
      sheet.text('continued on next page', PAGE.left, y + 2, { size: 7 });
      sheet.addPage();
      y = PAGE.top;
      if (o.continuedCaption) {
        sheet.text(o.continuedCaption, PAGE.left, y, { size: 10, bold: true });
        y += 22;
      }
      if (o.repeatHeader) {
        y = drawHeader(y);
        headerPage = sheet.page;
      } else {
        sheet.rule(PAGE.left, PAGE.left + width, y - 3, 0.8);
      }
    }
    for (const f of o.headerFields ?? []) rec.value(index, f, headerPage);
    const v = rec.data.variants[index];
    sheet.tableRow(
      PAGE.left,
      y,
      columns,
      o.columns.map((c) => c.cell(v)),
      { size, condensed: true },
    );
    for (const c of o.columns) {
      if (c.field) rec.value(index, c.field, sheet.page);
      if (c.isPackage) rec.packagePage([index], sheet.page);
    }
    y += rowHeight;
    onPage++;
  }
  sheet.rule(PAGE.left, PAGE.left + width, y - 2, 0.8);
  return y + 8;
}

/** Cell text helpers. */
export const val = (field: Field) => (v: VariantData) => v.values[field]?.value ?? '–';
export const withUnit = (field: Field) => (v: VariantData) => {
  const p = v.values[field];
  return p ? `${p.value} ${p.unit}` : '–';
};

export function spans(texts: Array<string | [string, number, number]>): HeaderSpan[] {
  const out: HeaderSpan[] = [];
  let col = 0;
  for (const t of texts) {
    if (Array.isArray(t)) {
      out.push({ text: t[0], from: t[1], to: t[2] });
      col = t[2] + 1;
    } else {
      if (t !== '') out.push({ text: t, from: col, to: col });
      col++;
    }
  }
  return out;
}
