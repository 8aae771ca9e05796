import type { ExtractionField, QuantityKind } from '@shuntwise/contracts';
import { fieldFor, FieldMatch, findConditions, isPackageHeader, LABELS, qualifierOf, titleConditions } from './field-patterns';
import { findPackage, isPartNumber, seriesLetters } from './part-numbers';
import { blankFootnotes, findQuantities, headerUnit, isEmptyCell, isNumericCell, isUnitOnly, ohmReadAsDigit, toSi, unitKind } from './quantity-text';
import { Cell, cellBox, Line } from './text-layout';
import { FIELD_KINDS, orderOf, VariantDrafts } from './variant-drafts';

/**
 * Series tables: one row per part number, a header above (one to several lines, with
 * group headings over min/nom/max), units in the header or in the cells, continued on the
 * next page with the header repeated or not.
 */

interface Span {
  x0: number;
  x1: number;
}

interface ColumnPlan {
  span: Span;
  header: string;
  unit?: string;
  match?: FieldMatch;
  isPackage: boolean;
}

interface HeaderCondition {
  field: 'izt' | 'izk' | 'vr';
  value: string;
  unit: string;
  kind: QuantityKind;
  page: number;
  text: string;
  cell: Cell;
}

/** What a table's header says, kept for a continuation without a header on the next page. */
interface TablePlan {
  columns: ColumnPlan[];
  conditions: HeaderCondition[];
}

export function isDataRow(line: Line): boolean {
  if (line.cells.length < 4 || !isPartNumber(line.cells[0].text)) return false;
  let numeric = 0;
  for (let i = 1; i < line.cells.length; i++) if (isNumericCell(line.cells[i].text)) numeric++;
  // Two figures are enough: a scanned row can lose most of its cells (a blank beats a doubtful figure).
  return numeric >= 2;
}

const centre = (s: Span) => (s.x0 + s.x1) / 2;
const overlap = (a: Span, b: Span) => Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);

function columnsOf(rows: Line[]): Span[] {
  const cols: Span[] = [];
  for (const row of rows) {
    for (const cell of row.cells) {
      let best: Span | undefined;
      let bestOverlap = -0.5;
      for (const c of cols) {
        const o = overlap(c, cell);
        if (o > bestOverlap) {
          best = c;
          bestOverlap = o;
        }
      }
      if (best) {
        best.x0 = Math.min(best.x0, cell.x0);
        best.x1 = Math.max(best.x1, cell.x1);
      } else cols.push({ x0: cell.x0, x1: cell.x1 });
    }
  }
  cols.sort((a, b) => a.x0 - b.x0);
  const merged: Span[] = [];
  for (const c of cols) {
    const last = merged[merged.length - 1];
    if (last && overlap(last, c) > 0) last.x1 = Math.max(last.x1, c.x1);
    else merged.push({ ...c });
  }
  return merged;
}

function columnIndex(cols: Span[], cell: Cell): number {
  let best = -1;
  let bestOverlap = -0.5;
  cols.forEach((c, i) => {
    const o = overlap(c, cell);
    if (o > bestOverlap) {
      best = i;
      bestOverlap = o;
    }
  });
  return best;
}

function pitchOf(cols: Span[], i: number): number {
  const d: number[] = [];
  if (i > 0) d.push(centre(cols[i]) - centre(cols[i - 1]));
  if (i < cols.length - 1) d.push(centre(cols[i + 1]) - centre(cols[i]));
  return d.length ? Math.min(...d) : 40;
}

