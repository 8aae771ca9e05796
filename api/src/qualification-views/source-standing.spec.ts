import type { PairCaseRow } from './qualification-views.repository';
import { standing } from './qualification-views.service';

// How a source reads for procurement (common practice, no source): a decision counts
// until a newer decision replaces it, and only decisions give a standing: a link alone,
// whatever anyone called it, is not qualified.
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
  it('a source without a case is not qualified', () => {
    expect(standing([]).standing).toBe('not-qualified');
  });

  it('an approval decision makes the approved source, with who and since when', () => {
    const at = new Date('2026-09-01T08:00:00Z');
    const s = standing([row({ id: 5, state: 'approved', decidedAt: at, decidedById: 3, decidedByName: 'Reviewer' })]);
    expect(s).toMatchObject({ standing: 'approved', caseId: 5, since: at.toISOString(), decidedBy: { id: 3 }, openCase: null });
  });

  it('an approved source with a re-check open stays approved and shows the case beside it', () => {
    const s = standing([row({ id: 5, state: 'approved', decidedAt: new Date() }), row({ id: 7, revision: 2, state: 'in-review' })]);
    expect(s).toMatchObject({ standing: 'approved', caseId: 5, openCase: { id: 7, state: 'in-review' } });
  });

  it('shows conditions only for a clearance with conditions (and the reason of a rejection); an approval note is no condition', () => {
    const note = 'Reviewed against rev. C of the datasheet';
    expect(standing([row({ id: 5, state: 'approved', decisionText: note, decidedAt: new Date() })]).conditions).toBeNull();
    expect(standing([row({ id: 5, state: 'cleared', decisionText: note, decidedAt: new Date() })]).conditions).toBeNull();
    expect(standing([row({ id: 5, state: 'cleared-with-conditions', decisionText: 'sample 5 per lot', decidedAt: new Date() })]).conditions).toBe(
      'sample 5 per lot',
    );
    expect(standing([row({ id: 5, state: 'rejected', decisionText: 'leakage too high', decidedAt: new Date() })]).conditions).toBe('leakage too high');
  });

  it('a revocation ends an approval', () => {
    const at = new Date('2026-11-20T10:00:00Z');
    const s = standing([row({ id: 3, state: 'revoked', revokedAt: at, revokeReason: 'process change', revokedById: 4, revokedByName: 'Reviewer' })]);
    expect(s).toMatchObject({ standing: 'revoked', caseId: 3, conditions: 'process change', since: at.toISOString(), decidedBy: { id: 4 } });
  });

  it('an alternate reads its latest decided case, with a newer open one beside it', () => {
    const s = standing([
      row({ id: 1, state: 'cleared', decidedAt: new Date('2026-10-01T00:00:00Z'), decidedById: 2, decidedByName: 'B' }),
      row({ id: 2, revision: 2, state: 'draft' }),
    ]);
    expect(s).toMatchObject({ standing: 'cleared', caseId: 1, openCase: { id: 2, state: 'draft' } });
  });
});
