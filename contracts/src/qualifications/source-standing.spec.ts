import { describe, expect, it } from 'vitest';
import { DECIDED_STATES, OPEN_STATES, QUALIFICATION_TRANSITIONS } from './qualification-state.schema';
import { USABLE_STATES, actionBlock, sourceRoleOf, sourceStanding, sqlStateList, standingConditions } from './source-standing';
import { addSourceRequestSchema, updateSourceRequestSchema } from '../parts/source.schema';

// The standing rule (common practice, no source): only decisions give a standing, the
// latest decision counts, and the one who prepared a case never decides it.
describe('source standing', () => {
  it('lists show conditions only for a clearance with conditions, and the reason of a rejection or revocation', () => {
    expect(standingConditions('cleared-with-conditions', 'sample 5 per lot')).toBe('sample 5 per lot');
    expect(standingConditions('approved', 'note')).toBeNull();
    expect(standingConditions('cleared', 'note')).toBeNull();
    expect(standingConditions('cleared-with-waiver', 'note')).toBeNull();
    expect(standingConditions('rejected', 'too leaky')).toBe('too leaky');
    expect(standingConditions('revoked', 'old text', 'process change')).toBe('process change');
    expect(standingConditions('not-qualified', null)).toBeNull();
  });

  it('usable states are decided ones, and only the approved state makes the approved source', () => {
    for (const s of USABLE_STATES) expect(DECIDED_STATES).toContain(s);
    expect(USABLE_STATES.filter((s) => (OPEN_STATES as readonly string[]).includes(s))).toEqual([]);
    expect(sourceRoleOf('approved')).toBe('approved');
    for (const s of ['cleared', 'not-qualified', 'revoked', 'in-review'] as const) expect(sourceRoleOf(s)).toBe('alternate');
    expect(QUALIFICATION_TRANSITIONS.approve).toMatchObject({ from: ['in-review'], to: 'approved' });
  });

  it('reads the latest decision whatever order the cases come in, with a newer open case beside it', () => {
    const cases = [
      { id: 3, revision: 3, state: 'draft' as const },
      { id: 1, revision: 1, state: 'approved' as const },
      { id: 2, revision: 2, state: 'revoked' as const },
    ];
    expect(sourceStanding(cases)).toMatchObject({ standing: 'revoked', basis: { id: 2 }, openCase: { id: 3 } });
    expect(sourceStanding([])).toMatchObject({ standing: 'not-qualified', basis: null, openCase: null });
    expect(sourceStanding([{ id: 4, revision: 1, state: 'withdrawn' }]).standing).toBe('withdrawn');
  });

  it('keeps decisions from the preparer and from every role but engineers', () => {
    const facts = { state: 'in-review' as const, preparedById: 1, overall: 'pass' as const, fresh: true, nextId: null };
    expect(actionBlock('approve', facts, { id: 1, role: 'engineer' })).toBe('two-person');
    expect(actionBlock('approve', facts, { id: 2, role: 'engineer' })).toBeNull();
    expect(actionBlock('approve', facts, { id: 2, role: 'admin' })).toBe('role');
    expect(actionBlock('approve', { ...facts, overall: 'fail' }, { id: 2, role: 'engineer' })).toBe('verdict');
    expect(actionBlock('approve', { ...facts, fresh: false }, { id: 2, role: 'engineer' })).toBe('stale');
  });

  it('lets only the preparer withdraw a case; a reviewer sends it back or rejects it', () => {
    for (const state of ['draft', 'in-review'] as const) {
      const facts = { state, preparedById: 1, overall: 'pass' as const, fresh: true, nextId: null };
      expect(actionBlock('withdraw', facts, { id: 1, role: 'engineer' })).toBeNull();
      expect(actionBlock('withdraw', facts, { id: 2, role: 'engineer' })).toBe('preparer-only');
    }
    const review = { state: 'in-review' as const, preparedById: 1, overall: 'pass' as const, fresh: true, nextId: null };
    expect(actionBlock('send-back', review, { id: 2, role: 'engineer' })).toBeNull();
    expect(actionBlock('reject', review, { id: 2, role: 'engineer' })).toBeNull();
  });

  it('writes SQL state lists from the lists, and refuses anything that is not a state', () => {
    expect(sqlStateList(USABLE_STATES)).toBe("('approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver')");
    expect(() => sqlStateList(["cleared') OR ('1" as never])).toThrow(/not a state/);
  });

  it('lets no source request set a standing, and names the field', () => {
    const post = addSourceRequestSchema.safeParse({ vendorPartId: 3, role: 'approved' });
    expect(post.success).toBe(false);
    expect(post.error!.issues.map((i) => i.path.join('.'))).toEqual(['role']);
    expect(addSourceRequestSchema.safeParse({ vendorPartId: 3, role: 'alternate' }).success).toBe(true);
    for (const role of ['approved', 'alternate']) {
      const patch = updateSourceRequestSchema.safeParse({ role });
      expect(patch.success).toBe(false);
      expect(patch.error!.issues[0]).toMatchObject({ path: ['role'], message: expect.stringMatching(/second engineer's decision/) });
    }
  });
});
