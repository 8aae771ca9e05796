import { formatQuantity } from '@shuntwise/contracts';

/** 1-2-5 ticks per decade inside [low, high] (A). */
export function logTicks(low: number, high: number): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(low)); e <= Math.ceil(Math.log10(high)); e++) {
    for (const m of [1, 2, 5]) {
      const t = m * 10 ** e;
      // Rounded so 2e-3 prints as 2 mA, not 2.0000000000000004 mA.
      const tick = Number(t.toPrecision(3));
      if (tick >= low * 0.999 && tick <= high * 1.001) ticks.push(tick);
    }
  }
  return ticks;
}

/** A tick label without trailing zeros: "2 mA", "250 µA", "10 mA" (the shared formatter, trimmed). */
export function shortQuantity(value: number, kind: 'current' | 'voltage'): string {
  return formatQuantity(value, kind, { digits: 3, trim: true });
}

/** Round ticks (steps of 1, 2 or 5 × 10ⁿ) covering [low, high], about `count` of them, and the domain they span. */
export function niceTicks(low: number, high: number, count = 6): { ticks: number[]; domain: [number, number] } {
  const raw = (high - low) / Math.max(1, count - 1) || Math.abs(high) * 0.1 || 1;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const start = Math.floor(low / step) * step;
  const end = Math.ceil(high / step) * step;
  const ticks: number[] = [];
  for (let v = start; v <= end + step / 2; v += step) ticks.push(Number(v.toPrecision(10)));
  return { ticks, domain: [start, end] };
}
