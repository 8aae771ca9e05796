import { compact, rankByText, splitHouseParts, textTokens, type TextRecord } from './text-ranking';

// Invented demo names; what a designer types is checked against what a person would pick (common practice, no source).
const records: TextRecord[] = [
  {
    id: 1,
    mpn: 'QHZ5V6A',
    manufacturer: 'Quarryhill Semitech',
    package: 'SOD-123',
    houseParts: ['OHI-ZD-1056'],
    descriptions: ['Regulator diode 5.6 V, reference for the loop driver'],
  },
  {
    id: 2,
    mpn: 'BRZ05-5V6',
    manufacturer: 'Brackenford Semiconductor',
    package: 'SOD-123',
    houseParts: ['OHI-ZD-1056'],
    descriptions: ['Regulator diode 5.6 V, reference for the loop driver'],
  },
  {
    id: 3,
    mpn: 'QHZ5V1AF',
    manufacturer: 'Quarryhill Semitech',
    package: 'SOD-123F',
    houseParts: ['OHI-ZD-1051'],
    descriptions: ['Regulator diode 5.1 V, rail clamp'],
  },
  {
    id: 4,
    mpn: 'TPZ15-11',
    manufacturer: 'Tevorrow Power Devices',
    package: 'SMB',
    houseParts: ['OHI-ZD-2110'],
    descriptions: ['Regulator diode 11 V, valve-driver clamp'],
  },
];
const ids = (text: string) => rankByText(records, text).map((r) => r.id);

describe('text ranking (fuse.js over the candidates SQL left)', () => {
  it('puts the exact part number first and tolerates a transposition or missing separators', () => {
    expect(ids('QHZ5V6A')[0]).toBe(1);
    expect(ids('QZH5V6A')).toEqual([1]);
    expect(ids('brz055v6')[0]).toBe(2);
    expect(ids('tpz1511')[0]).toBe(4);
  });

  it('requires every word, each in any field', () => {
    expect(ids('quarryhill 5v6')[0]).toBe(1);
    expect(ids('quarryhill 5v6')).not.toContain(2);
    expect(ids('valve clamp')).toEqual([4]);
  });

  it('finds house part numbers and descriptions, and nothing for unrelated text', () => {
    expect(ids('OHI-ZD-1056').slice(0, 2).sort()).toEqual([1, 2]);
    expect(ids('loop driver').sort()).toEqual([1, 2]);
    expect(ids('xylophone')).toEqual([]);
  });

  it('reads typed quotes and operators as characters, not as search syntax', () => {
    expect(() => rankByText(records, "'QHZ !5V6 ^A$ |")).not.toThrow();
  });

  it('scores from 0 (exact) upwards, best first', () => {
    const ranked = rankByText(records, 'QHZ5V6A');
    expect(ranked[0].score).toBeLessThan(0.01);
    for (let i = 1; i < ranked.length; i++) expect(ranked[i].score).toBeGreaterThanOrEqual(ranked[i - 1].score);
  });

  it('splits words, compacts part numbers, and reads the repository lists', () => {
    expect(textTokens('  qhz   5v6 a ')).toEqual(['qhz', '5v6']);
    expect(textTokens('a')).toEqual(['a']);
    expect(compact('QHZ 15-C5.1/V')).toBe('qhz15c51v');
    expect(splitHouseParts('OHI-ZD-1056\tRef diode\nOHI-ZD-1051\t')).toEqual({ numbers: ['OHI-ZD-1056', 'OHI-ZD-1051'], descriptions: ['Ref diode'] });
    expect(splitHouseParts(null)).toEqual({ numbers: [], descriptions: [] });
  });
});
