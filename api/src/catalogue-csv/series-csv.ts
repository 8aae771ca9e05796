import {
  CARD_FIELD_KINDS,
  CARD_FIELD_WORDS,
  CARD_FIELDS,
  kindOfUnit,
  manufacturerNameSchema,
  mpnSchema,
  packageSchema,
  parseQuantity,
  ratingCardFieldsInputSchema,
  UnitParseError,
  type CardField,
  type CsvCellError,
  type PlainCardField,
  type RatingCardFieldsInput,
  type RatingCardFieldsParsed,
} from '@shuntwise/contracts';
import { CsvError, parse } from 'csv-parse/sync';
import { restoreCsvText } from '../common/csv/csv-export';

/** Identity columns of a series CSV besides the card fields. */
const IDENTITY = ['manufacturer', 'mpn', 'package', 'lifecycleNote'] as const;
type IdentityColumn = (typeof IDENTITY)[number];
type ColumnField = CardField | IdentityColumn | 'page';

/** Spellings people use for a column, compared without case, spaces, dashes or underscores. */
const ALIASES: Record<string, ColumnField> = {
  vendor: 'manufacturer',
  maker: 'manufacturer',
  partnumber: 'mpn',
  part: 'mpn',
  type: 'mpn',
  case: 'package',
  lifecycle: 'lifecycleNote',
  tempco: 'tc',
  alphavz: 'tc',
  // the card export's headers in words (CARD_FIELD_WORDS, "Zener voltage nominal (V)")
  manufacturerpartnumber: 'mpn',
};
/** Columns our own card export writes that an import reads past without a warning (short names of older files, words of newer ones). */
const EXPORT_ONLY = new Set(['cardversion', 'tcvoltsperkelvin', 'unconfirmedfields', 'temperaturecoefficientconverted']);

export interface SeriesColumn {
  index: number;
  header: string;
  field: ColumnField | null;
  unit: string | null;
}

export interface SeriesRow {
  /** Line number in the file; the header is 1. */
  row: number;
  manufacturer: string | null;
  mpn: string | null;
  package: string | null;
  lifecycleNote: string | null;
  /** The card, valid, when the row has no errors. */
  fields: RatingCardFieldsParsed | null;
  values: Record<string, { value: number; printed: string; unit?: string }>;
  errors: CsvCellError[];
}

export interface ParsedSeries {
  columns: SeriesColumn[];
  rows: SeriesRow[];
  warnings: string[];
}

type StringSchema = { safeParse(value: unknown): { success: true; data: string } | { success: false; error: { issues: Array<{ message: string }> } } };

/** A CSV that cannot be read at all (no header, broken quoting): a 400 naming the line. */
export class SeriesCsvError extends Error {}

const canonical = (s: string) => s.toLowerCase().replace(/[\s_\-.]/g, '');
const FIELD_BY_NAME = new Map<string, ColumnField>([
  ...[...CARD_FIELDS, ...IDENTITY, 'page' as const].map((f) => [canonical(f), f] as [string, ColumnField]),
  ...Object.entries(ALIASES),
  ...Object.entries(CARD_FIELD_WORDS).map(([f, words]) => [canonical(words), f as ColumnField] as [string, ColumnField]),
]);

/** "izt (mA)", "izt [mA]", "IZT mA"? — only () and [] carry a unit; the rest is the name. */
export function readHeader(header: string): { name: string; unit: string | null } {
  const match = /^\s*(.*?)\s*(?:[([]\s*([^)\]]*?)\s*[)\]])?\s*$/.exec(header)!;
  return { name: match[1], unit: match[2] ? match[2] : null };
}

/**
 * Reads a vendor series: one row per part, card values with units in the header or the
 * cell. Every problem is reported with its line and column; nothing is guessed.
 */