/** Lines directly above the first row that belong to its header (top line first). */
function headerLines(lines: Line[], rows: Line[], cols: Span[]): Line[] {
  const first = rows[0];
  const rowSize = first.size;
  const pitch = rows.length > 1 ? Math.abs(rows[0].y - rows[1].y) : 1.5 * rowSize;
  const out: Line[] = [];
  let prevY = first.y;
  for (let k = first.index - 1; k >= 0 && out.length < 6; k--) {
    const line = lines[k];
    if (line.y - prevY > 2.2 * pitch + 2) break;
    // A row of the table itself (or one it could not read) is never header.
    if (isDataRow(line) || isPartNumber(line.cells[0]?.text ?? '')) break;
    // Nor is a row whose part number a scan lost ("8.0V | 8.20 V | 150 Ω | … | 41 mA"): its units
    // would stand as the columns' own. The header lies above it.
    const figures = line.cells.filter((c) => isNumericCell(c.text)).length;
    if (figures >= 3 && 2 * figures >= line.cells.length) {
      prevY = line.y;
      continue;
    }
    if (line.size > 1.3 * rowSize) break;
    if (line.cells.some((c) => c.text.length > 48)) break;
    // A caption starts in the part-number column and runs on over the next columns.
    if (cols.length > 2 && line.cells.some((c) => c.x0 <= cols[0].x1 && c.x1 > centre(cols[2]))) break;
    out.unshift(line);
    prevY = line.y;
  }
  return out;
}

/** Header text per column: each header cell goes to the columns it is centred over or next to. */
function headerTexts(header: Line[], cols: Span[]): { texts: string[]; owners: Cell[][] } {
  const texts = cols.map(() => [] as string[]);
  const owners = cols.map(() => [] as Cell[]);
  for (const line of header) {
    cols.forEach((col, i) => {
      const c = centre(col);
      let best: Cell | undefined;
      let bestDistance = Infinity;
      for (const cell of line.cells) {
        const d = c < cell.x0 ? cell.x0 - c : c > cell.x1 ? c - cell.x1 : 0;
        if (d < bestDistance) {
          best = cell;
          bestDistance = d;
        }
      }
      // A heading over another column's centre is that column's, not a neighbour's it merely comes near
      // ("IR at VR" printed over both of its columns still reaches the second).
      const elsewhere = best && bestDistance > 0.25 * pitchOf(cols, i) && cols.some((o, k) => k !== i && centre(o) >= best!.x0 && centre(o) <= best!.x1);
      if (best && !elsewhere && bestDistance <= 0.6 * pitchOf(cols, i)) {
        texts[i].push(best.text);
        owners[i].push(best);
      }
    });
  }
  return { texts: texts.map((t) => t.join(' ')), owners };
}

function planColumns(header: Line[], rows: Line[], cols: Span[]): TablePlan {
  const { texts, owners } = headerTexts(header, cols);
  // Footnote markers in a header ("IZ (Note 3)") are no part of its words or unit.
  const rests = texts.map((text) => blankFootnotes(findConditions(text).rest));
  const units = rests.map((rest) => headerUnit(rest));
  const kinds = units.map((unit, i) => (unit ? unitKind(unit) : undefined) ?? cellKind(rows, cols, i));
  sharedGroupUnits(rests, units, kinds);
  const columns: ColumnPlan[] = cols.map((span, i) => {
    const text = texts[i];
    const match = i === 0 ? undefined : fieldFor(rests[i], kinds[i]);
    return { span, header: text, unit: units[i], match, isPackage: i > 0 && !match && isPackageHeader(text) };
  });
  borrowGroupHeadings(columns, rows, cols);
  // Several columns may name one field (min/typ/max of tc): keep the best ranked, first on ties.
  const best = new Map<ExtractionField, number>();
  columns.forEach((c, i) => {
    if (!c.match) return;
    const j = best.get(c.match.field);
    if (j === undefined || c.match.rank > columns[j].match!.rank) best.set(c.match.field, i);
  });
  columns.forEach((c, i) => {
    if (c.match && best.get(c.match.field) !== i) c.match = undefined;
  });
  const conditions: HeaderCondition[] = [];
  const seen = new Set<Cell>();
  columns.forEach((c, i) => {
    for (const cell of owners[i]) {
      if (seen.has(cell)) continue;
      seen.add(cell);
      for (const cond of findConditions(cell.text, c.match?.field).conditions) {
        conditions.push({ ...cond, page: header[0].page, text: cell.printed, cell });
      }
    }
  });
  return { columns, conditions };
}

