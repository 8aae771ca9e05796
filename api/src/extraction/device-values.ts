import type { ExtractionBox } from '@shuntwise/contracts';
import { findConditions, qualifierOf } from './field-patterns';
import { findPackage } from './part-numbers';
import { findQuantities, isNumericCell, isUnitOnly, QuantityToken, toSi, unitKind } from './quantity-text';
import { Cell, cellBox, Line, lineBox, wordSpaced } from './text-layout';
import { Candidate, PackageCandidate } from './variant-drafts';
import { DEVICE_RULES, DeviceRule } from './vocabulary';

/**
 * Values printed once for the whole series, or once per series or package: power rating,
 * junction temperature, thermal resistance to ambient, package. Found by label or symbol
 * ("Ptot", "Tj", "RthJA", "Case:"); a line with the symbol (a ratings table) beats prose that
 * merely mentions the words. Each value keeps the scope it was printed for: a series named on
 * its line or in the heading above it, or a package named over its column. Test conditions
 * ("at TA = 25 °C") are cut before reading, so their numbers are never taken for a rating.
 */

export type DeviceField = 'pdMax' | 'tjMax' | 'rthJA';

/** What a device-wide value applies to: a series (part-number prefix), a package, or (neither) every part. */
export interface Scope {
  series?: string;
  package?: string;
}

export interface DeviceCandidate {
  field: DeviceField;
  candidate: Candidate;
  score: number;
  scope: Scope;
}

export interface DevicePackage {
  candidate: PackageCandidate;
  score: number;
  scope: Scope;
}

export interface DeviceValues {
  values: DeviceCandidate[];
  packages: DevicePackage[];
}

/** Key for comparing part numbers and series names: case and separators do not count. */
export const flat = (s: string) => s.toUpperCase().replace(/[\s\-_/.]/g, '');

/**
 * A word that names a series of the document: a prefix of some of its part numbers
 * ("NMZ-05 series", "ABC12xx", "XY5…"), or a part number itself.
 */
export function seriesIn(text: string, mpns: readonly string[]): string | undefined {
  return seriesNamed(text, mpns)[0];
}

/** Every series a text names, in order ("XA and XB series" names two). */
export function seriesNamed(text: string, mpns: readonly string[]): string[] {
  const keys = mpns.map(flat);
  const found: string[] = [];
  for (const word of text.split(/[\s,;:()[\]]+/)) {
    // "ABC12xx", "XY5…" stand for a series; "DTX" is a name ending in X, tried as printed first.
    const stripped = word.replace(/(?:x+|\*+|…|\.\.\.)$/i, '');
    for (const printed of stripped === word ? [word] : [word, stripped]) {
      const w = flat(printed);
      // Two capitals ("WE series") name a series only when printed in capitals.
      if (w.length < 2 || (w.length === 2 && !/^[A-Z]{2}$/.test(word) && printed === word) || !/[A-Z]/.test(w)) continue;
      const n = keys.filter((k) => k.startsWith(w)).length;
      if (n > 0 && n < keys.length) {
        if (!found.includes(w)) found.push(w);
        break;
      }
    }
  }
  return found;
}

/**
 * The part an ordering code starts with ("KB-068-T7" → KB068): the longest part number the
 * code begins with as printed, followed by a separator. An ordering row names its part's
 * package; the part-number column of the table may have been lost or never printed.
 */
function orderedPart(code: string, mpns: readonly string[]): string | undefined {
  const base = mpns.filter((m) => code.length > m.length + 1 && code.startsWith(m) && /[-_/.\s]/.test(code[m.length])).sort((a, b) => b.length - a.length)[0];
  return base ? flat(base) : undefined;
}

interface ReadContext {
  mpns: readonly string[];
  lines: Line[];
  warnings: string[];
}

