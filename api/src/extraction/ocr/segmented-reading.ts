import { createCanvas } from '@napi-rs/canvas';
import type { OcrLine, OcrWord } from './ocr-engine';
import { type Box, type SegmentedLine, segmentLines } from './line-segmentation';
import { MIN_NUMBER_CONFIDENCE } from './ocr-items';

/** Recognises the image of one short run of text; the words' boxes in that image's pixels. */
export type LineReader = (png: Buffer, mode: 'line' | 'block') => Promise<OcrLine[]>;

/** Cut-outs shorter than this (pixels) are enlarged to it before reading. */
const MIN_READ_HEIGHT = 30;
/** The most a cut-out is enlarged. */
const MAX_ZOOM = 3;

/**
 * A figure of small print read unsure, or without a decimal separator ("680V" for "6.80 V": the
 * point is a pixel or two), is read again enlarged as far as it goes. Where both readings give
 * the same digits, the second stands when it shows a separator the first lacked, or when it is
 * the surer of two alike that both show one. Seen on scans: "6.80V" and "4.8V" read at 57 and
 * 51 % confidence (left out as unsure) came out at 87 and 89 % enlarged; "680V", "48V" came out
 * "6.80V", "4.8V".
 * Otherwise the first reading stands, and the value checks catch a point still lost ("59V" for
 * 5.9 V, read so at every size).
 */
export async function withSecondRead(first: OcrLine[], again: () => Promise<OcrLine[]>): Promise<OcrLine[]> {
  const words = first.flatMap((l) => l.words);
  if (words.length === 0 || words.length > 2 || !/^[+\-−]?\d/.test(words[0].text.trim())) return first;
  const lostPoint = /^[+\-−]?\d{2,}(?:[^\d.,:;]\S*)?$/.test(words[0].text.trim());
  if (!lostPoint && words[0].confidence >= MIN_NUMBER_CONFIDENCE) return first;
  const second = await again();
  const secondWords = second.flatMap((l) => l.words);
  const text = (ls: OcrLine[]) =>
    ls
      .flatMap((l) => l.words.map((w) => w.text.trim()))
      .join('')
      .toLowerCase();
  const digits = (ls: OcrLine[]) => text(ls).replace(/(\d)[.,](?=\d)/g, '$1');
  if (!secondWords.length || digits(second) !== digits(first)) return first;
  const separator = (ls: OcrLine[]) => /\d[.,]\d/.test(text(ls));
  if (separator(second) && !separator(first)) return second;
  // Alike and surer: only a figure with its separator. An unsure "105V" read surer enlarged is
  // still a figure that may have lost its point (10.5 V); it stays unsure and is left out.
  return separator(first) && text(second) === text(first) && secondWords[0].confidence > words[0].confidence ? second : first;
}

/**
 * Reads a cleaned page (black ink on white, deskewed, one byte per pixel) cell by cell: each
 * line found in the ink is cut at its wide gaps (a table row's cells; a sentence stays whole),
 * each cut-out is read alone, and the words come back as one line per row, in page pixels.
 */
export async function readByLines(grey: Uint8Array, width: number, height: number, dpi: number, readLine: LineReader): Promise<OcrLine[]> {
  const lines = segmentLines(grey, width, height, dpi);
  const heights = lines.map((l) => l.y1 - l.y0 + 1).sort((a, b) => a - b);
  const typical = heights[Math.floor(heights.length / 2)] ?? 0;
  const out: OcrLine[] = [];
  for (const line of lines) {
    const others = lines.filter((l) => l !== line && l.x0 <= line.x1 && l.x1 >= line.x0 && l.y0 <= line.y1 && l.y1 >= line.y0).flatMap((l) => l.blobs);
    // A blob of two lines run together (tight leading): read as a block, its lines kept apart.
    if (line.y1 - line.y0 + 1 > 1.7 * typical) {
      out.push(...(await readCutOut(grey, width, height, line, others, readLine, 'block')));
      continue;
    }
    // Each cell alone: handed a lone figure of a table row, the engine reads it; inside the
    // whole row's reading it was often lost or run into its neighbour.
    const words: OcrWord[] = [];
    const rowHeights: number[] = [];
    const baselines: number[] = [];
    for (const cell of cellsOf(line)) {
      const read = await readCutOut(grey, width, height, cell, others, readLine, 'line');
      const small = cell.y1 - cell.y0 + 1 < MIN_READ_HEIGHT;
      for (const l of small ? await withSecondRead(read, () => readCutOut(grey, width, height, cell, others, readLine, 'line', MAX_ZOOM)) : read) {
        words.push(...l.words);
        if (!l.words.length) continue;
        rowHeights.push(l.rowHeight);
        baselines.push((l.baseline.y0 + l.baseline.y1) / 2);
      }
    }
    if (!words.length) continue;
    words.sort((a, b) => a.x0 - b.x0);
    // The page is deskewed, so a row's baseline is level: the middle of its cells' baselines.
    const y = median(baselines);
    // The row's height as the engine measures a line (ascender to descender: about the font size).
    const rowHeight = median(rowHeights);
    out.push({ words, rowHeight, baseline: { x0: line.x0, y0: y, x1: line.x1, y1: y } });
  }
  return out;
}