/**
 * The min / nom / max columns of one parameter share its unit (common practice for datasheet
 * tables, no source). A column between two such siblings whose unit cannot be read (a scan's
 * "(VM" for "(V)") takes theirs when both print the same unit and the three qualifiers differ.
 */
function sharedGroupUnits(rests: string[], units: (string | undefined)[], kinds: (QuantityKind | undefined)[]): void {
  for (let i = 2; i < rests.length - 1; i++) {
    if (kinds[i] || !units[i - 1] || units[i - 1] !== units[i + 1]) continue;
    const qualifiers = [i - 1, i, i + 1].map((k) => qualifierOf(rests[k]));
    if (qualifiers.some((q) => !q) || new Set(qualifiers).size !== 3) continue;
    units[i] = units[i - 1];
    kinds[i] = kinds[i - 1];
  }
  // A Zener or reverse voltage is printed in volts (common practice for regulator-diode tables,
  // no source); a scan loses the lone "V" of a units row more often than any other unit. Where
  // the table states units for at least two other columns, a column labelled only as such a
  // voltage, with no unit of its own, is read in volts. A label that could also name another
  // quantity ("Leakage current at VR", "Temperature coefficient of VZ") or a change or share of
  // it ("ΔVZ", "VZ tolerance %") is not.
  const stated = units.filter((u, k) => u && kinds[k]).length;
  rests.forEach((rest, i) => {
    if (i === 0 || kinds[i] || stated < 2 || /%|Δ|\bdelta\b|\btol|\bchange|\bdrift/i.test(rest)) return;
    const field = fieldFor(rest, 'voltage')?.field;
    if (!field || !['vzMin', 'vzNom', 'vzMax', 'vr'].includes(field)) return;
    // (A coefficient column is matched by its own words here: any VZ label would match it.)
    if (OTHER_KINDS.some((k) => fieldFor(rest, k)) || LABELS.tc.test(rest)) return;
    units[i] = 'V';
    kinds[i] = 'voltage';
  });
}

const OTHER_KINDS: QuantityKind[] = ['current', 'resistance', 'power', 'temperature', 'thermalResistance'];

const QUALIFIER_WORD = /\b(?:min|nom|typ|max)(?:imum|inal|ical)?\.?(?![a-z])/gi;

/**
 * A group heading centred over its min / nom / max columns ("VBR" over "minimum [V]",
 * "nominal [V]", "maximum [V]") reaches only the middle one by position. A column whose header
 * is a qualifier alone takes the heading of a neighbour that names a field with a qualifier of
 * its own and has the same unit kind: the qualifiers then tell the three apart.
 */
function borrowGroupHeadings(columns: ColumnPlan[], rows: Line[], cols: Span[]): void {
  columns.forEach((c, i) => {
    if (i === 0 || c.match || c.isPackage) return;
    const own = findConditions(c.header).rest;
    const qualifier = qualifierOf(own);
    const residue = own
      .replace(QUALIFIER_WORD, '')
      .replace(/[([][^()[\]]*[)\]]/g, '')
      .trim();
    // Nothing but the qualifier and a unit ("minimum [V]", or "minimum" over a units row's "V").
    if (!qualifier || (residue !== '' && !isUnitOnly(residue))) return;
    const kind = (c.unit ? unitKind(c.unit) : undefined) ?? cellKind(rows, cols, i);
    for (const j of [i - 1, i + 1, i - 2, i + 2]) {
      const n = columns[j];
      if (!n?.match?.qualifier || j === 0) continue;
      const nKind = (n.unit ? unitKind(n.unit) : undefined) ?? cellKind(rows, cols, j);
      if (nKind !== kind) continue;
      const heading = findConditions(n.header).rest.replace(QUALIFIER_WORD, ' ');
      const match = fieldFor(`${heading} ${own}`, kind);
      if (match && match.qualifier === qualifier && sameFamily(match.field, n.match.field) && match.field !== n.match.field) {
        c.match = match;
        c.header = `${heading.replace(/\s+/g, ' ').trim()} ${c.header}`;
      }
      return;
    }
  });
}

