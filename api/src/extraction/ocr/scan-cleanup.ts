import { type Canvas, createCanvas } from '@napi-rs/canvas';
import { inkBlobs } from './line-segmentation';

/**
 * What a page image needs before the OCR engine sees it: the scanner's skew taken out, and the
 * rules of a ruled table erased. The engine reads a row boxed by lines that run a little
 * askew through it as noise (a whole row of a scanned table came out as "Diriile le SIGS"), so
 * the lines go and the text stays. Both steps are the usual ones of document-image work
 * (projection-profile deskew, long-run line removal; common practice, no source).
 */

export interface CleanedScan {
  /** Grey levels (here only 0 and 255), one byte per pixel, row by row. */
  grey: Uint8Array;
  width: number;
  height: number;
  /** The skew found and removed, degrees (positive: the text ran down to the right). */
  skewDeg: number;
  /** Pixels of rules erased. */
  rulePixels: number;
}

/** Darker than this (0–255) counts as ink. */
const INK = 150;
/** Darker than this is part of a rule: a thin rule prints grey, and the paper is near white. */
const RULE_INK = 210;

/** Grey levels of the canvas, one byte per pixel. */
function greyOf(canvas: Canvas): Uint8Array {
  const { width, height } = canvas;
  const rgba = canvas.getContext('2d').getImageData(0, 0, width, height).data;
  const grey = new Uint8Array(width * height);
  for (let i = 0, j = 0; j < grey.length; i += 4, j++) grey[j] = (rgba[i] * 77 + rgba[i + 1] * 150 + rgba[i + 2] * 29) >> 8;
  return grey;
}

/**
 * The skew, degrees, within ±maxDeg: the angle at which the ink's rows line up best (the
 * horizontal projection of the ink, sheared by the angle, has the largest sum of squares).
 */
export function skewOfImage(grey: Uint8Array, width: number, height: number, maxDeg = 2.5): number {
  // Ink points on a coarse grid (every 2nd pixel) keep it quick on a 300 dpi page.
  const xs: number[] = [];
  const ys: number[] = [];
  for (let y = 0; y < height; y += 2) {
    const row = y * width;
    for (let x = 0; x < width; x += 2) {
      if (grey[row + x] < INK) {
        xs.push(x);
        ys.push(y);
      }
    }
  }
  if (xs.length < 200) return 0;
  const bins = new Float64Array(height + 2 * Math.ceil(width * Math.tan((maxDeg * Math.PI) / 180)) + 4);
  const offset = Math.ceil(width * Math.tan((maxDeg * Math.PI) / 180)) + 2;
  const score = (deg: number) => {
    bins.fill(0);
    const t = Math.tan((deg * Math.PI) / 180);
    // Bins two pixels high, as the rows are sampled: with one-pixel bins the unsheared angle
    // (every point on an even row) would look sharper than any other.
    for (let i = 0; i < xs.length; i++) bins[(Math.round(ys[i] - xs[i] * t) + offset) >> 1]++;
    let s = 0;
    for (let i = 0; i < bins.length; i++) s += bins[i] * bins[i];
    return s;
  };
  let best = 0;
  let bestScore = score(0);
  for (let deg = -maxDeg; deg <= maxDeg + 1e-9; deg += 0.1) {
    const s = score(deg);
    if (s > bestScore) [best, bestScore] = [deg, s];
  }
  const coarse = best;
  for (let deg = coarse - 0.1; deg <= coarse + 0.1 + 1e-9; deg += 0.02) {
    const s = score(deg);
    if (s > bestScore) [best, bestScore] = [deg, s];
  }
  return best;
}

/** The canvas turned by −skew about its centre, on white. */
function unskewed(source: Canvas, skewDeg: number): Canvas {
  const { width, height } = source;
  const out = createCanvas(width, height);
  const ctx = out.getContext('2d');
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, width, height);
  ctx.translate(width / 2, height / 2);
  ctx.rotate((-skewDeg * Math.PI) / 180);
  ctx.drawImage(source, -width / 2, -height / 2);
  ctx.setTransform(1, 0, 0, 1, 0, 0);
  return out;
}

