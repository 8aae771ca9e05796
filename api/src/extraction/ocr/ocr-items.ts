import type { PdfTextItem } from '../pdf-text';
import { unitKind } from '../quantity-text';
import type { OcrLine, OcrWord } from './ocr-engine';

/**
 * OCR words → the text items the text extractor reads (PDF points, baseline, origin
 * bottom-left), so one extractor serves text PDFs and scans alike. The scan's skew is taken
 * out, words the engine was unsure of are left out (no value rather than a doubtful one),
 * and the usual misreadings of the English model are repaired from context: it has no µ and
 * no Ω, reads a minus sign as '=', a decimal point as ':' and the I of IZT as a 1.
 */

/** Numbers below this confidence (0–100) are dropped: a blank cell beats a wrong number. */
export const MIN_NUMBER_CONFIDENCE = 80;
/** Other words (labels, units, part numbers) are repaired from context and kept down to this. */
export const MIN_WORD_CONFIDENCE = 45;

/** A number as a cell holds it, possibly signed. */
const NUMBER = /^[+\-−]?\d+(?:\.\d+)?$/;

/**
 * One word, repaired; undefined when it cannot be trusted (a number with stray marks in it).
 * Exported for its unit spec.
 */
export function repairOcrWord(raw: string): string | undefined {
  // A ruled table's vertical lines come out as '|' (alone, or stuck to a cell's text).
  let w = raw.trim().replace(/^[|¦]+|[|¦]+$/g, '');
  if (!w) return undefined;
  // A plus-minus sign read as a pound sign ("£5 %").
  w = w.replace(/^£(?=\d)/, '±');
  // Minus signs: the model has '−' as '=', '—', '–', '~' or '-' before a number.
  w = w.replace(/^[=—–~](?=\d)/, '-');
  // A decimal point read as ':' ';' or ',' between digits (datasheets print points, not commas).
  w = w.replace(/(\d)[:;,](?=\d)/g, '$1.');
  // A full stop or colon left hanging after a number at the end of a cell.
  if (/^[+\-−]?\d+(?:\.\d+)?[.:;,]$/.test(w)) w = w.slice(0, -1);
  // Units the model cannot spell: µ comes out as H, p, u, U, y or W before A; Ω as Q (or 0, 2
  // inside brackets). Only where the shape leaves no doubt: a bracketed header unit or a
  // unit glued to a number.
  w = w.replace(/^([([])([HpuyWU]|µ|μ)A([)\]])$/, '$1µA$3').replace(/^([([])([kKmM]?)[QO02]([)\]])$/, '$1$2Ω$3');
  w = w.replace(/^(\d+(?:\.\d+)?)([HyWU])A$/, '$1µA').replace(/^(\d+(?:\.\d+)?)([kK]?)Q$/, '$1$2Ω');
  // A lone pA is µA too: regulator-diode leakage is specified in µA or nA, never pA (common practice, no source).
  // A lone "UA" is the u of a "uA" written large.
  if (/^[HypWU]A$/.test(w)) w = 'µA';
  if (/^[kK]?Q$/.test(w)) w = w.replace('Q', 'Ω');
  w = w.replace(/^\(Vv\)$|^\(v\)$/, '(V)').replace(/^\[Vv\]$|^\[v\]$/, '[V]');
  // A lone V (a unit cell) comes out as 'Vv' or 'v': no word of a datasheet is either.
  if (/^(?:Vv|v)$/.test(w)) w = 'V';
  // Power and thermal units in a unit cell or glued to a figure: "mw" can only be mW, "K/wW" only
  // K/W, and the degree sign with its C reads as a copyright sign ("150 (©" for 150 °C).
  w = w.replace(/^(\d+(?:\.\d+)?)?mw$/, '$1mW').replace(/^K\/[wW]{1,2}$/, 'K/W');
  if (/^\(?©\)?$|^°c$/.test(w)) w = '°C';
  // Mega-amperes are no rating or condition of a regulator diode: "MA" alone, bracketed or glued
  // to a figure is mA with its m read large ("@ 2 MA", "[MA]"; common practice, no source).
  w = w.replace(/^(\d+(?:\.\d+)?)?MA$/, '$1mA').replace(/^([([])MA([)\]])$/, '$1mA$2');
  // Symbols: I read as 1 or l before Z; α before VZ read as a.
  // Also inside a condition's bracket, and before a bracketed index: "(1ZT", "I1ZT", "1Z(K)", "1Z = 5 mA".
  w = w.replace(/^(\(?)[1lI|]{1,2}Z(?=[TKM(]|$)/, '$1IZ').replace(/^a[Vv]*(VZ|Vz|vz)$/, 'αVZ');
  // Millivolts in a small v ("mv/°C", "+2.4mv/K"): no other unit is spelt so.
  w = w.replace(/^([+\-−]?\d+(?:\.\d+)?)?mv(?=\/|$)/, '$1mV');
  // Regulator part numbers code the voltage as 5V1: a doubled or lower-case V between digits.
  w = w.replace(/(\d)[Vv]{1,2}(?=\d)/g, '$1V');
  // A token that starts like a number but carries other marks (234], 1:, 5:7.) is not trusted.
  if (/^[+\-−]?\d/.test(w) && !NUMBER.test(w) && /[^\w.%/°µΩ()\-−+]/.test(w)) return undefined;
  return w;
}

/** Column symbols of regulator-diode tables. */
const SYMBOL = /^(?:IZ[TKM]|ZZ[TK]|VZ|IR|VR|αVZ)$/;

export interface PageGeometry {
  /** Pixels per PDF point of the rendered image. */
  scale: number;
  /** Image size, pixels. */
  widthPx: number;
  heightPx: number;
  /** Page height in points (to flip y). */
  pageHeight: number;
}

/** The page's skew, radians: the median slope of the longer baselines. */
export function skewOf(lines: OcrLine[], minLengthPx: number): number {
  const slopes = lines
    .map((l) => l.baseline)
    .filter((b) => b.x1 - b.x0 >= minLengthPx)
    .map((b) => Math.atan2(b.y1 - b.y0, b.x1 - b.x0))
    .sort((a, b) => a - b);
  if (!slopes.length) return 0;
  return slopes[Math.floor(slopes.length / 2)];
}

export function ocrItems(lines: OcrLine[], g: PageGeometry): PdfTextItem[] {
  const angle = skewOf(lines, g.widthPx / 4);
  const cos = Math.cos(-angle);
  const sin = Math.sin(-angle);
  const cx = g.widthPx / 2;
  const cy = g.heightPx / 2;
  // Rotates an image point by −skew about the image centre.
  const unskew = (x: number, y: number) => ({ x: cx + (x - cx) * cos - (y - cy) * sin, y: cy + (x - cx) * sin + (y - cy) * cos });
  const items: PdfTextItem[] = [];
  for (const line of lines) {
    const b = line.baseline;
    const start = unskew(b.x0, b.y0);
    const size = Math.max(1, line.rowHeight / g.scale);
    const words = line.words.flatMap(apartAtSigns);
    const texts = legendSigns(unitsRow(words.map((w) => repairOcrWord(w.text))));
    for (const [w, word] of words.entries()) {
      const text = texts[w];
      if (!text) continue;
      // A bracketed unit or a column symbol the repair made sense of is kept however unsure the engine was.
      const unit = /^[([]([^()[\]]+)[)\]]$/.exec(text);
      // Except a current unit read as printed but unsure: µA and nA differ by one stroke, and a
      // wrong prefix makes every value of the column 1000 times off.
      const unsureCurrent = unit && unitKind(unit[1]) === 'current' && text === word.text.trim() && word.confidence < MIN_NUMBER_CONFIDENCE;
      if (unsureCurrent) continue;
      const known = (unit && unitKind(unit[1]) !== undefined) || SYMBOL.test(text);
      // Anything that starts with a number (also "4.7V", glued) is held to the number threshold.
      const numeric = /^[+\-−]?\.?\d/.test(text);
      if (!known && word.confidence < (numeric ? MIN_NUMBER_CONFIDENCE : MIN_WORD_CONFIDENCE)) continue;
      // The word's baseline point on the line's own baseline, then un-skewed.
      const t = b.x1 > b.x0 ? (word.x0 - b.x0) / (b.x1 - b.x0) : 0;
      const p = unskew(word.x0, b.y0 + t * (b.y1 - b.y0));
      items.push({
        str: text,
        x: round(p.x / g.scale),
        // One baseline for the whole OCR line, so a row stays one row after the skew is removed.
        y: round(g.pageHeight - start.y / g.scale),
        width: round((word.x1 - word.x0) / g.scale),
        height: round(size),
      });
    }
  }
  return items;
}

/**
 * A word the engine ran together with a condition's "@" ("8,2@", "32@2mA": the space before a
 * narrow "@" is often lost) as its pieces, each with its share of the word's box (by
 * characters) and the word's confidence. Glued, the figure was refused as a number with stray
 * marks in it, and the value with its condition was lost.
 */
export function apartAtSigns(word: OcrWord): OcrWord[] {
  const text = word.text.trim();
  if (!text.includes('@') || text === '@') return [word];
  const pieces = text.split(/(@)/).filter((p) => p.length > 0);
  // A figure with a leading zero and no separator ("02@105V" for "0.2 @ 10.5 V"): the word lost
  // its points, its condition's too; left whole, it is refused as before.
  if (pieces.some((p) => /^[+\-−]?0\d/.test(p))) return [word];
  const perChar = (word.x1 - word.x0) / text.length;
  let at = 0;
  return pieces.map((piece) => {
    const x0 = word.x0 + at * perChar;
    at += piece.length;
    return { ...word, text: piece, x0, x1: word.x0 + at * perChar };
  });
}

/** A unit as a units row prints it, bare or in brackets. */
const isUnit = (w: string | undefined) => w !== undefined && unitKind(w.replace(/^[([](.+)[)\]]$/, '$1')) !== undefined;
/** What the engine makes of a lone unit letter, in a units row only: V as Y, Ω as 0, O or Q. */
const ROW_UNIT_MISREADINGS: Array<[RegExp, string]> = [
  [/^[Yy]$/, 'V'],
  [/^([kKmM]?)[0OQ]$/, '$1Ω'],
];

/**
 * The words of a units row (three or more words, at least two thirds of them units, the others
 * of one or two characters: "V Y V Ω µA"), with the lone letters the engine makes of a unit read
 * as that unit. Elsewhere a lone "Y" or "0" is left as read. Exported for its unit spec.
 */
export function unitsRow(words: ReadonlyArray<string | undefined>): Array<string | undefined> {
  const present = words.filter((w): w is string => w !== undefined);
  const units = present.filter(isUnit).length;
  if (present.length < 3 || units < (2 / 3) * present.length || present.some((w) => !isUnit(w) && w.length > 2)) return [...words];
  return words.map((w) => (w === undefined || isUnit(w) ? w : ROW_UNIT_MISREADINGS.reduce((t, [re, to]) => t.replace(re, to), w)));
}

/**
 * A tolerance letter's percentage read with a plus for its ± ("B +2 %" in "A ±1 %, B +2 %, C ±5
 * %"): a lone capital, then a plus and a figure, then %. Suffix tolerances are symmetrical (common
 * practice, no source); the legend reader still asks for a legend's wording around it. Exported for its unit spec.
 */
export function legendSigns(words: ReadonlyArray<string | undefined>): Array<string | undefined> {
  return words.map((w, i) => {
    if (w === undefined || !/^\+\d+(?:\.\d+)?%?$/.test(w)) return w;
    const before = words[i - 1];
    const pct = w.endsWith('%') || /^%/.test(words[i + 1] ?? '');
    return pct && before !== undefined && /^[(,]?[A-Z][:=]?$/.test(before) ? `±${w.slice(1)}` : w;
  });
}

function round(x: number): number {
  return Math.round(x * 100) / 100;
}
