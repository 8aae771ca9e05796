import { kindOfUnit, normaliseQuantityText, parseQuantity, type QuantityKind } from '@shuntwise/contracts';

/**
 * Finding numbers with their units in datasheet text. The unit spellings themselves (µ/u/μ,
 * Ω/Ω/ohm, °C/C, …) are decided by the shared parser in @shuntwise/contracts.
 */

const NUM = String.raw`[+\-−–]?(?:\d+(?:\.\d+)?|\.\d+)`;
const PREFIX = '[pnuµμmkKMG]?';
// Longest spellings first so that "mV/°C" is not read as "mV".
const UNIT =
  String.raw`(?:%\s?/\s?(?:K|°C|℃|C)|°C\s?/\s?W|℃/W|K\s?/\s?W|C/W|${PREFIX}V\s?/\s?(?:K|°C|℃|C)|°C|℃|degC|` +
  String.raw`${PREFIX}(?:[\u03A9\u2126]|[Oo]hms?)|${PREFIX}[VAW]|C)`;

/** A number, optionally after ≤/< and followed by a unit; not glued to letters before it. */
// Not followed by a letter, digit or slash: "12 mW/°C" is a derating slope, not a power.
// Superscript digits and ⁽ ⁾ are footnote markers ("5.1⁽²⁾", "5.1²"), not part of the number.
// Nor followed by ".digit": "37.139.0" is two numbers run together (cells that overlap), no number at all.
const TOKEN = new RegExp(String.raw`(?<![\p{L}\p{N}.\-/])([<≤>≥]\s*)?(${NUM})(?:\s?(${UNIT}))?(?![\p{L}0-9/]|\.\d)`, 'gu');
/** A unit left apart from its number where a footnote or condition was blanked ("11.0 [2] V", "56.0 @ 0.89 mA V"). */
const GAP = new RegExp(String.raw`(\d)(\s{3,40})(${UNIT})(?![\p{L}0-9/])`, 'gu');

/** Brings such a unit back beside its number, keeping the text's length (and so every offset). */
export function closeGaps(text: string): string {
  return text.replace(GAP, (_m, d: string, gap: string, unit: string) => `${d} ${unit}${' '.repeat(gap.length - 1)}`);
}
const UNIT_ONLY = new RegExp(String.raw`^\s*(${UNIT})\s*$`, 'u');
const FOOTNOTE = String.raw`(?:\(\d\)|\[\d\]|\([Nn]ote\s?\d\)|\d\)|⁽?[⁰¹²³⁴⁵⁶⁷⁸⁹]+⁾?|[*†‡])`;
// A footnote mark may stand after the figure or after its unit ("15,00 (Note 2) V", "15,00 V (2)").
const NUMERIC_CELL = new RegExp(
  String.raw`^\s*[<≤>≥]?\s*${NUM}\s*(?:${FOOTNOTE}\s*)?(?:${UNIT})?\s*${FOOTNOTE}?\s*(?:(?:@|at)\s*${NUM}\s?(?:${UNIT}))?\s*$`,
  'u',
);

/**
 * The shared parser knows the ohm as U+03A9 only; datasheets also print the ohm sign
 * U+2126. Normalised here for reading; the unit is still reported as printed.
 */
export function unitKind(unit: string): QuantityKind | undefined {
  return kindOfUnit(unit.replace(/\u2126/g, '\u03A9'));
}

export interface QuantityToken {
  /** The number as printed (sign kept as printed). */
  value: string;
  /** The unit as printed, or '' when none follows. */
  unit: string;
  kind: QuantityKind | undefined;
  /** Offset of the number in the text. */
  index: number;
  end: number;
}

/** Footnote markers: "(Note 2)", "[2]", "(2)", "²", "⁽²⁾", "¹)", and "1)" after a word. Blanked before reading numbers. */
const FOOTNOTE_MARK = /\((?:note\s*)?\d{1,2}\)|\[\d{1,2}\]|⁽?[⁰¹²³⁴⁵⁶⁷⁸⁹]+⁾?\)?|(?<=[\p{L}\s])\d\)(?=\s|$)/giu;

export function blankFootnotes(text: string): string {
  return closeGaps(text.replace(FOOTNOTE_MARK, (m) => ' '.repeat(m.length)));
}

export function findQuantities(text: string): QuantityToken[] {
  const out: QuantityToken[] = [];
  for (const m of blankFootnotes(text).matchAll(TOKEN)) {
    const unit = m[3] ?? '';
    const start = m.index + (m[1]?.length ?? 0);
    out.push({ value: m[2], unit, kind: unit ? unitKind(unit) : undefined, index: start, end: m.index + m[0].length });
  }
  return out;
}

/**
 * A bare figure ending in 0 or 2 among figures that print their Ω: a scan read the Ω as a digit
 * ("310 Ω" as 3100, ten times too large). `printedUnits` counts the figures of the same row or
 * column that print their own unit; two or more make the missing one suspect.
 */
export function ohmReadAsDigit(q: QuantityToken, printedUnits: number, unit: string | undefined): boolean {
  return !q.unit && printedUnits >= 2 && unit !== undefined && unitKind(unit) === 'resistance' && /[02]$/.test(q.value);
}

export function isUnitOnly(text: string): boolean {
  const m = UNIT_ONLY.exec(text);
  return m !== null && unitKind(m[1]) !== undefined;
}

export function isNumericCell(text: string): boolean {
  return NUMERIC_CELL.test(text);
}

/** A table cell that says "not specified". */
export function isEmptyCell(text: string): boolean {
  return /^\s*(?:[–—-]+|n\/?a|\*)?\s*$/i.test(text);
}

/** The unit written in a header, e.g. "(V)", "[mA]", "(mV/°C)". */
export function headerUnit(text: string): string | undefined {
  for (const m of text.matchAll(/[([]\s*([^()[\]]+?)\s*[)\]]/g)) {
    if (unitKind(m[1]) !== undefined) return m[1];
  }
  const tokens = text.split(/\s+/).reverse();
  return tokens.find((t) => /^[^\d]/.test(t) && isUnitOnly(t));
}

/** SI value of a printed number and unit of a kind, or undefined when they do not fit. */
export function toSi(value: string, unit: string, kind: QuantityKind): number | undefined {
  try {
    return parseQuantity(`${normaliseQuantityText(value)} ${unit.replace(/\u2126/g, '\u03A9')}`, kind);
  } catch {
    return undefined;
  }
}