/**
 * Erases straight rules: horizontal ink runs at least `minRun.across` pixels long and vertical
 * ones at least `minRun.down` tall, each no thicker than `maxThickness` (a glyph's stroke is never that long
 * at text sizes; a bar of a bold heading is thick, not long). Returns the pixels erased.
 */
export function eraseRules(grey: Uint8Array, width: number, height: number, minRun: { across: number; down: number }, maxThickness: number): number {
  const mask = new Uint8Array(width * height);
  // Horizontal runs.
  for (let y = 0; y < height; y++) {
    const row = y * width;
    let start = -1;
    for (let x = 0; x <= width; x++) {
      const ink = x < width && grey[row + x] < RULE_INK;
      if (ink && start < 0) start = x;
      else if (!ink && start >= 0) {
        if (x - start >= minRun.across) for (let i = start; i < x; i++) mask[row + i] = 1;
        start = -1;
      }
    }
  }
  // Vertical runs.
  for (let x = 0; x < width; x++) {
    let start = -1;
    for (let y = 0; y <= height; y++) {
      const ink = y < height && grey[y * width + x] < RULE_INK;
      if (ink && start < 0) start = y;
      else if (!ink && start >= 0) {
        if (y - start >= minRun.down) for (let i = start; i < y; i++) mask[i * width + x] |= 2;
        start = -1;
      }
    }
  }
  // A run is a rule only where the ink is thin across it: a horizontal run with at most
  // maxThickness marked pixels above and below it in its column, and the same for vertical.
  let erased = 0;
  const out = new Uint8Array(mask.length);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const m = mask[i];
      if (!m) continue;
      if (m & 1) {
        let t = 1;
        for (let k = y - 1; k >= 0 && mask[k * width + x] & 1 && t <= maxThickness; k--) t++;
        for (let k = y + 1; k < height && mask[k * width + x] & 1 && t <= maxThickness; k++) t++;
        if (t <= maxThickness) out[i] = 1;
      }
      if (m & 2) {
        let t = 1;
        for (let k = x - 1; k >= 0 && mask[y * width + k] & 2 && t <= maxThickness; k--) t++;
        for (let k = x + 1; k < width && mask[y * width + k] & 2 && t <= maxThickness; k++) t++;
        if (t <= maxThickness) out[i] = 1;
      }
    }
  }
  // The rule's soft edge (antialiasing, JPEG) goes with it: one pixel either side.
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      if (out[y * width + x] !== 1) continue;
      for (let dy = -1; dy <= 1; dy++) {
        for (let dx = -1; dx <= 1; dx++) {
          const yy = y + dy;
          const xx = x + dx;
          if (yy < 0 || xx < 0 || yy >= height || xx >= width) continue;
          const j = yy * width + xx;
          if (out[j] === 0 && grey[j] < 235) out[j] = 2;
        }
      }
    }
  }
  for (let i = 0; i < out.length; i++) {
    if (out[i]) {
      grey[i] = 255;
      erased++;
    }
  }
  return erased;
}

/** Otsu's threshold of a grey-level histogram (Otsu 1979; common practice, no source). */
export function otsuThreshold(grey: Uint8Array): number {
  const hist = new Float64Array(256);
  for (let i = 0; i < grey.length; i++) hist[grey[i]]++;
  const total = grey.length;
  let sum = 0;
  for (let t = 0; t < 256; t++) sum += t * hist[t];
  let sumB = 0;
  let wB = 0;
  let best = 128;
  let bestVar = -1;
  for (let t = 0; t < 256; t++) {
    wB += hist[t];
    if (wB === 0) continue;
    const wF = total - wB;
    if (wF === 0) break;
    sumB += t * hist[t];
    const mB = sumB / wB;
    const mF = (sum - sumB) / wF;
    const between = wB * wF * (mB - mF) * (mB - mF);
    if (between > bestVar) [best, bestVar] = [t, between];
  }
  return best;
}

