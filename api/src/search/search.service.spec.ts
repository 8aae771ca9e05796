import { SEARCH_TEXT_CANDIDATES, searchQuerySchema, type SearchQuery } from '@shuntwise/contracts';
import type { CandidateRow, PairRow, PartRow, SearchRepository, TextNarrowing } from './search.repository';
import { SearchService, sortMatches, toClearance, toSearchCard } from './search.service';

const candidate = (id: number, mpn: string): CandidateRow => ({ id, mpn, manufacturer: 'Invented Maker', package: 'SOD-123', vzNom: 2 + id / 1000, pdMax: 0.5, houseParts: null });

/** A repository whose candidate query answers by the narrowing asked for, recording each call. */
function fakeRepository(sizes: { all: number; leading: number; whole: number }) {
  const calls: Array<string[] | undefined> = [];
  const rows = (n: number) => Array.from({ length: n }, (_, i) => candidate(i + 1, i === 7 ? 'QHZ5V6A' : `QHX${i}`));
  const size = (text: TextNarrowing | undefined) => (!text?.tokens ? sizes.all : text.tokens[0].length <= 3 ? sizes.leading : sizes.whole);
  const repository = {
    usableIds: async () => rows(sizes.all).map((r) => r.id),
    exceeds: async (_q: SearchQuery, text: TextNarrowing | undefined, limit: number) => size(text) > limit,
    candidates: async (_q: SearchQuery, text: TextNarrowing | undefined, limit: number) => {
      calls.push(text?.tokens);
      return rows(Math.min(size(text), limit));
    },
    parts: async (ids: number[]): Promise<PartRow[]> =>
      ids.map((id) => ({ id, manufacturer: 'Invented Maker', mpn: `P${id}`, package: null, lifecycleNote: null, cardVersion: null, fields: null, datasheetId: null })),
    pairs: async (): Promise<PairRow[]> => [],
  } as unknown as SearchRepository;
  return { repository, calls };
}

const query = (raw: Record<string, string>) => searchQuerySchema.parse(raw);

describe('SearchService text narrowing', () => {
  it('ranks every part the filters leave when they are few enough (fuzzy)', async () => {
    const { repository, calls } = fakeRepository({ all: 50, leading: 0, whole: 0 });
    const page = await new SearchService(repository).search(query({ q: 'QZH5V6A' }));
    expect(calls).toEqual([undefined]);
    expect(page.text).toEqual({ mode: 'fuzzy', candidates: 50, truncated: false, note: null });
    expect(page.items[0].vendorPart.id).toBe(8);
  });

  it('narrows by each word\'s first three letters when the filters leave too many, then by whole words, and says when it had to cut', async () => {
    const many = SEARCH_TEXT_CANDIDATES + 500;
    const leading = fakeRepository({ all: many, leading: 300, whole: 0 });
    const byLeading = await new SearchService(leading.repository).search(query({ q: 'QHZ5V6A' }));
    expect(leading.calls).toEqual([['QHZ']]);
    expect(byLeading.text).toMatchObject({ mode: 'prefix', candidates: 300, truncated: false, note: expect.stringMatching(/first letters/) });

    const whole = fakeRepository({ all: many, leading: many, whole: many });
    const cut = await new SearchService(whole.repository).search(query({ q: 'QHZ5V6A' }));
    expect(whole.calls).toEqual([['QHZ5V6A']]);
    expect(cut.text).toMatchObject({ mode: 'prefix', candidates: SEARCH_TEXT_CANDIDATES, truncated: true, note: expect.stringMatching(/Narrow the filters/) });
  });
});

const pair = (over: Partial<PairRow>): PairRow => ({
  vendorPartId: 1,
  housePartId: 2,
  partNumber: 'OHI-ZD-1',
  description: 'clamp',
  status: 'active',
  caseId: null,
  revision: null,
  state: null,
  decisionText: null,
  decidedAt: null,
  decidedById: null,
  decidedByName: null,
  needsRecheck: 0,
  openCaseId: null,
  ...over,
});

