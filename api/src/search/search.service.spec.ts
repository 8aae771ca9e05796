import { SEARCH_TEXT_CANDIDATES, searchQuerySchema, type SearchQuery } from '@shuntwise/contracts';
import type { CandidateRow, PairRow, PartRow, SearchRepository, TextNarrowing } from './search.repository';
import type { TextIndexRepository } from '../text-index/text-index.repository';
import { SearchService, sortMatches, toClearance, toSearchCard } from './search.service';

const candidate = (id: number, mpn: string): CandidateRow => ({
  id,
  mpn,
  manufacturer: 'Invented Maker',
  package: 'SOD-123',
  vzNom: 2 + id / 1000,
  pdMax: 0.5,
  houseParts: null,
});

/** A repository whose candidate query returns `found` rows (cut to the limit asked), recording the narrowing it was given. */
function fakeRepository(found: number) {
  const calls: Array<TextNarrowing | undefined> = [];
  const rows = (n: number) => Array.from({ length: n }, (_, i) => candidate(i + 1, i === 7 ? 'QHZ5V6A' : `QHX${i}`));
  const repository = {
    candidates: async (_q: SearchQuery, text: TextNarrowing | undefined, limit: number) => {
      calls.push(text);
      return rows(Math.min(found, limit));
    },
    parts: async (ids: number[]): Promise<PartRow[]> =>
      ids.map((id) => ({
        id,
        manufacturer: 'Invented Maker',
        mpn: `P${id}`,
        package: null,
        lifecycleNote: null,
        cardVersion: null,
        fields: null,
        datasheetId: null,
      })),
    pairs: async (): Promise<PairRow[]> => [],
  } as unknown as SearchRepository;
  return { repository, calls };
}

/** An index that scores text of three characters or more (the real one's rule) and records what it was asked. */
function fakeIndex() {
  const asked: string[] = [];
  const index = {
    scoredVendorParts: async (text: string) => {
      asked.push(text);
      return text.replace(/[\s-]/g, '').length >= 3 ? { sql: 'SELECT 1 AS id, 1 AS score', params: [] } : null;
    },
  } as unknown as TextIndexRepository;
  return { index, asked };
}

const query = (raw: Record<string, string>) => searchQuerySchema.parse(raw);

