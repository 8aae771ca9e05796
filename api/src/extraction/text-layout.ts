import type { PdfPageText } from './pdf-text';

/** Text items grouped into lines and cells (runs of text separated by a clear gap). */

export interface Cell {
  /** The text for reading: numbers in the document's decimal style made plain (see number-style). */
  text: string;
  /** The text as printed. */
  printed: string;
  x0: number;
  x1: number;
  /** Baseline. */
  y: number;
  size: number;
}

export interface Line {
  page: number;
  /** Position of the line in reading order on its page. */
  index: number;
  y: number;
  size: number;
  cells: Cell[];
  text: string;
  /** The text as printed. */
  printed: string;
}

/**
 * Whether a line's cells follow each other at word spaces (under one font size apart): one run
 * of words that OCR cut at every space ("Maximum | ratings, | SH | series"), not a table's
 * columns, whose gutters are wider.
 */
export function wordSpaced(line: Line): boolean {
  return line.cells.every((c, i) => i === 0 || c.x0 - line.cells[i - 1].x1 < line.size);
}

/** A gap wider than this many font sizes starts a new cell (a word space is about 0.3). */
const CELL_GAP = 0.55;

export function pageLines(page: PdfPageText): Line[] {
  const items = page.items.map((i) => ({ str: i.str, x0: i.x, x1: i.x + i.width, y: i.y, size: i.height || 1 })).sort((a, b) => b.y - a.y || a.x0 - b.x0);
  const groups = inReadingOrder(groupByBaseline(items));
  return groups.map((group, index) => {
    group.sort((a, b) => a.x0 - b.x0);
    const cells: Cell[] = [];
    for (const item of group) {
      const last = cells[cells.length - 1];
      const gap = last ? item.x0 - last.x1 : Infinity;
      if (last && gap < CELL_GAP * Math.max(last.size, item.size)) {
        const glue = gap > 0.12 * item.size && !last.text.endsWith(' ') && !item.str.startsWith(' ') ? ' ' : '';
        last.text += glue + item.str;
        last.x1 = Math.max(last.x1, item.x1);
        last.size = Math.max(last.size, item.size);
      } else {
        cells.push({ text: item.str, printed: '', x0: item.x0, x1: item.x1, y: item.y, size: item.size });
      }
    }
    for (const c of cells) c.printed = c.text = c.text.replace(/\s+/g, ' ').trim();
    const y = group[0].y;
    const size = Math.max(...group.map((g) => g.size));
    const text = cells.map((c) => c.text).join(' ');
    return { page: page.page, index, y, size, cells, text, printed: text };
  });
}

interface Placed {
  str: string;
  x0: number;
  x1: number;
  y: number;
  size: number;
}

function groupByBaseline(items: Placed[]): Placed[][] {
  const groups: Placed[][] = [];
  for (const item of items) {
    const current = groups[groups.length - 1];
    if (current) {
      const ref = current[0];
      // Subscripts sit a little lower than their line; other lines are a full line away.
      if (Math.abs(ref.y - item.y) <= 0.45 * Math.max(ref.size, item.size)) {
        current.push(item);
        continue;
      }
    }
    groups.push([item]);
  }
  return groups;
}

/** No text within this many points of a gutter's line. */
const GUTTER_CLEAR = 6;
/** The least gap between two columns' text on one baseline, in points. */
const SHARED_GAP = 18;

/**
 * Two-column pages: the vertical line in the middle of the text with the most baselines
 * that hold text on its left only AND the most that hold text on its right only (two columns
 * keep baselines of their own), less the baselines whose text runs across it.
 */
