import type { Line } from './text-layout';

/**
 * The decimal separator a document uses, decided once per document from the numbers it
 * prints: "3,6 V" and "0,30 µA" in one datasheet, "3.6 V" in another. Only unambiguous
 * numbers count: one separator with one, two or four-plus digits after it. "1,000" (a
 * thousands separator or a decimal?) and dates or versions with two separators ("01.05.2024",
 * "1.2.3") are left out of the count.
 */

export type DecimalSeparator = '.' | ',';

const EVIDENCE = {
  ',': /(?<![\d.,])\d{1,4},(?:\d{1,2}|\d{4,})(?![\d.,])/g,
  '.': /(?<![\d.,])\d{1,4}\.(?:\d{1,2}|\d{4,})(?![\d.,])/g,
};
/** "0,300" can only be a decimal, whatever the digit count. */
const LEADING_ZERO = { ',': /(?<![\d.,])0,\d+(?![\d.,])/g, '.': /(?<![\d.,])0\.\d+(?![\d.,])/g };

export function detectDecimalSeparator(texts: Iterable<string>): DecimalSeparator {
  let comma = 0;
  let dot = 0;
  for (const t of texts) {
    comma += count(t, EVIDENCE[',']) + count(t, LEADING_ZERO[','], true);
    dot += count(t, EVIDENCE['.']) + count(t, LEADING_ZERO['.'], true);
  }
  return comma > dot ? ',' : '.';
}

function count(text: string, re: RegExp, onlyThreeDigits = false): number {
  let n = 0;
  for (const m of text.matchAll(re)) {
    // The leading-zero rule only adds what EVIDENCE left out (three digits after the separator).
    if (onlyThreeDigits && !/[.,]\d{3}$/.test(m[0])) continue;
    n++;
  }
  return n;
}

// The number may carry a sign ("-0,058"), but a hyphen after letters makes it part of a part number ("AB-3,6").
const BETWEEN_DIGITS = {
  ',': /(?<=(?:^|[^\p{L}\d.,/\-−–+])[-+−–]?\d+),(?=\d)/gu,
  '.': /(?<=(?:^|[^\p{L}\d.,/\-−–+])[-+−–]?\d+)\.(?=\d)/gu,
};

/**
 * Rewrites the numbers of the lines for reading, keeping every offset: the document's
 * decimal separator becomes "." and the other separator between digits becomes "ˌ" (a modifier letter), so that
 * "1.000" in a decimal-comma document (a thousand) is read as no number at all rather than
 * as 1. The printed text stays in `printed`. Part numbers ("XY5.1B", "AB-3.6") are glued to
 * letters and are not touched.
 */
export function normaliseNumbers(text: string, sep: DecimalSeparator): string {
  const other: DecimalSeparator = sep === ',' ? '.' : ',';
  let out = text.replace(BETWEEN_DIGITS[other], 'ˌ');
  if (sep === ',') out = out.replace(BETWEEN_DIGITS[','], '.');
  return out;
}

export function applyDecimalSeparator(pages: Line[][], sep: DecimalSeparator): void {
  for (const lines of pages) {
    for (const line of lines) {
      for (const c of line.cells) c.text = normaliseNumbers(c.text, sep);
      line.text = normaliseNumbers(line.text, sep);
    }
  }
}

/** A number read from normalised text, printed again as the document printed it. */
export function printedNumber(value: string, sep: DecimalSeparator): string {
  return sep === ',' ? value.replace('.', ',') : value;
}
