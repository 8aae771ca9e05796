import { E24, E96, nearestSeriesValue, seriesValuesBetween } from './e-series';

// IEC 60063 preferred-number tables, transcribed here from the standard's E24 and E96
// lists (from memory) independently of the table in e-series.ts.
const IEC_E24 = '10 11 12 13 15 16 18 20 22 24 27 30 33 36 39 43 47 51 56 62 68 75 82 91';
const IEC_E96 =
  '100 102 105 107 110 113 115 118 121 124 127 130 133 137 140 143 147 150 154 158 162 165 169 174 ' +
  '178 182 187 191 196 200 205 210 215 221 226 232 237 243 249 255 261 267 274 280 287 294 301 309 ' +
  '316 324 332 340 348 357 365 374 383 392 402 412 422 432 442 453 464 475 487 499 511 523 536 549 ' +
  '562 576 590 604 619 634 649 665 681 698 715 732 750 768 787 806 825 845 866 887 909 931 953 976';

describe('E24 and E96 tables (IEC 60063)', () => {
  it('E24 is the IEC 60063 table (IEC 60063)', () => {
    expect(E24.map((x) => Math.round(x * 10))).toEqual(IEC_E24.split(' ').map(Number));
  });

  it('E96 is the IEC 60063 table (IEC 60063)', () => {
    expect(E96.map((x) => Math.round(x * 100))).toEqual(IEC_E96.split(' ').map(Number));
  });

  it('E24 departs from the rounded series 10^(i/24) at exactly 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2 (IEC 60063, from memory)', () => {
    const departures = E24.filter((x, i) => Math.round(10 ** (i / 24) * 10) / 10 !== x);
    expect(departures).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it('E96 follows the rounded series 10^(i/96) to three figures (IEC 60063, from memory)', () => {
    E96.forEach((x, i) => expect(x).toBe(Math.round(10 ** (i / 96) * 100) / 100));
  });
});

describe('nearest-value selection', () => {
  it('picks by ratio within and across decades (IEC 60063 values)', () => {
    expect(nearestSeriesValue(325, 'E24')).toBe(330);
    expect(nearestSeriesValue(4990, 'E96')).toBe(4990);
    expect(nearestSeriesValue(5000, 'E96')).toBe(4990);
    // 9.6 is nearer to 10 than to 9.1 by ratio (ln 10/9.6 = 0.041 < ln 9.6/9.1 = 0.053).
    expect(nearestSeriesValue(9.6, 'E24')).toBe(10);
    expect(nearestSeriesValue(0.47, 'E24')).toBe(0.47);
    expect(nearestSeriesValue(1.234e6, 'E96')).toBe(1.24e6);
  });

  it('lists every value in a range, ends included (IEC 60063 values)', () => {
    expect(seriesValuesBetween(100, 200, 'E24')).toEqual([100, 110, 120, 130, 150, 160, 180, 200]);
    expect(seriesValuesBetween(471, 509, 'E24')).toEqual([]);
    expect(seriesValuesBetween(960, 1030, 'E96')).toEqual([976, 1000, 1020]);
    expect(seriesValuesBetween(200, 100, 'E24')).toEqual([]);
  });
});