describe('where a pair stands for a designer', () => {
  it('is usable when its latest decision cleared it, with the conditions and the date of that decision', () => {
    const c = toClearance(pair({ caseId: 9, revision: 2, state: 'cleared-with-conditions', decisionText: 'sample 5 per lot', decidedAt: new Date('2026-11-02T10:00:00Z'), decidedById: 3, decidedByName: 'Tomas Eklund', needsRecheck: 1, openCaseId: 12 }));
    expect(c).toEqual({
      housePart: { id: 2, partNumber: 'OHI-ZD-1', description: 'clamp', status: 'active' },
      standing: 'cleared-with-conditions',
      conditions: 'sample 5 per lot',
      since: '2026-11-02T10:00:00.000Z',
      decidedBy: { id: 3, name: 'Tomas Eklund' },
      caseId: 9,
      revision: 2,
      needsRecheck: true,
      recheckOpen: true,
    });
  });

  it('is usable as the approved source only by an approval decision; never without a decision, never once rejected or revoked', () => {
    expect(toClearance(pair({ caseId: 4, revision: 1, state: 'approved', decidedAt: new Date('2026-10-01T00:00:00Z'), decidedById: 3, decidedByName: 'Tomas Eklund' }))).toMatchObject({
      standing: 'approved',
      since: '2026-10-01T00:00:00.000Z',
      caseId: 4,
      decidedBy: { id: 3 },
    });
    expect(toClearance(pair({}))).toBeNull();
    expect(toClearance(pair({ state: 'revoked', caseId: 4 }))).toBeNull();
    expect(toClearance(pair({ state: 'rejected', caseId: 4 }))).toBeNull();
    expect(toClearance(pair({ openCaseId: 5 }))).toBeNull();
  });
});

describe('search card and order', () => {
  it('reads the card fields in SI and the tolerance as the half-width of the window over nominal (common practice, no source)', () => {
    const v = (value: number) => ({ value, printed: null, provenance: { source: 'entered', datasheetId: null, page: null, text: null, confirmedBy: null, confirmedAt: null } });
    const card = toSearchCard({
      cardVersion: 3,
      fields: JSON.stringify({ vzMin: v(4.85), vzNom: v(5.1), vzMax: v(5.36), izt: v(0.005), tc: { ...v(0.5), unit: 'mV/K', voltsPerKelvin: 0.0005 } }),
    });
    expect(card).toMatchObject({ version: 3, vzNom: 5.1, izt: 0.005, zzt: null, tc: { value: 0.5, unit: 'mV/K' }, tcVoltsPerKelvin: 0.0005 });
    expect(card!.tolerance).toBeCloseTo(0.26 / 5.1, 6);
    expect(toSearchCard({ cardVersion: null, fields: null })).toBeNull();
  });

  it('sorts ranked matches by a field with the score breaking ties, parts without the field last', () => {
    const rows = new Map([
      [1, { mpn: 'B', manufacturer: 'X', package: null, vzNom: 5.1, pdMax: 0.5 }],
      [2, { mpn: 'A10', manufacturer: 'X', package: 'SMA', vzNom: null, pdMax: 1 }],
      [3, { mpn: 'A9', manufacturer: 'X', package: 'SMA', vzNom: 4.7, pdMax: 0.5 }],
    ]);
    const ranked = [{ id: 1, score: 0 }, { id: 2, score: 0.1 }, { id: 3, score: 0.2 }];
    expect(sortMatches(ranked, rows)).toEqual([1, 2, 3]);
    expect(sortMatches(ranked, rows, { field: 'vzNom', desc: false })).toEqual([3, 1, 2]);
    expect(sortMatches(ranked, rows, { field: 'pdMax', desc: true })).toEqual([2, 1, 3]);
    expect(sortMatches(ranked, rows, { field: 'mpn', desc: false })).toEqual([3, 2, 1]);
  });
});
