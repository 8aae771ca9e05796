import type { ExtractionField } from '@shuntwise/contracts';
import { fieldFor, findConditions, isPackageHeader, TitleCondition, titleConditions } from './field-patterns';
import { findPackage, isPartNumber, seriesLetters } from './part-numbers';
import { findQuantities, headerUnit, isEmptyCell, isNumericCell, isUnitOnly, ohmReadAsDigit, toSi, unitKind } from './quantity-text';
import { Cell, cellBox, Line } from './text-layout';
import { FIELD_KINDS, orderOf, VariantDrafts } from './variant-drafts';

/**
 * Transposed series tables: part numbers across the top as columns, one characteristic per
 * row ("Zener voltage, nom at IZT = 5 mA (V) | VZ | 4.7 | 5.1 | 5.6"). Each row is recognised
 * like a column header of an ordinary table, by its words and the dimension of its unit; a
 * condition in the row label ("at IZT = 5 mA") belongs to every part of the row.
 */

interface PartColumn {
  mpn: string;
  x0: number;
  x1: number;
  order: number;
  /** Test currents the table's title sets for every part ("… (IZT = 5 mA, IZK = 0.5 mA)"). */
  title: TitleCondition[];
}

const centre = (c: { x0: number; x1: number }) => (c.x0 + c.x1) / 2;

/** A line that names two or more parts side by side, after a label column: the top of a transposed table. */
export function partColumns(line: Line): PartColumn[] | undefined {
  const parts = line.cells.flatMap(splitPartNumbers).filter((c) => isPartNumber(c.text));
  if (parts.length < 2) return undefined;
  // Part numbers after at most a few column titles (Parameter, Symbol, Conditions, Unit): a sentence naming two parts is no table header.
  const others = line.cells.filter((c) => !isPartNumber(c.text));
  if (others.length > 5 || others.some((c) => c.x0 > parts[0].x0)) return undefined;
  return parts.map((c, i) => ({ mpn: c.text, x0: c.x0, x1: c.x1, order: orderOf(line.page, line.index) + i / 100, title: [] }));
}

/** Whether a table title ("Electrical characteristics, …") stands in the few lines above a table's top. */
function hasTitle(lines: Line[], top: number): boolean {
  for (let k = top - 1; k >= Math.max(0, top - 3); k--) if (/characteristics|ratings|parameters|data\b/i.test(lines[k].text)) return true;
  return false;
}

/**
 * Part numbers set close together run into one cell ("XA4V7 XA5V1 XA5V6"): each gets its share
 * of the cell's width by its length, enough to find the column beneath it.
 */
function splitPartNumbers(cell: Cell): Cell[] {
  const words = cell.text.split(' ');
  if (words.length < 2 || !words.every(isPartNumber)) return [cell];
  const total = words.reduce((n, w) => n + w.length, 0) + words.length - 1;
  const perChar = (cell.x1 - cell.x0) / total;
  let x = cell.x0;
  return words.map((w) => {
    const c = { ...cell, text: w, printed: w, x0: x, x1: x + w.length * perChar };
    x = c.x1 + perChar;
    return c;
  });
}

function columnOf(cols: PartColumn[], cell: Cell): PartColumn | undefined {
  const pitch = cols.length > 1 ? (centre(cols[cols.length - 1]) - centre(cols[0])) / (cols.length - 1) : 40;
  let best: PartColumn | undefined;
  let distance = Infinity;
  for (const c of cols) {
    const d = Math.abs(centre(c) - centre(cell));
    if (d < distance) {
      best = c;
      distance = d;
    }
  }
  return distance < 0.45 * pitch ? best : undefined;
}

export function readTransposedTables(pages: Line[][], drafts: VariantDrafts, used: Set<Line>, warnings: string[]): void {
  // The last table's title conditions: a block of the same series on the next page, under no
  // title of its own, continues that table.
  let last: { page: number; series: string; title: TitleCondition[] } | undefined;
  for (const lines of pages) {
    let cols: PartColumn[] | undefined;
    let misses = 0;
    for (const line of lines) {
      if (used.has(line)) continue;
      const top = partColumns(line);
      if (top) {
        let title = titleConditions(lines, line.index);
        const series = seriesLetters(top[0].mpn);
        const continues = last && last.series === series && line.page - last.page <= 1 && !hasTitle(lines, line.index);
        if (!title.length && continues) title = last!.title;
        if (title.length || !continues) last = { page: line.page, series, title };
        for (const col of top) col.title = title;
        cols = top;
        misses = 0;
        used.add(line);
        continue;
      }
      if (!cols) continue;
      if (!readRow(line, cols, drafts, warnings)) {
        // A table ends after two lines that are not rows of it.
        if (++misses >= 2) cols = undefined;
        continue;
      }
      misses = 0;
      used.add(line);
    }
  }
}

