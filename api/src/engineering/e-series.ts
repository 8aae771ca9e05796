import type { ResistorSeries } from '@shuntwise/contracts';

/**
 * Preferred numbers of IEC 60063, one decade. A table, not a formula: eight E24 values
 * (2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2) differ from the rounded geometric series.
 */
export const E24: readonly number[] = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

export const E96: readonly number[] = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43, 1.47, 1.5, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74, 1.78, 1.82, 1.87,
  1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21, 2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09, 3.16, 3.24, 3.32, 3.4, 3.48, 3.57,
  3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49, 5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65,
  6.81, 6.98, 7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
];

/** One decade (1 ≤ x < 10) of a series. */
export function seriesDecade(series: ResistorSeries): readonly number[] {
  return series === 'E24' ? E24 : E96;
}

/** Every value of a series (Ω) in [low, high], ascending; empty when none fits. */
export function seriesValuesBetween(low: number, high: number, series: ResistorSeries): number[] {
  const out: number[] = [];
  if (!(low > 0) || !(high >= low) || !Number.isFinite(high)) return out;
  const decade = seriesDecade(series);
  for (let exponent = Math.floor(Math.log10(low)) - 1; exponent <= Math.floor(Math.log10(high)) + 1; exponent++) {
    for (const mantissa of decade) {
      const value = roundValue(mantissa, exponent);
      if (value >= low * (1 - 1e-12) && value <= high * (1 + 1e-12)) out.push(value);
    }
  }
  return out;
}

/** The series value (Ω) nearest to `target` by ratio (nearest on a log scale, as the series is spaced). */
export function nearestSeriesValue(target: number, series: ResistorSeries): number {
  const exponent = Math.floor(Math.log10(target));
  const candidates = seriesValuesBetween(10 ** (exponent - 1), 10 ** (exponent + 2), series);
  return nearestByRatio(target, candidates);
}

/** The candidate closest to target by ratio; ties go to the smaller. */
export function nearestByRatio(target: number, candidates: readonly number[]): number {
  let best = Number.NaN;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (const value of candidates) {
    const distance = Math.abs(Math.log(value / target));
    if (distance < bestDistance - 1e-12) {
      best = value;
      bestDistance = distance;
    }
  }
  return best;
}

function roundValue(mantissa: number, exponent: number): number {
  // 4.7 × 10^2 in floating point is 470.00000000000006; keep values exact-looking.
  return Number((mantissa * 10 ** exponent).toPrecision(3));
}