describe('SearchService text narrowing', () => {
  it("hands the index's scored matches to the candidate query and re-ranks them fuzzily", async () => {
    const { repository, calls } = fakeRepository(50);
    const { index, asked } = fakeIndex();
    const page = await new SearchService(repository, index).search(query({ q: 'QZH5V6A' }));
    expect(asked).toEqual(['QZH5V6A']);
    expect(calls).toEqual([{ scored: { sql: expect.any(String), params: [] }, usableApplied: true }]);
    expect(page.text).toEqual({ mode: 'fuzzy', candidates: 50, truncated: false, note: null });
    expect(page.items[0].vendorPart.id).toBe(8);
  });

  it('narrows text too short to index by the start of the names, and says when it had to cut', async () => {
    const short = fakeRepository(10);
    const byPrefix = await new SearchService(short.repository, fakeIndex().index).search(query({ q: 'QH' }));
    expect(short.calls).toEqual([{ tokens: ['QH'] }]);
    expect(byPrefix.text).toMatchObject({ mode: 'prefix', candidates: 10, truncated: false, note: expect.stringMatching(/three characters/) });

    const many = fakeRepository(SEARCH_TEXT_CANDIDATES + 500);
    const cut = await new SearchService(many.repository, fakeIndex().index).search(query({ q: 'QHZ5V6A' }));
    expect(cut.text).toMatchObject({ mode: 'fuzzy', candidates: SEARCH_TEXT_CANDIDATES, truncated: true, note: expect.stringMatching(/Narrow the filters/) });
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
  revokeReason: null,
  revokedAt: null,
  revokedById: null,
  revokedByName: null,
  openCaseId: null,
  ...over,
});

describe('where a pair stands for a designer', () => {
  it('is usable when its latest decision cleared it, with the conditions and the date of that decision', () => {
    const c = toClearance(
      pair({
        caseId: 9,
        revision: 2,
        state: 'cleared-with-conditions',
        decisionText: 'sample 5 per lot',
        decidedAt: new Date('2026-11-02T10:00:00Z'),
        decidedById: 3,
        decidedByName: 'Tomas Eklund',
        needsRecheck: 1,
        openCaseId: 12,
      }),
    );
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
      waivers: [],
    });
  });

  it('a plain clearance or an approval carries no conditions, whatever note its decision had', () => {
    for (const state of ['cleared', 'approved'] as const) {
      expect(
        toClearance(pair({ caseId: 9, revision: 1, state, decisionText: 'checked on rev. C', decidedAt: new Date('2026-11-02T10:00:00Z') }))!.conditions,
      ).toBeNull();
    }
  });

  it('carries the waivers a clearance with waiver rests on, with their expiry', () => {
    const brief = { id: 4, checkId: 'zd' as const, quantity: 'resistance' as const, acceptedLimit: 45, expiresOn: '2027-06-30', state: 'approved' as const };
    const c = toClearance(pair({ caseId: 9, revision: 1, state: 'cleared-with-waiver', decidedAt: new Date('2026-11-02T10:00:00Z') }), new Map([[9, [brief]]]));
    expect(c).toMatchObject({ standing: 'cleared-with-waiver', waivers: [brief] });
    expect(toClearance(pair({ caseId: 9, revision: 1, state: 'waiver-lapsed' }), new Map([[9, [brief]]]))).toBeNull();
  });

  it('is usable as the approved source only by an approval decision; never without a decision, never once rejected or revoked', () => {
    expect(
      toClearance(
        pair({ caseId: 4, revision: 1, state: 'approved', decidedAt: new Date('2026-10-01T00:00:00Z'), decidedById: 3, decidedByName: 'Tomas Eklund' }),
      ),
    ).toMatchObject({
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
  it('reads the card fields in SI and the tolerance as the half-width of the window over nominal, less the print rounding of its ends (common practice, no source)', () => {
    const v = (value: number) => ({
      value,
      printed: null,
      provenance: { source: 'entered', datasheetId: null, page: null, text: null, confirmedBy: null, confirmedAt: null },
    });
    const card = toSearchCard({
      cardVersion: 3,
      fields: JSON.stringify({ vzMin: v(4.85), vzNom: v(5.1), vzMax: v(5.36), izt: v(0.005), tc: { ...v(0.5), unit: 'mV/K', voltsPerKelvin: 0.0005 } }),
    });
    expect(card).toMatchObject({ version: 3, vzNom: 5.1, izt: 0.005, zzt: null, tc: 0.0005 }); // tc as the card stores it in V/K, not converted again
    // 4.85 / 5.36 V are a ±5 % window (4.845…5.355 V) printed to two decimals: 5.355 − 5.1 = 0.255 V = 5 % of 5.1 V.
    expect(card!.tolerance).toBeCloseTo(0.255 / 5.1, 6);
    expect(toSearchCard({ cardVersion: null, fields: null })).toBeNull();
  });

  it('sorts ranked matches by a field with the score breaking ties, parts without the field last', () => {
    const rows = new Map([
      [1, { mpn: 'B', manufacturer: 'X', package: null, vzNom: 5.1, pdMax: 0.5 }],
      [2, { mpn: 'A10', manufacturer: 'X', package: 'SMA', vzNom: null, pdMax: 1 }],
      [3, { mpn: 'A9', manufacturer: 'X', package: 'SMA', vzNom: 4.7, pdMax: 0.5 }],
    ]);
    const ranked = [
      { id: 1, score: 0 },
      { id: 2, score: 0.1 },
      { id: 3, score: 0.2 },
    ];
    expect(sortMatches(ranked, rows)).toEqual([1, 2, 3]);
    expect(sortMatches(ranked, rows, { field: 'vzNom', desc: false })).toEqual([3, 1, 2]);
    expect(sortMatches(ranked, rows, { field: 'pdMax', desc: true })).toEqual([2, 1, 3]);
    expect(sortMatches(ranked, rows, { field: 'mpn', desc: false })).toEqual([3, 2, 1]);
  });
});
