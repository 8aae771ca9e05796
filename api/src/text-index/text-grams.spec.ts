import fc from 'fast-check';
import { compact, grams, indexRowsOf, TEXT_KINDS } from './text-grams';

describe('text-index normalisation', () => {
  it('drops case and separators, so a part number typed either way looks alike', () => {
    expect(compact('OHI-ZD-1051')).toBe('ohizd1051');
    expect(compact(' ohi zd_1051 ')).toBe('ohizd1051');
    expect(grams('OHI-ZD-1051')).toEqual(['ohi', 'hiz', 'izd', 'zd1', 'd10', '105', '051']);
    expect(grams('5V')).toEqual([]);
    // µ and Ω are one character each, not two bytes
    expect(grams('µΩx')).toEqual(['µωx']);
  });

  it('keeps one row per distinct piece of a record, never across two names', () => {
    const rows = indexRowsOf('housePart', 7, ['AB-C', 'CDE', null]);
    expect(rows).toEqual([
      [TEXT_KINDS.housePart, 'abc', 7],
      [TEXT_KINDS.housePart, 'cde', 7],
    ]);
  });

  // The property the list filters rely on: any piece of three or more characters cut out of a
  // name (after compact) has all its pieces among the name's (generated names, seed printed).
  it('finds every substring of a name through its pieces', () => {
    const seed = Number(process.env.FC_SEED ?? Date.now() % 2 ** 31);
    console.log(`text-grams property seed ${seed} (replay with FC_SEED=${seed})`);
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom(...'ab1-5V. zQµ'.split('')), minLength: 3, maxLength: 24 }), fc.nat(), fc.nat(), (name, a, b) => {
        const c = Array.from(compact(name));
        if (c.length < 3) return;
        const start = a % (c.length - 2);
        const end = start + 3 + (b % (c.length - start - 2));
        const piece = c.slice(start, end).join('');
        const own = new Set(grams(name));
        for (const g of grams(piece)) expect(own.has(g)).toBe(true);
      }),
      { seed, numRuns: 300 },
    );
  });
});