const FAMILIES: ExtractionField[][] = [['vzMin', 'vzNom', 'vzMax']];
const sameFamily = (a: ExtractionField, b: ExtractionField) => a === b || FAMILIES.some((f) => f.includes(a) && f.includes(b));

/** The most common unit kind in a column's cells (units printed in the cells). */
function cellKind(rows: Line[], cols: Span[], i: number): QuantityKind | undefined {
  const counts = new Map<QuantityKind, number>();
  for (const row of rows) {
    for (const cell of row.cells) {
      if (columnIndex(cols, cell) !== i) continue;
      const k = findQuantities(cell.text)[0]?.kind;
      if (k) counts.set(k, (counts.get(k) ?? 0) + 1);
    }
  }
  let best: QuantityKind | undefined;
  for (const [k, n] of counts) if (!best || n > counts.get(best)!) best = k;
  return best;
}

const mappedCount = (p: TablePlan) => p.columns.filter((c) => c.match).length;

function sameColumns(a: Span[], b: ColumnPlan[]): boolean {
  return a.length === b.length && a.every((s, i) => overlap(s, b[i].span) > 0);
}

/**
 * Reads every series table. Returns the lines it used as table rows, so the other readers
 * leave them alone.
 */
export function readTables(pages: Line[][], drafts: VariantDrafts, warnings: string[]): Set<Line> {
  const used = new Set<Line>();
  let previous: TablePlan | undefined;
  /** The series letters of the rows read under `previous` (a continuation carries on the same series). */
  let previousSeries = new Set<string>();
  for (const lines of pages) {
    let i = 0;
    while (i < lines.length) {
      if (!isDataRow(lines[i])) {
        i++;
        continue;
      }
      let j = i;
      while (j < lines.length && isDataRow(lines[j])) j++;
      const rows = lines.slice(i, j);
      i = j;
      const cols = columnsOf(rows);
      const header = headerLines(lines, rows, cols);
      let plan: TablePlan | undefined = header.length ? planColumns(header, rows, cols) : undefined;
      if (!plan || mappedCount(plan) < 2) {
        const ownHeader = header.some((l) => /^(type|part|device|order)/i.test(l.cells[0]?.text ?? ''));
        if (ownHeader) continue; // a table of its own that holds no ratings (ordering data and the like)
        // Rows without a header of their own continue the table above only with its series: rows of
        // another series are another table whose header was not read (a scan), and the conditions
        // of the first (IZT = 2 mA) would be given to the second's parts (tested at 2.5 mA).
        const series = rows.map((r) => seriesLetters(r.cells[0].text));
        if (previous && sameColumns(cols, previous.columns) && series.every((l) => previousSeries.has(l))) {
          plan = { columns: previous.columns.map((c, k) => ({ ...c, span: cols[k] })), conditions: previous.conditions };
        } else continue;
      } else previousSeries = new Set();
      for (const r of rows) previousSeries.add(seriesLetters(r.cells[0].text));
      const title = titleConditions(lines, header.length ? header[0].index : rows[0].index);
      if (title.length) {
        const fromTitle = title.map((c) => ({ ...c, page: c.line.page, text: c.line.printed, cell: c.line.cells[0] }));
        plan = { ...plan, conditions: [...plan.conditions, ...fromTitle] };
      }
      previous = plan;
      // The units the column's cells print themselves, and how many print one (see ohmReadAsDigit).
      const printedUnits = cols.map((_, k) => {
        const units = rows.flatMap((r) =>
          r.cells.filter((c) => columnIndex(cols, c) === k).map((c) => findQuantities(findConditions(c.text).rest)[0]?.unit ?? ''),
        );
        return { count: units.filter(Boolean).length, unit: units.find(Boolean) };
      });
      for (const row of rows) {
        used.add(row);
        readRow(row, cols, plan, printedUnits, drafts, warnings);
      }
    }
  }
  return used;
}

