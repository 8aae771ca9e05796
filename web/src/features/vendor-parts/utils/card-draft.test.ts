import { describe, expect, it } from 'vitest';
import type { ExtractedVariant } from '@shuntwise/contracts';
import { acceptSuggestion, applyMerge, enterValue, mergeRows, pendingSuggestions, suggestionsFrom, variantOfCard, type CardDraft } from './card-draft';

// Invented series rows (demo data).
const row = (mpn: string, vz: number, zzt: number): ExtractedVariant => ({
  mpn,
  fields: {
    vzNom: { value: String(vz), unit: 'V', si: vz, page: 2, text: `${mpn} ${vz}` },
    izt: { value: '5', unit: 'mA', si: 0.005, page: 2, text: `${mpn} 5` },
    zzt: { value: String(zzt), unit: 'Ω', si: zzt, page: 2, text: `${mpn} ${zzt}` },
  },
});
const series = [row('PWZ-4V7', 4.7, 60), row('PWZ-5V1', 5.1, 28), row('PWZ-5V6', 5.6, 22)];

function filled(from: ExtractedVariant): CardDraft {
  let draft: CardDraft = {};
  for (const s of Object.values(suggestionsFrom(from, 7))) draft = acceptSuggestion(draft, s!);
  return draft;
}

describe('pendingSuggestions', () => {
  it('offers every reading for an empty card, none once they are taken', () => {
    const offered = suggestionsFrom(series[1], 7);
    expect(pendingSuggestions({}, offered, new Set()).map((s) => s.field)).toEqual(['vzNom', 'izt', 'zzt']);
    expect(pendingSuggestions(filled(series[1]), offered, new Set())).toEqual([]);
  });

  it('never takes back in bulk a value someone typed, in this session or saved as entered', () => {
    const offered = suggestionsFrom(series[1], 7);
    const corrected = enterValue(filled(series[1]), 'zzt', 25, '25 Ω');
    expect(pendingSuggestions(corrected, offered, new Set())).toEqual([]);
    expect(pendingSuggestions(corrected, offered, new Set(['zzt']))).toEqual([]);
  });
});

describe('variantOfCard', () => {
  it('finds the row a card was filled from when the part number is not printed', () => {
    expect(variantOfCard(series, filled(series[1]), 7)?.mpn).toBe('PWZ-5V1');
    expect(variantOfCard(series, filled(series[1]), 8)).toBeUndefined();
    expect(variantOfCard(series, {}, 7)).toBeUndefined();
  });
});

describe('mergeRows', () => {
  it('lets the side that changed a field win, and flags the fields both sides changed', () => {
    const base = filled(series[1]);
    const mine = enterValue(base, 'zzt', 25, '25 Ω');
    const theirs = enterValue(enterValue(base, 'zzt', 30, '30 Ω'), 'vzNom', 5.2, '5.2 V');
    const rows = mergeRows(base, mine, theirs);
    const by = Object.fromEntries(rows.map((r) => [r.field, r]));
    expect(by.zzt).toMatchObject({ conflict: true, choice: 'mine' });
    expect(by.vzNom).toMatchObject({ conflict: false, choice: 'theirs' });
    expect(by.izt).toMatchObject({ conflict: false, mineChanged: false, theirsChanged: false });
    const merged = applyMerge(rows, {});
    expect(merged.zzt?.value).toBe(25);
    expect(merged.vzNom?.value).toBe(5.2);
    expect(applyMerge(rows, { zzt: 'theirs' }).zzt?.value).toBe(30);
  });
});