export function parseSeriesCsv(text: string, defaults: { manufacturer?: string; datasheetId?: number } = {}): ParsedSeries {
  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    records = parse(text, { bom: true, delimiter: [',', ';', '\t'], relax_column_count: true, skip_empty_lines: true, trim: true, info: true }) as never;
  } catch (error) {
    if (error instanceof CsvError)
      throw new SeriesCsvError(
        `The CSV cannot be read near line ${(error as CsvError & { lines?: number }).lines ?? '?'}: ${error.message.replace(/^Invalid [^:]*: /, '')}`,
      );
    throw error;
  }
  // A cell our export neutralised against formula injection reads back as written.
  for (const r of records) r.record = r.record.map(restoreCsvText);
  if (records.length === 0) throw new SeriesCsvError('The CSV has no header row');
  const [head, ...body] = records;
  const warnings: string[] = [];
  const columns: SeriesColumn[] = head.record.map((header, index) => {
    const { name, unit } = readHeader(header);
    const field = FIELD_BY_NAME.get(canonical(name)) ?? null;
    if (!field && !EXPORT_ONLY.has(canonical(name))) warnings.push(`column "${header}" is not a card field or part column and is not read`);
    return { index, header, field, unit };
  });
  const seen = new Map<ColumnField, string>();
  for (const c of columns) {
    if (!c.field) continue;
    if (seen.has(c.field)) throw new SeriesCsvError(`Columns "${seen.get(c.field)}" and "${c.header}" both give ${c.field}`);
    seen.set(c.field, c.header);
    if (c.unit && c.field !== 'tc' && c.field in CARD_FIELD_KINDS) {
      try {
        parseQuantity(`1 ${c.unit}`, CARD_FIELD_KINDS[c.field as PlainCardField], { field: c.header });
      } catch {
        throw new SeriesCsvError(`Column "${c.header}": the unit "${c.unit}" does not fit ${c.field}`);
      }
    }
  }
  if (!seen.has('mpn')) throw new SeriesCsvError('The CSV needs an mpn column (the manufacturer part number)');
  if (!seen.has('manufacturer') && !defaults.manufacturer)
    throw new SeriesCsvError('Name the manufacturer: a manufacturer column, or the manufacturer for the whole file');
  const byField = new Map(columns.filter((c) => c.field).map((c) => [c.field!, c]));

  const rows: SeriesRow[] = [];
  const keys = new Map<string, number>();
  for (const { record, info } of body) {
    const row = info.lines;
    const errors: CsvCellError[] = [];
    const cell = (f: ColumnField) => {
      const c = byField.get(f);
      return c ? (record[c.index] ?? '').trim() : '';
    };
    const columnOf = (f: ColumnField) => byField.get(f)?.header ?? f;
    if (record.length > head.record.length) errors.push({ row, column: '(row)', message: `${record.length} cells, the header has ${head.record.length}` });

    const identity = (f: IdentityColumn, schema: StringSchema, required: boolean, fallback?: string): string | null => {
      const raw = cell(f) || fallback || '';
      if (!raw) {
        if (required) errors.push({ row, column: columnOf(f), message: `no ${f}` });
        return null;
      }
      const parsed = schema.safeParse(raw);
      if (!parsed.success) {
        errors.push({ row, column: columnOf(f), message: parsed.error.issues[0].message });
        return null;
      }
      return parsed.data;
    };
    const manufacturer = identity('manufacturer', manufacturerNameSchema, true, defaults.manufacturer);
    const mpn = identity('mpn', mpnSchema, true);
    const pkg = identity('package', packageSchema, false);
    const lifecycleNote = cell('lifecycleNote') || null;
    if (lifecycleNote && lifecycleNote.length > 500)
      errors.push({ row, column: columnOf('lifecycleNote'), message: `${lifecycleNote.length} characters; at most 500` });
    let page: number | null = null;
    if (cell('page')) {
      page = Number(cell('page'));
      if (!Number.isInteger(page) || page < 1) {
        errors.push({ row, column: columnOf('page'), message: `"${cell('page')}" is not a page number` });
        page = null;
      }
    }
    if (manufacturer && mpn) {
      const key = `${manufacturer}\u0000${mpn}`.toLowerCase();
      if (keys.has(key)) errors.push({ row, column: columnOf('mpn'), message: `${mpn} is already on row ${keys.get(key)}` });
      else keys.set(key, row);
    }

    const input: Record<string, unknown> = {};
    const values: SeriesRow['values'] = {};
    const provenance = { source: 'imported' as const, datasheetId: defaults.datasheetId ?? null, page: defaults.datasheetId ? page : null };
    for (const field of CARD_FIELDS) {
      const text = cell(field);
      if (!text) continue;
      const column = byField.get(field)!;
      const printed = /[^\d.\s+\-−eE]/.test(text) || !column.unit ? text : `${text} ${column.unit}`;
      try {
        if (field === 'tc') {
          const tc = readTc(text, column);
          input.tc = { value: tc.value, unit: tc.unit, printed, provenance: { ...provenance, text: printed } };
          values.tc = { value: tc.value, printed, unit: tc.unit };
        } else {
          const value = parseQuantity(text, CARD_FIELD_KINDS[field], { field: column.header, defaultUnit: column.unit ?? undefined });
          input[field] = { value, printed, provenance: { ...provenance, text: printed } };
          values[field] = { value, printed };
        }
      } catch (error) {
        if (!(error instanceof UnitParseError)) throw error;
        errors.push({ row, column: column.header, message: `cannot read "${text}" as ${error.expected}` });
      }
    }
    let fields: RatingCardFieldsParsed | null = null;
    if (errors.length === 0) {
      const parsed = ratingCardFieldsInputSchema.safeParse(input as RatingCardFieldsInput);
      if (parsed.success) fields = parsed.data;
      else {
        for (const issue of parsed.error.issues) {
          const field = String(issue.path[0]) as ColumnField;
          const missing = issue.path.length === 1 && input[field] === undefined;
          errors.push({ row, column: columnOf(field), message: missing ? `no ${field}: a card needs vzNom and izt` : issue.message });
        }
      }
    }
    rows.push({ row, manufacturer, mpn, package: pkg, lifecycleNote, fields, values, errors });
  }
  if (rows.length === 0) warnings.push('the CSV has a header but no rows');
  return { columns, rows, warnings };
}

/** tc as the card keeps it: mV/K (any V/K or V/°C spelling, scaled) or %/K. */
function readTc(text: string, column: SeriesColumn): { value: number; unit: 'mV/K' | '%/K' } {
  const unitInCell = text.replace(/^\s*[+\-−]?[\d.]+(?:[eE][+-]?\d+)?\s*/, '');
  const unit = unitInCell || column.unit;
  const kind = unit ? kindOfUnit(unit) : undefined;
  if (kind === 'tempCoPercent')
    return { value: parseQuantity(text, 'tempCoPercent', { field: column.header, defaultUnit: column.unit ?? undefined }), unit: '%/K' };
  const vPerK = parseQuantity(text, 'tempCoVoltage', { field: column.header, defaultUnit: column.unit ?? undefined });
  return { value: Number((vPerK * 1e3).toPrecision(12)), unit: 'mV/K' };
}