function readRow(line: Line, cols: PartColumn[], drafts: VariantDrafts, warnings: string[]): boolean {
  const first = cols[0].x0 - 0.3 * (cols[1].x0 - cols[0].x0);
  const label = line.cells.filter((c) => c.x1 <= first + 2);
  const values = new Map<PartColumn, Cell>();
  let unitCell: string | undefined;
  for (const c of line.cells) {
    if (label.includes(c)) continue;
    if (isUnitOnly(c.text) && centre(c) > centre(cols[cols.length - 1])) {
      unitCell = c.text.trim();
      continue;
    }
    const col = columnOf(cols, c);
    if (col && !values.has(col)) values.set(col, c);
  }
  const numeric = [...values.values()].filter((c) => isNumericCell(c.text.replace(/\s*\[\d+\]\s*$/, ''))).length;
  const packages = [...values.values()].filter((c) => findPackage(c.text)).length;
  if (label.length === 0 || (numeric < Math.min(2, cols.length) && packages < Math.min(2, cols.length))) return false;
  const labelText = label.map((c) => c.text).join(' ');
  if (isPackageHeader(labelText) && label.length <= 2) {
    for (const col of cols) {
      const cell = values.get(col);
      const found = cell ? findPackage(cell.text) : undefined;
      if (cell && found) drafts.get(col.mpn, col.order).offerPackage({ value: found.value, page: line.page, text: line.printed, box: cellBox(cell), rank: 3 });
    }
    return true;
  }
  const { rest } = findConditions(labelText);
  // The unit of the first value that prints one (a cell whose figure OCR lost can hold the unit alone).
  const unit = unitCell ?? headerUnit(rest) ?? [...values.values()].map((c) => findQuantities(c.text).find((q) => q.unit)?.unit).find((u) => u !== undefined);
  const kind = unit ? unitKind(unit) : undefined;
  const match = fieldFor(rest, kind);
  if (!match || (match.field === 'tc' && match.rank === 0) || (match.qualifier === 'typ' && match.field !== 'tc' && match.field !== 'vzNom')) return true;
  const field: ExtractionField = match.field;
  const conditions = findConditions(labelText, field).conditions;
  for (const col of cols) {
    for (const cond of col.title) {
      const si = toSi(cond.value, cond.unit, cond.kind);
      if (si === undefined) continue;
      drafts
        .get(col.mpn, col.order)
        .offer(cond.field, { ...cond, si, page: cond.line.page, text: cond.line.printed, box: cellBox(cond.line.cells[0]), rank: 1, method: 'table' });
    }
  }
  // How many of the row's figures print their own unit (see ohmReadAsDigit).
  const printedUnits = [...values.values()].filter((c) => findQuantities(findConditions(c.text, field).rest)[0]?.unit).length;
  for (const col of cols) {
    const cell = values.get(col);
    if (!cell || isEmptyCell(cell.text)) continue;
    const own = findConditions(cell.text, field);
    const q = findQuantities(own.rest)[0];
    if (!q) continue;
    if (ohmReadAsDigit(q, printedUnits, unit)) {
      warnings.push(
        `${col.mpn}: "${cell.text}" in the row "${labelText}" on page ${line.page} lacks the Ω the row's other figures print (a unit read as a digit?); left empty.`,
      );
      continue;
    }
    const u = q.unit || unit || '';
    const k = u ? unitKind(u) : undefined;
    if (!k || !FIELD_KINDS[field].includes(k)) {
      warnings.push(`${col.mpn}: "${cell.text}" in the row "${labelText}" on page ${line.page} has no usable unit for ${field}; left empty.`);
      continue;
    }
    const si = toSi(q.value, u, k);
    if (si === undefined) continue;
    const draft = drafts.get(col.mpn, col.order);
    draft.offer(field, { value: q.value, unit: u, kind: k, si, page: line.page, text: line.printed, box: cellBox(cell), rank: 3, method: 'table' });
    // "34 ohm @ 3.1 mA": the condition printed beside the value beats the one in the row's label.
    for (const cond of own.conditions) {
      const cs = toSi(cond.value, cond.unit, cond.kind);
      if (cs !== undefined) draft.offer(cond.field, { ...cond, si: cs, page: line.page, text: line.printed, box: cellBox(cell), rank: 2, method: 'table' });
    }
    for (const cond of conditions) {
      const cs = toSi(cond.value, cond.unit, cond.kind);
      if (cs !== undefined) {
        draft.offer(cond.field, {
          value: cond.value,
          unit: cond.unit,
          kind: cond.kind,
          si: cs,
          page: line.page,
          text: line.printed,
          box: cellBox(label[0]),
          rank: 1,
          method: 'table',
        });
      }
    }
  }
  return true;
}
