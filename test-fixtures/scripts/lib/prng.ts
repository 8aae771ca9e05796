/**
 * Seeded pseudo-random numbers (mulberry32) so that every run of the generator writes
 * byte-identical fixtures.
 */
export class Prng {
  private state: number;

  constructor(seed: number) {
    this.state = seed >>> 0;
  }

  /** Uniform in [0, 1). */
  next(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  /** Uniform in [low, high). */
  between(low: number, high: number): number {
    return low + (high - low) * this.next();
  }

  /** Whole number in [low, high]. */
  int(low: number, high: number): number {
    return Math.floor(this.between(low, high + 1));
  }

  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)];
  }

  bytes(count: number): Buffer {
    const out = Buffer.alloc(count);
    for (let i = 0; i < count; i++) out[i] = Math.floor(this.next() * 256);
    return out;
  }
}