/** The scope a heading above a line gives it: the nearest short line on the page that names a series or package. */
function headingScope(ctx: ReadContext, line: Line): Scope {
  for (let k = line.index - 1; k >= 0; k--) {
    const l = ctx.lines[k];
    // A table row is no heading; a heading a scan cut into words is ("Maximum | ratings, | SH |
    // series | (SOT-23)": its cells sit a word space apart, never a column's gutter).
    if ((l.cells.length > 2 && !wordSpaced(l)) || l.text.length > 80) continue;
    if (findQuantities(l.text).some((t) => t.unit)) continue;
    // A features bullet is no heading.
    if (/^[•·]/.test(l.text)) continue;
    const named = seriesNamed(l.text, ctx.mpns);
    // A heading over several series ("XA and XB series", the document's title) scopes to none of them alone.
    if (named.length > 1) return {};
    const series = named[0];
    const pkgFound = findPackage(l.text);
    const pkg = pkgFound && !/^\s*(?:\/|,|\band\b|\bor\b)/.test(l.text.slice(pkgFound.index + pkgFound.value.length)) ? pkgFound.value : undefined;
    if (series || pkg) return { ...(series ? { series } : {}), ...(pkg ? { package: pkg } : {}) };
  }
  return {};
}

/** A header line above a multi-value row: cells that name packages, series or min/typ/max, by position. */
interface ColumnHead {
  cell: Cell;
  scope: Scope;
  qualifier?: string;
}

function columnHeads(ctx: ReadContext, line: Line): ColumnHead[] | undefined {
  for (let k = line.index - 1; k >= Math.max(0, line.index - 12); k--) {
    const l = ctx.lines[k];
    const heads = l.cells.flatMap((cell): ColumnHead[] => {
      const pkg = findPackage(cell.text);
      if (pkg && pkg.value.length >= cell.text.replace(/\s/g, '').length - 2) return [{ cell, scope: { package: pkg.value } }];
      const series = seriesIn(cell.text, ctx.mpns);
      if (series && cell.text.split(/\s+/).length <= 2) return [{ cell, scope: { series } }];
      const q = /^(min|typ|nom|max)(?:imum|ical|inal)?\.?$/i.test(cell.text.trim()) ? qualifierOf(cell.text) : undefined;
      return q ? [{ cell, scope: {}, qualifier: q }] : [];
    });
    if (heads.length >= 2) return heads;
  }
  return undefined;
}

const centre = (c: { x0: number; x1: number }) => (c.x0 + c.x1) / 2;

/** Conditions cut out; for the junction temperature a "Tj = 150 °C" stays, unless it is the 25 °C of a test. */
function readable(text: string, rule: DeviceRule): string {
  let rest = text;
  if (rule.kind === 'temperature') {
    rest = rest.replace(/\(\s*T\s?[jJ]\s*=[^)]*\)|T\s?[jJ]\s*=\s*\+?25\s?°C/g, (m) => ' '.repeat(m.length));
    // "may operate up to 150 °C" states the rating; "up to" qualifies other temperatures only.
    rest = rest.replace(/\bup\s+to\b/gi, (m) => ' '.repeat(m.length));
    // Hide "Tj =" from the condition reader so that "Tj = 150 °C" is kept as the rating.
    const hidden = rest.replace(/(T\s?[jJ](?:\s?max)?)(\s*)=/g, (_m, s: string, sp: string) => s + sp + ' ');
    const cut = findConditions(hidden).rest;
    return cut;
  }
  return findConditions(rest).rest;
}

interface Value {
  token: QuantityToken;
  unit: string;
  cell: Cell;
}

