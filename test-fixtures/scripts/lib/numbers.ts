/** Number formatting the way datasheets print values (fixed decimals, half away from zero). */

export function roundTo(x: number, decimals: number): number {
  const f = 10 ** decimals;
  // The small bias keeps 4.845 (stored as 4.84499…) rounding up, as a person would.
  return (Math.sign(x) * Math.round(Math.abs(x) * f + 1e-7)) / f;
}

export function fixed(x: number, decimals: number): string {
  return roundTo(x, decimals).toFixed(decimals);
}

/** Rounds to `digits` significant digits. */
export function sig(x: number, digits: number): number {
  if (x === 0) return 0;
  const e = Math.floor(Math.log10(Math.abs(x))) - digits + 1;
  return roundTo(x / 10 ** e, 0) * 10 ** e;
}

/** Prints a number without float noise (0.30000000000000004 → "0.3"). */
export function plain(x: number): string {
  return String(Number(x.toPrecision(12)));
}

/** A maximum-limit value rounded up to a step a datasheet would print. */
export function ceilLimit(x: number): number {
  if (x < 10) return Math.ceil(x * 2 - 1e-9) / 2;
  if (x < 100) return Math.ceil(x - 1e-9);
  if (x < 1000) return Math.ceil(x / 10 - 1e-9) * 10;
  return Math.ceil(x / 50 - 1e-9) * 50;
}
