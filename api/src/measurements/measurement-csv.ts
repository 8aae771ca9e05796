import {
  normaliseQuantityText,
  parseQuantity,
  UnitParseError,
  type CsvCellError,
  type MeasuredSample,
  type MeasurementColumn,
  type MeasurementCsvReading,
  type QuantityKind,
} from '@shuntwise/contracts';
import { CsvError, parse } from 'csv-parse/sync';

/** Header words people use for each column, compared without case, spaces, dashes or underscores. */
const HEADER_WORDS: Record<string, MeasurementColumn> = {
  sample: 'sample',
  sampleid: 'sample',
  samplenumber: 'sample',
  serial: 'sample',
  dut: 'sample',
  device: 'sample',
  current: 'current',
  reversecurrent: 'current',
  i: 'current',
  ir: 'current',
  iz: 'current',
  voltage: 'voltage',
  reversevoltage: 'voltage',
  v: 'voltage',
  vr: 'voltage',
  vz: 'voltage',
  temperature: 'temperature',
  temp: 'temperature',
  t: 'temperature',
  ta: 'temperature',
  tamb: 'temperature',
  lot: 'lot',
  lotcode: 'lot',
  datecode: 'lot',
  lotordatecode: 'lot',
};

const KIND: Partial<Record<MeasurementColumn, QuantityKind>> = { current: 'current', voltage: 'voltage', temperature: 'temperature' };
const MAX_ROWS = 100_000;
const DEFAULT_TEMPERATURE_C = 25;

/**
 * Reads a measurement CSV into samples of SI points. Nothing is guessed: a cell that is not a
 * number in a unit of its column's kind is a row error naming the row and column, and the row
 * is left out; the file as a whole fails only when a needed column is missing.
 */
export function readMeasurementCsv(text: string): MeasurementCsvReading {
  let records: string[][];
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true, to_line: MAX_ROWS + 1 });
  } catch (error) {
    const reason = error instanceof CsvError ? error.message : String(error);
    return { columns: [], samples: [], errors: [{ row: 1, column: '', message: `the file is not readable as CSV: ${reason}` }], warnings: [] };
  }
  const errors: CsvCellError[] = [];
  const warnings: string[] = [];
  if (records.length < 2) {
    return { columns: [], samples: [], errors: [{ row: 1, column: '', message: 'a header row and at least one row of points are needed' }], warnings };
  }
  const columns = records[0].map((header) => readHeader(header));
  const index = (column: MeasurementColumn) => columns.findIndex((c) => c.column === column);
  for (const needed of ['current', 'voltage'] as const) {
    if (index(needed) < 0)
      errors.push({
        row: 1,
        column: needed,
        message: `no ${needed} column: name one "${needed}" with its unit, e.g. "${needed} (${needed === 'current' ? 'mA' : 'V'})"`,
      });
  }
  for (const c of columns) if (c.column === null) warnings.push(`column "${c.header}" is not a measurement column and was left out`);
  const seen = new Set<MeasurementColumn>();
  for (const c of columns) {
    if (c.column === null) continue;
    if (seen.has(c.column)) errors.push({ row: 1, column: c.header, message: `a second ${c.column} column: keep one` });
    seen.add(c.column);
  }
  if (errors.length > 0) return { columns, samples: [], errors, warnings };
  if (index('temperature') < 0) warnings.push(`no temperature column: every point taken at ${DEFAULT_TEMPERATURE_C} °C`);
  if (records.length > MAX_ROWS + 1) warnings.push(`only the first ${MAX_ROWS} rows were read`);

  const samples = new Map<string, MeasuredSample>();
  let flipped = 0;
  for (let r = 1; r < records.length; r++) {
    const row = r + 1; // line number in the file, header = 1
    const cells = records[r];
    const cell = (column: MeasurementColumn) => {
      const k = index(column);
      return k < 0 ? '' : (cells[k] ?? '').trim();
    };
    const values: Partial<Record<MeasurementColumn, number>> = {};
    let bad = false;
    for (const column of ['current', 'voltage', 'temperature'] as const) {
      const k = index(column);
      if (k < 0) continue;
      const raw = cell(column);
      if (raw === '') {
        if (column === 'temperature') continue;
        errors.push({ row, column: columns[k].header, message: `no ${column} in this row` });
        bad = true;
        continue;
      }
      try {
        values[column] = parseQuantity(raw, KIND[column]!, { field: columns[k].header, defaultUnit: columns[k].unit ?? undefined });
      } catch (error) {
        const message = error instanceof UnitParseError ? error.message : `"${raw}" is not a ${column}`;
        errors.push({ row, column: columns[k].header, message });
        bad = true;
      }
    }
    if (bad) continue;
    let current = values.current!;
    let voltage = values.voltage!;
    if (current < 0 && voltage < 0) {
      current = -current;
      voltage = -voltage;
      flipped++;
    } else if (current <= 0 || voltage <= 0) {
      errors.push({
        row,
        column: columns[index('current')].header,
        message: 'current and voltage must both be reverse (both positive, or both negative as a source-measure unit writes them)',
      });
      continue;
    }
    const sampleId = cell('sample') || 'sample 1';
    const lot = cell('lot') || null;
    const key = `${lot ?? ''}\u0000${sampleId}`;
    let sample = samples.get(key);
    if (!sample) {
      sample = { sampleId, lot, points: [] };
      samples.set(key, sample);
    }
    sample.points.push({ current, voltage, tempC: values.temperature ?? DEFAULT_TEMPERATURE_C });
  }
  if (flipped > 0) warnings.push(`${flipped} point(s) written with negative current and voltage were read as reverse magnitudes`);
  if (index('sample') < 0) warnings.push('no sample column: all points taken as one sample');
  return { columns, samples: [...samples.values()], errors, warnings };
}

function readHeader(header: string): MeasurementCsvReading['columns'][number] {
  // "current (mA)", "current [mA]", "I/mA", "current mA"
  const clean = normaliseQuantityText(header);
  const bracket = /^(.*?)[([]\s*([^)\]]*)\s*[)\]]\s*$/.exec(clean);
  const slash = /^([A-Za-z ._-]+)\/([^/]+)$/.exec(clean);
  const [name, unit] = bracket ? [bracket[1], bracket[2]] : slash ? [slash[1], slash[2]] : [clean, ''];
  const key = name.toLowerCase().replace(/[\s_.-]/g, '');
  const column = HEADER_WORDS[key] ?? null;
  return { header, column, unit: unit.trim() || null };
}