function readRow(row: Line, cols: Span[], plan: TablePlan, printedUnits: { count: number; unit?: string }[], drafts: VariantDrafts, warnings: string[]): void {
  const mpn = row.cells[0].text;
  const draft = drafts.get(mpn, orderOf(row.page, row.index));
  const byColumn = new Map<number, Cell>();
  // Two figures of one row under one column (columns a wide cell merged, "25.7 V | 27.00 V"
  // under "VZ min VZ nom VZ max"): which is the column's is not known.
  const crowded = new Set<number>();
  for (const cell of row.cells.slice(1)) {
    const k = columnIndex(cols, cell);
    if (k <= 0) continue;
    if (!byColumn.has(k)) byColumn.set(k, cell);
    else if (/\d/.test(cell.text) && /\d/.test(byColumn.get(k)!.text)) crowded.add(k);
  }
  plan.columns.forEach((col, k) => {
    const cell = byColumn.get(k);
    if (!cell || isEmptyCell(cell.text)) return;
    if (crowded.has(k) && col.match) {
      warnings.push(`${mpn}: several figures stand under "${col.header}" on page ${row.page}; ${col.match.field} left empty.`);
      return;
    }
    if (col.isPackage) {
      const found = findPackage(cell.text);
      draft.offerPackage({ value: found?.value ?? cell.text, page: row.page, text: row.printed, box: cellBox(cell), rank: 3 });
      return;
    }
    if (!col.match) return;
    const field = col.match.field;
    const { conditions, rest } = findConditions(cell.text, field);
    const found = findQuantities(rest);
    const q = found[0];
    if (!q) {
      warnings.push(`${mpn}: "${cell.text}" under "${col.header}" on page ${row.page} is not a number; ${field} left empty.`);
      return;
    }
    // Several figures with a unit of one kind in one cell ("22.8V 24.00 V 25.2V", a scan that ran
    // the min, nom and max cells together): which is this column's is not known.
    const sameKind = found.filter((t) => t.unit && q.unit && unitKind(t.unit) === unitKind(q.unit));
    if (sameKind.length > 1) {
      warnings.push(`${mpn}: "${cell.text}" under "${col.header}" on page ${row.page} holds several figures; ${field} left empty.`);
      return;
    }
    if (ohmReadAsDigit(q, printedUnits[k].count, col.unit ?? printedUnits[k].unit)) {
      warnings.push(
        `${mpn}: "${cell.text}" under "${col.header}" on page ${row.page} lacks the Ω its column's other figures print (a unit read as a digit?); left empty.`,
      );
      return;
    }
    const unit = q.unit || col.unit || '';
    const kind = unit ? unitKind(unit) : undefined;
    if (!kind || !FIELD_KINDS[field].includes(kind)) {
      warnings.push(`${mpn}: "${cell.text}" under "${col.header}" on page ${row.page} has no usable unit for ${field}; left empty.`);
      return;
    }
    const si = toSi(q.value, unit, kind);
    if (si === undefined) return;
    draft.offer(field, { value: q.value, unit, kind, si, page: row.page, text: row.printed, box: cellBox(cell), rank: 3, method: 'table' });
    // "144 Ω @ 0.25 mA": the condition printed beside the value beats the one in the header.
    for (const cond of conditions) {
      const cs = toSi(cond.value, cond.unit, cond.kind);
      if (cs !== undefined) draft.offer(cond.field, { ...cond, si: cs, page: row.page, text: row.printed, box: cellBox(cell), rank: 2, method: 'table' });
    }
  });
  for (const cond of plan.conditions) {
    const si = toSi(cond.value, cond.unit, cond.kind);
    if (si === undefined) continue;
    draft.offer(cond.field, {
      value: cond.value,
      unit: cond.unit,
      kind: cond.kind,
      si,
      page: cond.page,
      text: cond.text,
      box: cellBox(cond.cell),
      rank: 1,
      method: 'table',
    });
  }
}
