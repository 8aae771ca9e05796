import { formatQuantity } from './format';
import type { QuantityKind } from './quantity';

/**
 * The usual ranges of regulator (Zener and avalanche) diodes' spec values, one place for the
 * api and the web. A value outside is not refused (the hard limits are PHYSICAL_BOUNDS in
 * bounds.ts): it is worth a second look, most often a unit slip such as "5.1 mV" or "5.1 kV"
 * for 5.1 V. The ranges are common practice, no source, from memory of catalogue regulator
 * diodes: breakdown voltages from about 1.8 V to 400 V, test currents from about 50 µA to
 * 1 A, power ratings from about 100 mW to 50 W.
 */
export const USUAL_RANGES = {
  zenerVoltage: { min: 1.8, max: 400, kind: 'voltage', what: 'regulator diodes' },
  testCurrent: { min: 50e-6, max: 1, kind: 'current', what: 'regulator-diode test currents' },
  powerRating: { min: 0.1, max: 50, kind: 'power', what: 'regulator-diode power ratings' },
} as const satisfies Record<string, { min: number; max: number; kind: QuantityKind; what: string }>;
export type UsualRange = keyof typeof USUAL_RANGES;

/** Prefix slips a value is checked for, nearest first: milli/kilo, then micro/mega. */
const SLIPS = [1e3, 1e-3, 1e6, 1e-6] as const;

/**
 * A plain warning when a value lies outside its usual range, naming the range and, where
 * one prefix step puts it inside, the value that was probably meant; null inside the range
 * and for an empty or unreadable value.
 */
export function plausibilityWarning(range: UsualRange, value: number | null | undefined): string | null {
  if (value === null || value === undefined || !Number.isFinite(value)) return null;
  const { min, max, kind, what } = USUAL_RANGES[range];
  const magnitude = Math.abs(value);
  if (magnitude >= min && magnitude <= max) return null;
  const f = (x: number) => formatQuantity(x, kind);
  const meant = SLIPS.map((k) => value * k).find((x) => Math.abs(x) >= min && Math.abs(x) <= max);
  return `${f(value)} is outside the usual range of ${what} (${f(min)} … ${f(max)})${meant !== undefined ? `: did you mean ${f(meant)}?` : '; check the unit'}`;
}