/**
 * Black ink on white paper, in place: the paper's grain and grey cast go, and a lone dark
 * pixel (a speck) with no dark neighbour goes too. The engine binarises each image it is
 * given by itself, and on a small cut-out of grainy paper it made "1152" of "11.2"; on clean
 * black and white it reads it right.
 */
export function binarise(grey: Uint8Array, width: number, height: number): void {
  const t = Math.min(200, Math.max(90, otsuThreshold(grey)));
  for (let i = 0; i < grey.length; i++) grey[i] = grey[i] <= t ? 0 : 255;
  for (let y = 1; y < height - 1; y++) {
    for (let x = 1; x < width - 1; x++) {
      const i = y * width + x;
      if (grey[i] !== 0) continue;
      if (
        grey[i - 1] &&
        grey[i + 1] &&
        grey[i - width] &&
        grey[i + width] &&
        grey[i - width - 1] &&
        grey[i - width + 1] &&
        grey[i + width - 1] &&
        grey[i + width + 1]
      )
        grey[i] = 255;
    }
  }
}

/**
 * Erases leader dots ("Zener voltage ........ 5.1 V"), in place: a row of six or more small dots
 * at an even pitch on one baseline. The engine reads a leader as noise and loses the figure
 * after it; a decimal point never comes six in a row. Returns the dots erased.
 */
export function eraseLeaders(grey: Uint8Array, width: number, height: number, dpi: number): number {
  const size = Math.max(3, Math.round(dpi / 40));
  const pitch = Math.round(dpi / 12);
  const dots = inkBlobs(grey, width, height, 1)
    .filter((b) => b.x1 - b.x0 < size && b.y1 - b.y0 < size)
    .sort((a, b) => a.y1 - b.y1 || a.x0 - b.x0);
  const used = new Set<number>();
  let erased = 0;
  for (let i = 0; i < dots.length; i++) {
    if (used.has(i)) continue;
    const chain = [i];
    let last = dots[i];
    // The next dot to the right on (nearly) the same baseline, within a pitch.
    for (let j = i + 1; j < dots.length && dots[j].y1 - last.y1 <= 2; j++) {
      const d = dots[j];
      if (used.has(j) || Math.abs(d.y1 - last.y1) > 2) continue;
      const gap = d.x0 - last.x1;
      if (gap > 0 && gap <= pitch) {
        chain.push(j);
        last = d;
      }
    }
    if (chain.length < 6) continue;
    for (const k of chain) {
      used.add(k);
      const d = dots[k];
      for (let y = d.y0; y <= d.y1; y++) for (let x = d.x0; x <= d.x1; x++) grey[y * width + x] = 255;
      erased++;
    }
  }
  return erased;
}

/**
 * The page image made ready for OCR: deskewed, without table rules and leader dots, in black
 * and white (as grey levels, so nothing page-sized is held twice).
 * `dpi` sets the rule lengths: a third of an inch across, a quarter down (a table of a header and
 * one row is about that tall; no glyph of text size is).
 */
export function cleanScan(source: Canvas, dpi: number): CleanedScan {
  const first = greyOf(source);
  const skewDeg = skewOfImage(first, source.width, source.height);
  const grey = Math.abs(skewDeg) >= 0.05 ? greyOf(unskewed(source, skewDeg)) : first;
  const { width, height } = source;
  const rulePixels = eraseRules(grey, width, height, { across: Math.round(dpi / 3), down: Math.round(dpi / 4) }, Math.max(2, Math.round(dpi / 50)));
  binarise(grey, width, height);
  eraseLeaders(grey, width, height, dpi);
  return { grey, width, height, skewDeg, rulePixels };
}