/** One rating on a line (or a line joined with its continuation). */
function readRule(ctx: ReadContext, line: Line, field: DeviceField, rule: DeviceRule): DeviceCandidate[] {
  const text = line.text;
  const symbol = rule.symbol.exec(text);
  const words = rule.words.exec(text);
  if (!symbol && !words) return [];
  const start = Math.min(symbol?.index ?? Infinity, words?.index ?? Infinity);
  const rest = readable(text, rule);
  // Offsets of the cells in the line's text (cells joined by one space).
  const offsets: number[] = [];
  let at = 0;
  for (const c of line.cells) {
    offsets.push(at);
    at += c.text.length + 1;
  }
  const cellAt = (i: number) => {
    let k = 0;
    while (k + 1 < offsets.length && offsets[k + 1] <= i) k++;
    return line.cells[k];
  };
  const unitCell = line.cells.find((c) => isUnitOnly(c.text) && unitKind(c.text.trim()) === rule.kind);
  const headerUnit = /[([]\s*([^()[\]]+?)\s*[)\]]/.exec(text.slice(start));
  const labelUnit = headerUnit && unitKind(headerUnit[1]) === rule.kind ? headerUnit[1] : undefined;
  // A unit cell is the unit of the figures before it ("200 | mW"); figures after it stand in
  // another column or table beside this one (a package outline's "A 0.95 1.35" on a
  // two-column page) and take no unit from it.
  const lineUnit = (cell: Cell) => (unitCell ? (cell.x0 < unitCell.x0 ? unitCell.text.trim() : undefined) : labelUnit);
  const tokens = findQuantities(rest).filter((t) => t.index > start);
  let values: Value[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    const cell = cellAt(t.index);
    // A bare number takes the line's unit only from a cell of its own ("1.3" beside "W"), never from a label ("lead length 10 mm", "note 1)").
    const unit = t.unit || (isNumericCell(cell.text) ? lineUnit(cell) : undefined) || '';
    if (!unit || unitKind(unit) !== rule.kind) continue;
    values.push({ token: t, unit, cell });
  }
  if (values.length === 0) return [];
  // What excludes a rating ("peak", "derating", "storage", "to lead") is looked for in its own
  // statement up to its value: "Pd is 300 mW at 25 °C and is derated by 2.4 mW/K above 25 °C"
  // states the rating before it speaks of derating.
  const from = Math.max(0, ...[...text.slice(0, start).matchAll(/[.;](?=\s)/g)].map((m) => m.index + 1));
  if (rule.exclude.test(text.slice(from, values[0].token.index))) return [];
  // A sentence goes on to other things after its clause: "Tj = 150 °C maximum; storage −55 °C to +150 °C".
  const clauseEnd = /;|\.\s|\.$/.exec(rest.slice(values[0].token.end));
  if (clauseEnd) {
    const limit = values[0].token.end + clauseEnd.index;
    values = values.filter((v) => v.token.index < limit);
  }
  if (rule.upperOfRange) {
    values = joinRanges(rest, collapseRanges(rest, tokens, values));
    // "… between −65 °C (and)" at the end of the text: the range goes on past it, its upper end unseen.
    values = values.filter(
      (v) => !(/\b(?:between|from)\s*$/i.test(rest.slice(0, v.token.index)) && /^\s*(?:and|to|…|–|-)?\s*$/i.test(rest.slice(v.token.end))),
    );
    if (values.length === 0) return [];
  }
  const method: Candidate['method'] = line.cells.some((c) => c.text.length > 50) ? 'sentence' : line.cells.length >= 3 ? 'table' : 'list';
  const score = (symbol ? 2 : 0) + (words ? 1 : 0);
  const make = (v: Value, scope: Scope): DeviceCandidate | undefined => {
    const si = toSi(v.token.value, v.unit, rule.kind);
    if (si === undefined) return undefined;
    const box: ExtractionBox = method === 'sentence' ? lineBox(line) : cellBox(v.cell);
    return {
      field,
      score,
      scope,
      candidate: { value: v.token.value, unit: v.unit, kind: rule.kind, si, page: line.page, text: line.printed, box, rank: 0, method },
    };
  };
  const scope = lineScope(ctx, line, text.slice(0, start) + ' ' + text.slice(start, values[0].token.index));
  if (values.length === 1) {
    const c = make(values[0], scope);
    return c ? [c] : [];
  }
  // Several values on one line: one per package, series or min/typ/max column.
  const heads = columnHeads(ctx, line);
  if (heads) {
    const out: DeviceCandidate[] = [];
    for (const v of values) {
      let best: (typeof heads)[number] | undefined;
      let distance = Infinity;
      for (const h of heads) {
        const d = Math.abs(centre(h.cell) - centre(v.cell));
        if (d < distance) {
          best = h;
          distance = d;
        }
      }
      if (!best || distance > 30) continue;
      if (best.qualifier && best.qualifier !== 'max') continue;
      const c = make(v, best.qualifier ? scope : { ...scope, ...best.scope });
      if (c) out.push(c);
    }
    if (out.length) return out;
  }
  const first = make(values[0], scope);
  if (first && values.every((v) => toSi(v.token.value, v.unit, rule.kind) === first.candidate.si)) return [first];
  ctx.warnings.push(`Page ${line.page}: "${line.printed}" gives several values for ${field} and no package or series heading tells them apart; left empty.`);
  return [];
}

/** The scope a line names itself (a series or package in its label), else the heading above it. */
function lineScope(ctx: ReadContext, line: Line, label: string): Scope {
  const series = seriesIn(label, ctx.mpns);
  const pkg = findPackage(label)?.value;
  if (series || pkg) return { ...(series ? { series } : {}), ...(pkg ? { package: pkg } : {}) };
  return headingScope(ctx, line);
}

