import { describe, expect, it } from 'vitest';
import {
  actionBlock,
  allowedActionsFor,
  decideWaiverBlock,
  isUsableState,
  isWaiverDue,
  isWaiverInForce,
  limitCovers,
  prepareWaiverBlock,
  waiverGaps,
  type CaseFacts,
} from './source-standing';
import { isDecidedState } from './qualification-state.schema';

// The waiver rule beside the case rule: one engineer prepares, another decides; a clearance
// with waiver needs every check that is not a pass covered by an approved, unexpired waiver.
const today = '2027-01-15';
const engineer = { id: 1, role: 'engineer' as const };
const second = { id: 2, role: 'engineer' as const };
const checks = [
  { id: 'zd' as const, verdict: 'fail' as const, limitKind: 'max' as const, value: 40, quantity: 'resistance' as const },
  { id: 'leakage' as const, verdict: 'marginal' as const, limitKind: 'max' as const, value: 1e-6, quantity: 'current' as const },
  { id: 'tc' as const, verdict: 'pass' as const, limitKind: 'window' as const, value: 3e-4, quantity: 'tempCoVoltage' as const },
  { id: 'package' as const, verdict: 'fail' as const, limitKind: 'member' as const, value: null, quantity: 'text' as const },
];

describe('waiver rule', () => {
  it('a waiver holds through its expiry day and is due the day after; only approved ones count', () => {
    expect(isWaiverInForce({ state: 'approved', expiresOn: today }, today)).toBe(true);
    expect(isWaiverInForce({ state: 'approved', expiresOn: '2027-01-14' }, today)).toBe(false);
    expect(isWaiverDue({ state: 'approved', expiresOn: '2027-01-14' }, today)).toBe(true);
    expect(isWaiverDue({ state: 'lapsed', expiresOn: '2027-01-14' }, today)).toBe(false);
    expect(isWaiverInForce({ state: 'proposed', expiresOn: '2027-06-30' }, today)).toBe(false);
    expect(isWaiverInForce({ state: 'refused', expiresOn: '2027-06-30' }, today)).toBe(false);
  });

  it('lists the checks not a pass that no waiver in force covers', () => {
    expect(waiverGaps(checks, [], today)).toEqual(['zd', 'leakage', 'package']);
    expect(
      waiverGaps(
        checks,
        [
          { checkId: 'zd', state: 'approved', expiresOn: '2027-06-30' },
          { checkId: 'leakage', state: 'proposed', expiresOn: '2027-06-30' },
        ],
        today,
      ),
    ).toEqual(['leakage', 'package']);
    expect(waiverGaps(checks, [{ checkId: 'zd', state: 'approved', expiresOn: '2027-01-14' }], today)).toContain('zd');
    expect(waiverGaps([{ id: 'zd', verdict: 'no-data' }], [{ checkId: 'zd', state: 'approved', expiresOn: '2027-06-30' }], today)).toEqual([]);
  });

  it('prepares a waiver only of a failing or marginal check, with a covering limit, a future expiry, once', () => {
    const facts = { state: 'in-review' as const, checks, waivers: [] };
    const ok = { checkId: 'zd' as const, acceptedLimit: 45, expiresOn: '2027-06-30' };
    expect(prepareWaiverBlock(ok, facts, engineer, today)).toBeNull();
    expect(prepareWaiverBlock(ok, facts, { role: 'designer' }, today)).toBe('role');
    expect(prepareWaiverBlock(ok, { ...facts, state: 'cleared' }, engineer, today)).toBe('state');
    expect(prepareWaiverBlock({ ...ok, checkId: 'tc' }, facts, engineer, today)).toBe('check');
    // 40 Ω found: 39 Ω does not cover it (plain comparison)
    expect(prepareWaiverBlock({ ...ok, acceptedLimit: 39 }, facts, engineer, today)).toBe('limit');
    expect(prepareWaiverBlock({ ...ok, expiresOn: today }, facts, engineer, today)).toBe('expiry');
    expect(prepareWaiverBlock(ok, { ...facts, waivers: [{ checkId: 'zd', state: 'proposed', expiresOn: '2027-03-01' }] }, engineer, today)).toBe('duplicate');
    expect(prepareWaiverBlock(ok, { ...facts, waivers: [{ checkId: 'zd', state: 'refused', expiresOn: '2027-03-01' }] }, engineer, today)).toBeNull();
    expect(limitCovers(checks[3], null)).toBe(true);
    expect(limitCovers(checks[3], 1)).toBe(false);
    expect(limitCovers({ limitKind: 'min', value: 0.25, quantity: 'power' }, 0.2)).toBe(true);
    expect(limitCovers({ limitKind: 'min', value: 0.25, quantity: 'power' }, 0.3)).toBe(false);
  });

  it('the preparer never approves or refuses their own waiver (two-person rule)', () => {
    const w = { state: 'proposed' as const, preparedById: 1, expiresOn: '2027-06-30' };
    expect(decideWaiverBlock(w, 'in-review', engineer, today)).toBe('two-person');
    expect(decideWaiverBlock(w, 'in-review', second, today)).toBeNull();
    expect(decideWaiverBlock({ ...w, state: 'approved' }, 'in-review', second, today)).toBe('state');
    expect(decideWaiverBlock(w, 'cleared-with-waiver', second, today)).toBe('state');
  });

  it('clear with waiver needs a waiver in force and no gap; the state is decided and usable until it lapses', () => {
    const base: CaseFacts = { state: 'in-review', preparedById: 1, overall: 'fail', fresh: true, nextId: null };
    expect(actionBlock('clear-with-waiver', base, second)).toBe('waiver');
    expect(actionBlock('clear-with-waiver', { ...base, waivers: { gaps: ['zd'], inForce: 1 } }, second)).toBe('waiver');
    expect(actionBlock('clear-with-waiver', { ...base, waivers: { gaps: [], inForce: 0 } }, second)).toBe('waiver');
    expect(actionBlock('clear-with-waiver', { ...base, waivers: { gaps: [], inForce: 2 } }, second)).toBeNull();
    expect(actionBlock('clear-with-waiver', { ...base, waivers: { gaps: [], inForce: 2 } }, engineer)).toBe('two-person');
    expect(actionBlock('clear-with-waiver', { ...base, fresh: false, waivers: { gaps: [], inForce: 2 } }, second)).toBe('stale');
    expect(isUsableState('cleared-with-waiver')).toBe(true);
    expect(isUsableState('waiver-lapsed')).toBe(false);
    expect(isDecidedState('waiver-lapsed')).toBe(true);
    expect(allowedActionsFor({ ...base, state: 'waiver-lapsed' }, second)).toEqual(['recheck']);
    expect(allowedActionsFor({ ...base, state: 'cleared-with-waiver' }, second)).toEqual(['revoke', 'recheck']);
  });
});