function findGutter(groups: Placed[][]): number | undefined {
  let count = 0;
  let left = Infinity;
  let right = -Infinity;
  for (const g of groups) {
    for (const i of g) {
      count++;
      left = Math.min(left, i.x0);
      right = Math.max(right, i.x1);
    }
  }
  if (count < 20) return undefined;
  const from = Math.round(left + 0.3 * (right - left));
  const to = Math.floor(left + 0.7 * (right - left));
  if (to <= from) return undefined;
  // The right column's left edge: where most baselines that hold text only in the right half begin.
  const starts = new Map<number, number>();
  for (const g of groups) {
    const x0 = Math.round(Math.min(...g.map((i) => i.x0)));
    if (x0 > from) starts.set(x0, (starts.get(x0) ?? 0) + 1);
  }
  let edge = Infinity;
  let edgeCount = 0;
  for (const [x0, k] of starts) if (k > edgeCount || (k === edgeCount && x0 < edge)) [edge, edgeCount] = [x0, k];
  // Per candidate x (whole points from `from`): baselines wholly left, wholly right, and crossing it, by difference arrays.
  const n = to - from + 2;
  const leftStarts = new Int32Array(n);
  const rightEnds = new Int32Array(n);
  const cross = new Int32Array(n);
  const shared = new Int32Array(n);
  const at = (x: number) => Math.min(n - 1, Math.max(0, x - from));
  for (const g of groups) {
    let maxX1 = -Infinity;
    let minX0 = Infinity;
    for (const i of g) {
      maxX1 = Math.max(maxX1, i.x1);
      minX0 = Math.min(minX0, i.x0);
    }
    // Wholly left of x from maxX1 + clear on; wholly right of it up to minX0 − clear.
    if (Math.ceil(maxX1 + GUTTER_CLEAR) <= to) leftStarts[at(Math.ceil(maxX1 + GUTTER_CLEAR))]++;
    if (Math.floor(minX0 - GUTTER_CLEAR) >= from) rightEnds[at(Math.floor(minX0 - GUTTER_CLEAR))]++;
    {
      // Crossing where one of its runs spans x (x0 < x < x1), counted once per baseline.
      const spans = g.map((i) => [Math.floor(i.x0) + 1, Math.ceil(i.x1) - 1] as const).sort((a, b) => a[0] - b[0]);
      let [a, b] = [Infinity, -Infinity];
      const flush = () => {
        if (b >= a && b >= from && a <= to) {
          cross[at(a)]++;
          cross[at(b) + 1 < n ? at(b) + 1 : n - 1]--;
        }
      };
      let previousEnd = -Infinity;
      for (const [s0, s1] of spans) {
        if (s0 > b + 1) {
          flush();
          if (b > -Infinity) previousEnd = b;
          // Text on both sides with a clear gap between: the two columns on one baseline.
          const g0 = Math.ceil(previousEnd + GUTTER_CLEAR);
          const g1 = Math.floor(s0 - GUTTER_CLEAR);
          // Only a gap as wide as a gutter, before text that starts at the right column's edge
          // (a table's row has gaps too, but its values do not start where the column's lines do).
          if (previousEnd > -Infinity && s0 - 1 >= edge - 3 && s0 - 1 <= edge + 15 && s0 - previousEnd >= SHARED_GAP && g1 >= g0 && g1 >= from && g0 <= to) {
            shared[at(Math.max(g0, from))]++;
            shared[at(g1) + 1 < n ? at(g1) + 1 : n - 1]--;
          }
          [a, b] = [s0, s1];
        } else b = Math.max(b, s1);
      }
      flush();
    }
  }
  let best: number[] = [];
  let bestScore = 0;
  let bestSupport = 0;
  let onlyLeft = 0;
  let onlyRight = rightEnds.reduce((acc, v) => acc + v, 0);
  let crossing = 0;
  let both = 0;
  for (let k = 0; k + from <= to; k++) {
    onlyLeft += leftStarts[k];
    crossing += cross[k];
    both += shared[k];
    const x = from + k;
    // Columns set on one line pitch share many baselines: with a few lines of each column on
    // their own as well, every baseline clear at x with text on both sides counts half.
    const own = Math.min(onlyLeft, onlyRight);
    const score = own + (own >= 2 ? Math.floor(both / 2) : 0) - crossing;
    // Equal scores: the line that more baselines leave clear (a gap inside one column's table
    // can tie with the gutter, but fewer of the page's lines stand clear of it).
    const support = onlyLeft + onlyRight + both;
    if (score > bestScore || (score === bestScore && support > bestSupport && best[best.length - 1] !== x - 1)) {
      bestScore = score;
      bestSupport = support;
      best = [x];
    } else if (score === bestScore && best.length && best[best.length - 1] === x - 1) best.push(x);
    onlyRight -= rightEnds[k];
  }
  if (bestScore >= 3) return best[Math.floor(best.length / 2)];
  return repeatedColumnsGutter(groups, from, to);
}

/**
 * Two columns set on one pitch from top to bottom leave no line of either standing alone, so
 * the count above finds nothing. Two columns of the same kind (a part's table beside the next
 * part's) repeat themselves, though: "Package: SOT-23 … Package: SMA", "Symbol Parameter … Symbol
 * Parameter …", "UZ Working voltage … UZ Working voltage …". A table's row never starts again
 * with its own first word after a wide gap. Four or more such lines that agree on where the
 * second column starts, with hardly any text running across just left of it, make the gutter.
 */