/** One cell cut out with a margin (other lines' ink inside it whited out, small print enlarged), read, mapped back to page pixels. */
async function readCutOut(
  grey: Uint8Array,
  width: number,
  height: number,
  cell: SegmentedLine,
  others: Box[],
  readLine: LineReader,
  mode: 'line' | 'block',
  zoomTo?: number,
): Promise<OcrLine[]> {
  const h = cell.y1 - cell.y0 + 1;
  const pad = Math.max(6, Math.round(h * 0.5));
  const x0 = Math.max(0, cell.x0 - pad);
  const y0 = Math.max(0, cell.y0 - pad);
  const x1 = Math.min(width - 1, cell.x1 + pad);
  const y1 = Math.min(height - 1, cell.y1 + pad);
  const w = x1 - x0 + 1;
  const hh = y1 - y0 + 1;
  const canvas = createCanvas(w, hh);
  const ctx = canvas.getContext('2d');
  const image = ctx.createImageData(w, hh);
  const near = others.filter((b) => b.x0 <= x1 && b.x1 >= x0 && b.y0 <= y1 && b.y1 >= y0);
  for (let y = 0; y < hh; y++) {
    for (let x = 0; x < w; x++) {
      const gx = x0 + x;
      const gy = y0 + y;
      let v = grey[gy * width + gx];
      // Ink of a neighbouring line (a descender from above, a tall mark below) is whited out.
      if (v < 128 && near.length && near.some((b) => inside(b, gx, gy)) && !cell.blobs.some((b) => inside(b, gx, gy))) v = 255;
      const i = (y * w + x) * 4;
      image.data[i] = image.data[i + 1] = image.data[i + 2] = v;
      image.data[i + 3] = 255;
    }
  }
  ctx.putImageData(image, 0, 0);
  const zoom = zoomTo ?? (h < MIN_READ_HEIGHT ? Math.min(MAX_ZOOM, MIN_READ_HEIGHT / h) : 1);
  let sized = canvas;
  if (zoom > 1.05) {
    sized = createCanvas(Math.round(w * zoom), Math.round(hh * zoom));
    const sctx = sized.getContext('2d');
    sctx.imageSmoothingEnabled = true;
    sctx.imageSmoothingQuality = 'high';
    sctx.drawImage(canvas, 0, 0, sized.width, sized.height);
  }
  const z = sized.width / w;
  const read = await readLine(sized.toBuffer('image/png'), mode);
  return read
    .filter((l) => l.words.length)
    .map((l) => ({
      rowHeight: l.rowHeight / z,
      baseline: { x0: l.baseline.x0 / z + x0, y0: l.baseline.y0 / z + y0, x1: l.baseline.x1 / z + x0, y1: l.baseline.y1 / z + y0 },
      words: l.words.map((wd) => ({ ...wd, x0: wd.x0 / z + x0, x1: wd.x1 / z + x0, y0: wd.y0 / z + y0, y1: wd.y1 / z + y0 })),
    }));
}

/** A line cut at its wide gaps (more than the line's height): the cells of a table row. */
export function cellsOf(line: SegmentedLine): SegmentedLine[] {
  const h = line.y1 - line.y0 + 1;
  const blobs = [...line.blobs].sort((a, b) => a.x0 - b.x0);
  const cells: SegmentedLine[] = [];
  for (const b of blobs) {
    const last = cells[cells.length - 1];
    if (last && b.x0 - last.x1 <= h) {
      last.blobs.push(b);
      last.x1 = Math.max(last.x1, b.x1);
      last.y0 = Math.min(last.y0, b.y0);
      last.y1 = Math.max(last.y1, b.y1);
    } else cells.push({ x0: b.x0, y0: b.y0, x1: b.x1, y1: b.y1, blobs: [b] });
  }
  return cells;
}

const inside = (b: Box, x: number, y: number) => x >= b.x0 && x <= b.x1 && y >= b.y0 && y <= b.y1;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