/** "between −55 °C and +150 °C", "−55 °C to +150 °C": both ends carry the unit; keep the upper one. */
function joinRanges(text: string, values: Value[]): Value[] {
  const out: Value[] = [];
  for (const v of values) {
    const prev = out[out.length - 1];
    if (prev && /^\s*(?:°C|℃)?\s*(?:to|and|…|\.\.\.|–|-)\s*$/.test(text.slice(prev.token.end, v.token.index))) {
      if (Number(v.token.value.replace('−', '-')) > Number(prev.token.value.replace('−', '-'))) out[out.length - 1] = v;
      continue;
    }
    out.push(v);
  }
  return out;
}

/** "−55 to +150 °C": the unitless numbers just before the unit belong to the range; keep its upper end. */
function collapseRanges(text: string, tokens: QuantityToken[], values: Value[]): Value[] {
  return values.map((v) => {
    let k = tokens.indexOf(v.token) - 1;
    let best = v;
    while (k >= 0 && !tokens[k].unit && /^\s*(?:to|…|\.\.\.|–|-|\s)\s*$/.test(text.slice(tokens[k].end, tokens[k + 1].index))) {
      if (Number(tokens[k].value.replace('−', '-')) > Number(best.token.value.replace('−', '-')))
        best = { ...v, token: { ...tokens[k], unit: v.unit, kind: v.token.kind } };
      k--;
    }
    return best;
  });
}

export function readDeviceValues(pages: Line[][], used: Set<Line>, mpns: readonly string[], warnings: string[]): DeviceValues {
  const values: DeviceCandidate[] = [];
  const packages: DevicePackage[] = [];
  for (const lines of pages) {
    const ctx: ReadContext = { mpns, lines, warnings };
    for (const [k, line] of lines.entries()) {
      if (used.has(line)) continue;
      // A sentence wrapped onto the next line ("… may operate between −55 °C / and +150 °C.") is read with it; a line that starts with a capital starts a statement of its own.
      const next = lines[k + 1];
      const wrapped =
        line.cells.length === 1 &&
        next &&
        !used.has(next) &&
        next.cells.length === 1 &&
        next.y < line.y &&
        line.text.length > 40 &&
        !/[.;:]$/.test(line.text) &&
        /^[a-z\d+−°µμΩ-]/u.test(next.text);
      const read = wrapped ? joinLines(line, next) : line;
      for (const [field, rule] of Object.entries(DEVICE_RULES) as Array<[DeviceField, DeviceRule]>) values.push(...readRule(ctx, read, field, rule));
      const p = findPackage(line.text);
      // "Packages: SOT-23 / SMA" names no package for any one part.
      const after = p ? line.text.slice(p.index + p.value.length) : '';
      const second = /^\s*(?:\/|,|\band\b|\bor\b)\s*/.test(after) ? findPackage(after) : undefined;
      if (p && (!second || second.value === p.value)) {
        const score = /^(?:case|package)\b/i.test(line.text) ? 2 : /\b(?:package|case|outline)\b/i.test(line.text) ? 1 : 0;
        const series = seriesIn(line.text, mpns) ?? orderedPart(line.cells[0]?.text ?? '', mpns);
        const scope = series ? { series } : headingScope(ctx, line);
        delete scope.package;
        packages.push({ candidate: { value: p.value, page: line.page, text: line.printed, box: lineBox(line), rank: 0 }, score, scope });
      }
    }
  }
  return { values, packages };
}

/** A line of prose with its continuation: one cell, the first line's place and index. */
function joinLines(line: Line, next: Line): Line {
  const text = `${line.text} ${next.text}`;
  const printed = `${line.printed} ${next.printed}`;
  const cell = { ...line.cells[0], text, printed, x1: Math.max(line.cells[0].x1, next.cells[0].x1) };
  return { ...line, cells: [cell], text, printed };
}

/** Does a scope cover this part (its part number and package)? */
export function covers(scope: Scope, mpn: string, pkg: string | undefined): boolean {
  if (scope.series && !flat(mpn).startsWith(scope.series)) return false;
  if (scope.package && scope.package !== pkg) return false;
  return true;
}

/** How specific a scope is: a value printed for this series and package beats one printed for all. */
export const specificity = (s: Scope) => (s.series ? 1 : 0) + (s.package ? 1 : 0);