function repeatedColumnsGutter(groups: Placed[][], from: number, to: number): number | undefined {
  const firstWord = (str: string) => /^\s*([\p{L}][\p{L}\p{N}:.-]*)/u.exec(str)?.[1];
  const edges: number[] = [];
  for (const g of groups) {
    const sorted = [...g].sort((a, b) => a.x0 - b.x0);
    const lead = firstWord(sorted.map((i) => i.str).join(''));
    if (!lead || lead.length < 2) continue;
    let end = -Infinity;
    for (let k = 0; k < sorted.length; k++) {
      const i = sorted[k];
      if (end > -Infinity && i.x0 - end >= SHARED_GAP && i.x0 > from && i.x0 < to + 40) {
        const text = sorted
          .slice(k)
          .map((o) => o.str)
          .join('');
        if (firstWord(text) === lead) {
          edges.push(i.x0);
          break;
        }
      }
      end = Math.max(end, i.x1);
    }
  }
  if (edges.length < 4) return undefined;
  edges.sort((a, b) => a - b);
  // The edge most of them share (within a few points: a symbol sits a little in from a heading).
  let best = edges[0];
  let agree = 0;
  for (const e of edges) {
    const n = edges.filter((o) => o >= e && o <= e + 15).length;
    if (n > agree) [best, agree] = [e, n];
  }
  if (agree < 4) return undefined;
  // The gutter lies left of the column's leftmost start near that edge (a heading that starts a
  // little left of the symbols under it: "FNC-10" at 431 over "VZ" at 446).
  const leftmost = Math.min(...edges.filter((e) => e >= best - 15 && e <= best));
  const x = Math.floor(leftmost) - GUTTER_CLEAR - 2;
  if (x < from || x > to) return undefined;
  const crossing = groups.filter((g) => g.some((i) => i.x0 < x && i.x1 > x)).length;
  return crossing <= 3 ? x : undefined;
}

/**
 * Reading order on a page that may hold two columns: between baselines that run across the
 * gutter, the left column is read first, then the right one. Rows that hold text on both
 * sides on one exact baseline, two or more in a row, mostly going on past the gutter with a
 * value, are a table across the page and stay whole (two columns keep baselines of their own
 * and meet only by chance, or start a label of their own on the right).
 */
function inReadingOrder(groups: Placed[][]): Placed[][] {
  const x = findGutter(groups);
  if (x === undefined) return groups;
  const crosses = (g: Placed[]) => g.some((i) => i.x0 < x && i.x1 > x);
  const meanY = (g: Placed[]) => g.reduce((a, i) => a + i.y, 0) / g.length;
  const shared = (g: Placed[]) => {
    const l = g.filter((i) => i.x1 <= x);
    const r = g.filter((i) => i.x0 >= x);
    return l.length > 0 && r.length > 0 && Math.abs(meanY(l) - meanY(r)) < 0.5;
  };
  const out: Placed[][] = [];
  let part: Placed[][] = [];
  const splitPart = () => {
    for (const g of part) {
      const l = g.filter((i) => i.x1 <= x);
      if (l.length) out.push(l);
    }
    for (const g of part) {
      const r = g.filter((i) => i.x1 > x);
      if (r.length) out.push(r);
    }
    part = [];
  };
  // A row of a table across the page goes on past the gutter with a value ("5.1", "−0.94 %/K");
  // two columns side by side start a label of their own there ("Zener voltage …", "A 0.95 1.35").
  const valueAfterGutter = (g: Placed[]) => {
    const r = g.filter((i) => i.x0 >= x).sort((a, b) => a.x0 - b.x0);
    return r.length > 0 && /^\s*[<≤>≥±+\-−–]?\s*\.?\d/u.test(r[0].str);
  };
  const tableRows = new Set<number>();
  for (let k = 0; k < groups.length;) {
    let e = k;
    while (e < groups.length && shared(groups[e])) e++;
    if (e - k >= 2) {
      const run = groups.slice(k, e);
      if (run.filter(valueAfterGutter).length * 2 > run.length) {
        for (let j = k; j < e; j++) tableRows.add(j);
        // Its header lines just above ("Parameter Symbol Unit XA10 | XA11 XA12") belong to it too.
        for (let j = k - 1; j >= Math.max(0, k - 3) && shared(groups[j]); j--) tableRows.add(j);
      }
    }
    k = Math.max(e, k + 1);
  }
  for (let k = 0; k < groups.length; k++) {
    const g = groups[k];
    if (crosses(g) || tableRows.has(k)) {
      splitPart();
      out.push(g);
    } else part.push(g);
  }
  splitPart();
  return out;
}

export function cellBox(c: Cell): { x: number; y: number; width: number; height: number } {
  // The box reaches a little below the baseline so that descenders are inside it.
  return { x: round(c.x0), y: round(c.y - 0.22 * c.size), width: round(c.x1 - c.x0), height: round(c.size * 1.1) };
}

export function lineBox(l: Line): { x: number; y: number; width: number; height: number } {
  const x0 = Math.min(...l.cells.map((c) => c.x0));
  const x1 = Math.max(...l.cells.map((c) => c.x1));
  return { x: round(x0), y: round(l.y - 0.22 * l.size), width: round(x1 - x0), height: round(l.size * 1.1) };
}

function round(x: number): number {
  return Math.round(x * 100) / 100;
}
