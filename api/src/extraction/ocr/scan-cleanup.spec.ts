import { type Canvas, createCanvas } from '@napi-rs/canvas';
import { segmentLines } from './line-segmentation';
import { cleanScan, eraseRules, skewOfImage } from './scan-cleanup';
import { cellsOf } from './segmented-reading';

/**
 * The page clean-up before OCR, on drawn pages whose truth is known from how they were drawn
 * (the angle the canvas was turned by, where the bars were put), not from our own code.
 */

/** A page of "text": rows of word-sized bars, turned by `deg` about its centre, on white. */
function page(deg: number, rows = 12): { canvas: Canvas; grey: Uint8Array } {
  const canvas = createCanvas(1200, 900);
  const ctx = canvas.getContext('2d');
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, 1200, 900);
  ctx.translate(600, 450);
  ctx.rotate((deg * Math.PI) / 180);
  ctx.translate(-600, -450);
  ctx.fillStyle = '#000000';
  for (let r = 0; r < rows; r++) for (let x = 100; x < 1000; x += 90) ctx.fillRect(x, 100 + r * 55, 60, 22);
  const rgba = ctx.getImageData(0, 0, 1200, 900).data;
  const grey = new Uint8Array(1200 * 900);
  for (let i = 0; i < grey.length; i++) grey[i] = rgba[i * 4];
  return { canvas, grey };
}

/** A white image, one byte per pixel, and a pen that paints black rectangles [x0, x1) × [y0, y1) on it. */
function blank(w: number, h: number) {
  const grey = new Uint8Array(w * h).fill(255);
  const paint = (x0: number, y0: number, x1: number, y1: number) => {
    for (let y = y0; y < y1; y++) for (let x = x0; x < x1; x++) grey[y * w + x] = 0;
  };
  return { grey, paint };
}

describe('cleaning a scanned page for OCR', () => {
  it.each([-1.3, -0.4, 0, 0.7, 1.9])('finds a skew of %s° (the angle the drawn page was turned by) within 0.1°', (deg) => {
    // Canvas y runs down, so a clockwise turn makes rows run down to the right: a positive skew.
    expect(Math.abs(skewOfImage(page(deg).grey, 1200, 900) - deg)).toBeLessThan(0.1);
  });

  it('straightens a turned page so its rows lie level again', () => {
    const cleaned = cleanScan(page(1.2).canvas, 300);
    expect(cleaned.skewDeg).toBeCloseTo(1.2, 1);
    expect(Math.abs(skewOfImage(cleaned.grey, 1200, 900))).toBeLessThan(0.1);
  });

  it('erases a table rule but keeps short strokes and thick bars (a glyph, a bold block)', () => {
    const w = 400;
    const h = 200;
    const { grey, paint } = blank(w, h);
    paint(10, 50, 390, 52); // a rule across the table, 2 px
    paint(200, 60, 202, 190); // a column rule, 2 px
    paint(20, 100, 60, 102); // a short stroke (a minus sign)
    paint(100, 120, 180, 160); // a thick block
    eraseRules(grey, w, h, { across: 100, down: 75 }, 6);
    expect(grey[51 * w + 300]).toBe(255);
    expect(grey[150 * w + 201]).toBe(255);
    expect(grey[101 * w + 40]).toBe(0);
    expect(grey[140 * w + 140]).toBe(0);
  });
});

describe('cutting a page into lines and cells', () => {
  it('finds each drawn row as one line, and cuts a row at its wide gaps only', () => {
    const w = 1000;
    const h = 300;
    const { grey, paint } = blank(w, h);
    // Row 1: two "words" 8 px apart (one cell), then a figure far to the right (another cell).
    paint(50, 50, 120, 75);
    paint(128, 50, 200, 75);
    paint(400, 52, 450, 75);
    // Row 2, with a decimal point-sized mark between two digits' bars.
    paint(50, 150, 70, 175);
    paint(73, 171, 76, 175);
    paint(79, 150, 99, 175);
    const lines = segmentLines(grey, w, h, 300);
    expect(lines).toHaveLength(2);
    expect(cellsOf(lines[0]).map((c) => [c.x0, c.x1])).toEqual([
      [50, 199],
      [400, 449],
    ]);
    expect(cellsOf(lines[1])).toHaveLength(1);
  });
});
