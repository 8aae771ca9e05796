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

/** A gap wider than this many font sizes starts a new cell (a word space is about 0.3). */
const CELL_GAP = 0.55;

export function pageLines(page: PdfPageText): Line[] {
  const items = page.items
    .map((i) => ({ str: i.str, x0: i.x, x1: i.x + i.width, y: i.y, size: i.height || 1 }))
    .sort((a, b) => b.y - a.y || a.x0 - b.x0);
  const groups: Array<typeof items> = [];
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
