import { QuantityKind, SI_UNIT } from './quantity';

/** Engineering prefixes, largest first; only steps of 10³. */
const PREFIXES: ReadonlyArray<[number, string]> = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/** Kinds that are never shown with a prefix (°C, %/K, K/W read oddly as k°C or m%/K). */
const NO_PREFIX: ReadonlySet<QuantityKind> = new Set(['temperature', 'tempCoPercent', 'thermalResistance']);

/**
 * Kinds shown with one fixed prefix, as datasheets print them, so a column of them lines up
 * and reads alike: a Zener's temperature coefficient is "−0.60 mV/K" or "2.30 mV/K", never
 * "−600 µV/K". Below 1 of the unit one significant figure fewer is printed (at least two):
 * a datasheet states −0.6 mV/K, not −0.600 mV/K.
 */
const FIXED_PREFIX: Partial<Record<QuantityKind, { factor: number; prefix: string }>> = {
  tempCoVoltage: { factor: 1e-3, prefix: 'm' },
};

/** The true minus sign (U+2212) every displayed negative number carries, never a hyphen. */
export const MINUS = '\u2212';

export interface FormatOptions {
  /** Significant digits (default 3). */
  digits?: number;
  /** Text for a missing value (default an en dash). */
  empty?: string;
  /** Drop trailing zeros after the point ("25 °C", "5.1 V"): for values inside a sentence. */
  trim?: boolean;
}

/**
 * Formats an SI number with an engineering prefix and its unit: 4.7 → "4.70 V",
 * 0.00025 → "250 µA", -0.0019 (tempCoVoltage) → "−1.90 mV/K". Uses a true minus sign.
 */
export function formatQuantity(value: number | null | undefined, kind: QuantityKind, options: FormatOptions = {}): string {
  const digits = options.digits ?? 3;
  if (value === null || value === undefined || Number.isNaN(value)) return options.empty ?? '–';
  const unit = SI_UNIT[kind];
  if (!Number.isFinite(value)) return `${value < 0 ? MINUS : ''}∞ ${unit}`;
  const trim = options.trim ? trimZeros : (text: string) => text;
  const fixed = FIXED_PREFIX[kind];
  if (value === 0) return `0 ${fixed?.prefix ?? ''}${unit}`;
  const sign = value < 0 ? MINUS : '';
  const abs = Math.abs(value);
  if (NO_PREFIX.has(kind)) return `${sign}${trim(toDigits(abs, digits))} ${unit}`;
  if (fixed) {
    const scaled = abs / fixed.factor;
    const fewer = Math.max(2, digits - 1);
    const text = toDigits(scaled, Number(scaled.toPrecision(fewer)) < 1 ? fewer : digits);
    return `${sign}${trim(text)} ${fixed.prefix}${unit}`;
  }
  let [factor, prefix] = PREFIXES[PREFIXES.length - 1];
  for (const [f, p] of PREFIXES) {
    if (abs >= f * 0.9995) {
      [factor, prefix] = [f, p];
      break;
    }
  }
  let scaled = abs / factor;
  // Rounding can carry 999.6 m up to 1000 m: move to the next prefix instead.
  if (Number(scaled.toPrecision(digits)) >= 1000) {
    const index = PREFIXES.findIndex(([f]) => f === factor);
    if (index > 0) {
      [factor, prefix] = PREFIXES[index - 1];
      scaled = abs / factor;
    }
  }
  return `${sign}${trim(toDigits(scaled, digits))} ${prefix}${unit}`;
}

/** "4.700" → "4.7", "25.0" → "25", "120" stays. */
function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A plain number (a ratio, a factor) with `digits` significant figures and a true minus: 1.0512 → "1.05". */
export function formatNumber(value: number | null | undefined, digits = 3, options: { empty?: string; trim?: boolean } = {}): string {
  if (value === null || value === undefined || Number.isNaN(value)) return options.empty ?? '–';
  if (!Number.isFinite(value)) return `${value < 0 ? MINUS : ''}∞`;
  if (value === 0) return '0';
  const text = toDigits(Math.abs(value), digits);
  return `${value < 0 ? MINUS : ''}${options.trim ? trimZeros(text) : text}`;
}

