/**
 * Text lines of a cleaned (deskewed, rule-free) page image, found from the ink itself: the
 * engine's own page layout analysis drops whole columns of lone figures in a sparse table (a
 * parameter table's min/typ/max column came out empty while its labels read perfectly), but
 * reads a single line it is handed very well. So the page is cut into lines here and each is
 * read alone.
 *
 * The method is the usual one of document-image work (common practice, no source): ink is
 * smeared along each row over gaps narrower than a word space, the smeared runs are joined
 * into connected blobs (words and phrases), and blobs that share a row band become a line.
 */

export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface SegmentedLine extends Box {
  /** The blobs of the line, left to right. */
  blobs: Box[];
}

/** Darker than this (0–255) counts as ink. */
const INK = 160;

/**
 * The lines of a greyscale image (one byte per pixel). `dpi` sets the scale: blobs are joined
 * over gaps of up to 1/25 inch (a word space of small print, not a table's column gap), a blob
 * taller than half an inch is a drawing, not text.
 */
export function segmentLines(grey: Uint8Array, width: number, height: number, dpi: number): SegmentedLine[] {
  const blobs = inkBlobs(grey, width, height, Math.max(4, Math.round(dpi / 25)));
  const tallest = dpi / 2;
  const speck = Math.max(2, Math.round(dpi / 100));
  return groupIntoLines(blobs.filter((b) => b.y1 - b.y0 < tallest && !(b.x1 - b.x0 <= speck && b.y1 - b.y0 <= speck)));
}

/** Connected blobs of ink, with ink joined along each row over gaps of up to `smear` pixels (1: touching ink only). */
export function inkBlobs(grey: Uint8Array, width: number, height: number, smear: number): Box[] {
  // Runs of smeared ink per row (in typed arrays: a page holds millions), joined with the
  // overlapping runs of the row above (union-find).
  let cap = 1 << 16;
  let x0s = new Int32Array(cap);
  let x1s = new Int32Array(cap);
  let ys = new Int32Array(cap);
  let parent = new Int32Array(cap);
  let n = 0;
  const find = (a: number): number => {
    while (parent[a] !== a) {
      parent[a] = parent[parent[a]];
      a = parent[a];
    }
    return a;
  };
  const push = (y: number, x0: number, x1: number) => {
    if (n === cap) {
      cap *= 2;
      const grow = (a: Int32Array) => {
        const b = new Int32Array(cap);
        b.set(a);
        return b;
      };
      [x0s, x1s, ys, parent] = [grow(x0s), grow(x1s), grow(ys), grow(parent)];
    }
    x0s[n] = x0;
    x1s[n] = x1;
    ys[n] = y;
    parent[n] = n;
    return n++;
  };
  let prevStart = 0;
  let prevEnd = 0;
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const rowStart = n;
    let start = -1;
    let lastInk = -1;
    for (let x = 0; x < width; x++) {
      if (grey[row + x] < INK) {
        if (start < 0) start = x;
        else if (x - lastInk > smear) {
          push(y, start, lastInk);
          start = x;
        }
        lastInk = x;
      }
    }
    if (start >= 0) push(y, start, lastInk);
    let p = prevStart;
    for (let r = rowStart; r < n; r++) {
      while (p < prevEnd && x1s[p] < x0s[r]) p++;
      for (let q = p; q < prevEnd && x0s[q] <= x1s[r]; q++) {
        const a = find(r);
        const b = find(q);
        if (a !== b) parent[a] = b;
      }
    }
    prevStart = rowStart;
    prevEnd = n;
  }
  const boxes = new Map<number, Box>();
  for (let r = 0; r < n; r++) {
    const l = find(r);
    const b = boxes.get(l);
    if (!b) boxes.set(l, { x0: x0s[r], y0: ys[r], x1: x1s[r], y1: ys[r] });
    else {
      b.x0 = Math.min(b.x0, x0s[r]);
      b.x1 = Math.max(b.x1, x1s[r]);
      b.y0 = Math.min(b.y0, ys[r]);
      b.y1 = Math.max(b.y1, ys[r]);
    }
  }
  return [...boxes.values()];
}

const heightOf = (b: Box) => b.y1 - b.y0 + 1;

/**
 * Blobs → lines: a blob joins the line whose band it shares (vertical overlap of at least half
 * the smaller of the two heights), however far to its right (a value across a leader, a
 * column of a two-column page: each cell is read alone anyway); otherwise it starts a line. Small marks (points, commas, minus
 * signs) join the line they touch.
 */
export function groupIntoLines(blobs: Box[]): SegmentedLine[] {
  const sorted = [...blobs].sort((a, b) => a.x0 - b.x0 || a.y0 - b.y0);
  const lines: (SegmentedLine & { core: number })[] = [];
  for (const b of sorted) {
    const h = heightOf(b);
    let best: (typeof lines)[number] | undefined;
    let bestOverlap = 0;
    for (const l of lines) {
      const overlap = Math.min(b.y1, l.y1) - Math.max(b.y0, l.y0) + 1;
      const need = 0.5 * Math.min(h, l.core);
      if (overlap < need) continue;
      // A blob much taller than the line (two lines run together) does not join it.
      if (h > 1.8 * l.core && l.core > 0) continue;
      if (overlap > bestOverlap) [best, bestOverlap] = [l, overlap];
    }
    if (best) {
      best.blobs.push(b);
      best.x1 = Math.max(best.x1, b.x1);
      // The band is the line's main text: small marks do not stretch it.
      if (h >= 0.6 * best.core) {
        best.y0 = Math.min(best.y0, b.y0);
        best.y1 = Math.max(best.y1, b.y1);
        best.core = Math.max(best.core, h);
      }
    } else lines.push({ x0: b.x0, y0: b.y0, x1: b.x1, y1: b.y1, blobs: [b], core: h });
  }
  return lines
    .map(({ core: _core, ...l }) => ({ ...l, y0: Math.min(...l.blobs.map((b) => b.y0)), y1: Math.max(...l.blobs.map((b) => b.y1)) }))
    .sort((a, b) => a.y0 - b.y0 || a.x0 - b.x0);
}
