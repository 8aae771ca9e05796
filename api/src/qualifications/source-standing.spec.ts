import type { PairCaseRow } from './qualifications.repository';
import { standing } from './qualification-views.service';

// How a source reads for procurement (common practice, no source): a decision counts
// until a newer decision replaces it; the house part's approved source is the reference
// the spec was written from and stands as approved until a decision says otherwise.
const row = (over: Partial<PairCaseRow>): PairCaseRow => ({
  id: 1,
  housePartId: 1,
  vendorPartId: 1,
  revision: 1,
  state: 'draft',
  overall: 'pass',
  decisionText: null,
  decidedAt: null,
  decidedById: null,
  decidedByName: null,
  revokedAt: null,
  revokedById: null,
  revokedByName: null,
  revokeReason: null,
  needsRecheck: 0,
  ...over,
});

describe('source standing', () => {
  it('an alternate without a case is not qualified; the approved source is approved', () => {
    expect(standing([], 'alternate').standing).toBe('not-qualified');
    expect(standing([], 'approved').standing).toBe('approved');
  });

  it('an approved source with an open case stays approved and shows the case beside it', () => {
    const s = standing([row({ id: 7, state: 'in-review' })], 'approved');
    expect(s).toMatchObject({ standing: 'approved', caseId: null, openCase: { id: 7, state: 'in-review' } });
  });

  it('a decision on the approved source wins over its role', () => {
    const at = new Date('2026-11-20T10:00:00Z');
    const s = standing([row({ id: 3, state: 'revoked', revokedAt: at, revokeReason: 'process change', revokedById: 4, revokedByName: 'Reviewer' })], 'approved');
    expect(s).toMatchObject({ standing: 'revoked', caseId: 3, conditions: 'process change', since: at.toISOString(), decidedBy: { id: 4 } });
  });

  it('an alternate reads its latest decided case, with a newer open one beside it', () => {
    const s = standing(
      [row({ id: 1, state: 'cleared', decidedAt: new Date('2026-10-01T00:00:00Z'), decidedById: 2, decidedByName: 'B' }), row({ id: 2, revision: 2, state: 'draft' })],
      'alternate',
    );
    expect(s).toMatchObject({ standing: 'cleared', caseId: 1, openCase: { id: 2, state: 'draft' } });
  });
});