/**
 * A fraction as a percentage: 0.0526 → "5.26 %", -0.02 → "−2 %". Trailing zeros are dropped
 * unless `trim: false`; `signed` writes "+" before positive values.
 */
export function formatPercent(
  fraction: number | null | undefined,
  options: { digits?: number; signed?: boolean; trim?: boolean; empty?: string } = {},
): string {
  if (fraction === null || fraction === undefined || Number.isNaN(fraction)) return options.empty ?? '–';
  const text = formatNumber(fraction * 100, options.digits ?? 3, { trim: options.trim ?? true });
  return `${options.signed && fraction > 0 ? '+' : ''}${text} %`;
}

/** A check's margin, already in percent of its limit, with its sign and one decimal: "+2.1 %", "−25.0 %", "±0.0 %". */
export function formatMargin(marginPercent: number | null | undefined): string {
  if (marginPercent === null || marginPercent === undefined || !Number.isFinite(marginPercent)) return '–';
  const rounded = Math.round(marginPercent * 10) / 10;
  const sign = rounded > 0 ? '+' : rounded < 0 ? MINUS : '±';
  return `${sign}${Math.abs(rounded).toFixed(1)} %`;
}

/** A temperature coefficient as a card holds it (a number in mV/K or %/K): "−0.60 mV/K", "0.0600 %/K". */
export function formatTc(tc: { value: number; unit: 'mV/K' | '%/K' } | null | undefined, options: FormatOptions = {}): string {
  if (!tc) return options.empty ?? '–';
  return tc.unit === 'mV/K' ? formatQuantity(tc.value / 1000, 'tempCoVoltage', options) : formatQuantity(tc.value, 'tempCoPercent', options);
}

function toDigits(x: number, digits: number): string {
  // toPrecision keeps trailing zeros (4.70) but switches to exponent form when the integer
  // part has more figures than asked for (also after rounding 99.7 up to "1.0e+2"): print
  // the integer then.
  if (x >= 10 ** digits) return Math.round(x).toString();
  const text = x.toPrecision(digits);
  if (!text.includes('e')) return text;
  // Below 1e-6 toPrecision writes "9.04e-12": spell the decimals out instead.
  if (x < 1) return x.toFixed(Math.min(100, digits - 1 - Math.floor(Math.log10(x))));
  return String(Number(text));
}

/** Significant figures of the first number in a datasheet text: "4.70 V" → 3, "0.25 mA" → 2, "500" → 3; null without a number. */
export function statedDigits(printed: string | null | undefined): number | null {
  const match = /(\d*\.?\d+)/.exec(printed ?? '');
  if (!match) return null;
  const figures = match[1].replace('.', '').replace(/^0+/, '');
  return figures.length === 0 ? 1 : figures.length;
}

/**
 * A stored value for an export: rounded to the precision its datasheet text states (at least
 * the screen's three figures), so binary noise such as 0.00025000000000000006 leaves as
 * 0.00025. When the text does not state this value (a converted coefficient), only the noise
 * goes: twelve figures, far inside the import's 1e-9 sameness test.
 */
export function roundToStated(value: number | null | undefined, printed: string | null | undefined): number | null {
  if (value === null || value === undefined || !Number.isFinite(value)) return null;
  const stated = roundToDigits(value, Math.min(15, Math.max(3, statedDigits(printed) ?? 3)))!;
  return Math.abs(stated - value) <= 1e-12 * Math.abs(value) ? stated : roundToDigits(value, 12);
}

/**
 * A number for a file a machine reads next (CSV): rounded to the significant digits the
 * screen prints, so -0.0018000000000000002 leaves as -0.0018. Plain ASCII, no prefix;
 * null stays null.
 */
export function roundToDigits(value: number | null | undefined, digits = 3): number | null {
  if (value === null || value === undefined || !Number.isFinite(value)) return null;
  return Number(value.toPrecision(digits));
}
