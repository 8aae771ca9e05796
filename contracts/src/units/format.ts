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

const MINUS = '\u2212';

export interface FormatOptions {
  /** Significant digits (default 3). */
  digits?: number;
  /** Text for a missing value (default an en dash). */
  empty?: string;
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
  if (value === 0) return `0 ${unit}`;
  const sign = value < 0 ? MINUS : '';
  const abs = Math.abs(value);
  if (NO_PREFIX.has(kind)) return `${sign}${toDigits(abs, digits)} ${unit}`;
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
  return `${sign}${toDigits(scaled, digits)} ${prefix}${unit}`;
}

function toDigits(x: number, digits: number): string {
  // toPrecision keeps trailing zeros (4.70) but switches to exponent form when the integer
  // part has more figures than asked for (also after rounding 99.7 up to "1.0e+2"): print
  // the integer then.
  if (x >= 10 ** digits) return Math.round(x).toString();
  const text = x.toPrecision(digits);
  return text.includes('e') ? String(Number(text)) : text;
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
