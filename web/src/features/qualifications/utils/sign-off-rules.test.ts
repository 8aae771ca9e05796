import { describe, expect, it } from 'vitest';
import { QUALIFICATION_ACTIONS, QUALIFICATION_STATES, QUALIFICATION_VERDICTS, allowedActionsFor, type Qualification, type Role } from '@shuntwise/contracts';
import { caseFixture } from '../testing/case-fixture';
import { mayOffer, offeredActions } from './sign-off-rules';

// The panel's rule is the server's rule (actionBlock in contracts): these check the cases
// that matter for the two-person rule, then that the two agree on generated cases.
const PREPARER = { id: 2, role: 'engineer' as Role };
const SECOND = { id: 3, role: 'engineer' as Role };
const everything = [...QUALIFICATION_ACTIONS];

describe('sign-off rules', () => {
  it('offers the approval to a second engineer on a passing case in review, never to the preparer or another role', () => {
    const q = caseFixture({ state: 'in-review', overall: 'pass', allowedActions: everything });
    expect(offeredActions(q, SECOND)).toContain('approve');
    expect(offeredActions(q, PREPARER)).not.toContain('approve');
    for (const role of ['admin', 'designer', 'buyer'] as Role[]) expect(offeredActions(q, { id: 9, role })).toEqual([]);
  });

  it('offers no approval of a failing case, nor on an evaluation the catalogue moved past', () => {
    expect(mayOffer('approve', caseFixture({ state: 'in-review', overall: 'fail' }), SECOND)).toBe(false);
    expect(mayOffer('approve', caseFixture({ state: 'in-review', overall: 'marginal' }), SECOND)).toBe(true);
    const stale = caseFixture({ state: 'in-review', overall: 'pass', current: { specVersion: 2, cardVersion: 1 } });
    expect(mayOffer('approve', stale, SECOND)).toBe(false);
    expect(mayOffer('reject', stale, SECOND)).toBe(true);
  });

  it('never shows what the server did not allow', () => {
    const q = caseFixture({ state: 'in-review', overall: 'pass', allowedActions: ['reject'] });
    expect(offeredActions(q, SECOND)).toEqual(['reject']);
  });

  it('agrees with the server’s list on generated cases (seed printed for replay)', () => {
    const seed = Number(process.env.RULE_SEED ?? Date.now() % 1_000_000);
    console.log(`sign-off rules: seed ${seed} (RULE_SEED=${seed} replays it)`);
    let x = seed || 1;
    const next = (n: number) => {
      x = (x * 48271) % 2147483647;
      return x % n;
    };
    for (let i = 0; i < 500; i++) {
      const state = QUALIFICATION_STATES[next(QUALIFICATION_STATES.length)];
      const overall = QUALIFICATION_VERDICTS[next(QUALIFICATION_VERDICTS.length)];
      const preparedBy = { id: 1 + next(3), name: 'someone' };
      const viewer = { id: 1 + next(3), role: (['engineer', 'engineer', 'admin', 'designer', 'buyer'] as Role[])[next(5)] };
      const nextId = next(2) ? null : 99;
      const fresh = next(3) > 0;
      const q: Qualification = caseFixture({ state, overall, preparedBy, nextId, needsRecheck: !fresh });
      const server = allowedActionsFor({ state, preparedById: preparedBy.id, overall, fresh, nextId, nextState: null }, viewer);
      expect(offeredActions({ ...q, allowedActions: server }, viewer).sort()).toEqual([...server].sort());
      for (const action of QUALIFICATION_ACTIONS) if (!server.includes(action) && action !== 'revoke') expect(mayOffer(action, q, viewer)).toBe(false);
    }
  });
});
