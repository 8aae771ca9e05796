import { z } from 'zod';

/**
 * A qualification case's life, in our own plain words. Open cases can still change;
 * decided cases are fixed (only an approved or cleared one can later be revoked); a
 * withdrawn case was abandoned before any decision. `approved` is the decision that makes
 * the vendor part the house part's approved source (the reference part); `cleared` makes
 * it a usable alternate. `cleared-with-waiver` clears it while failing or marginal checks are
 * covered by approved waivers (each with an expiry); when one expires the case goes to
 * `waiver-lapsed` (decided, not usable) and needs a re-check. Which states let a part be used, and where a source stands, is
 * in ./source-standing.ts.
 */
export const QUALIFICATION_STATES = [
  'draft',
  'in-review',
  'approved',
  'cleared',
  'cleared-with-conditions',
  'cleared-with-waiver',
  'rejected',
  'withdrawn',
  'revoked',
  'waiver-lapsed',
] as const;
export const qualificationStateSchema = z.enum(QUALIFICATION_STATES);
export type QualificationState = z.infer<typeof qualificationStateSchema>;

export const QUALIFICATION_STATE_LABELS: Record<QualificationState, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  approved: 'Approved source',
  cleared: 'Cleared',
  'cleared-with-conditions': 'Cleared with conditions',
  'cleared-with-waiver': 'Cleared with waiver',
  rejected: 'Rejected',
  withdrawn: 'Withdrawn',
  revoked: 'Revoked',
  'waiver-lapsed': 'Waiver lapsed',
};

/** States in which the case may still be edited, evaluated again or decided. */
export const OPEN_STATES = ['draft', 'in-review'] as const satisfies readonly QualificationState[];
/** States reached by a second engineer's decision (revoked included: it ends an approval or clearance). */
export const DECIDED_STATES = [
  'approved',
  'cleared',
  'cleared-with-conditions',
  'cleared-with-waiver',
  'rejected',
  'revoked',
  'waiver-lapsed',
] as const satisfies readonly QualificationState[];

export function isOpenState(state: QualificationState): boolean {
  return (OPEN_STATES as readonly string[]).includes(state);
}
export function isDecidedState(state: QualificationState): boolean {
  return (DECIDED_STATES as readonly string[]).includes(state);
}

/**
 * State changes, each `POST /api/qualifications/:id/<action>`. `to: null` means the
 * action leaves the state as it is (evaluate) or opens a new revision (recheck).
 */
export const QUALIFICATION_ACTIONS = [
  'evaluate',
  'submit',
  'send-back',
  'approve',
  'clear',
  'clear-with-conditions',
  'clear-with-waiver',
  'reject',
  'withdraw',
  'revoke',
  'recheck',
] as const;
export const qualificationActionSchema = z.enum(QUALIFICATION_ACTIONS);
export type QualificationAction = z.infer<typeof qualificationActionSchema>;

export const QUALIFICATION_TRANSITIONS: Record<QualificationAction, { from: readonly QualificationState[]; to: QualificationState | null; label: string }> = {
  evaluate: { from: ['draft'], to: null, label: 'Evaluate again' },
  submit: { from: ['draft'], to: 'in-review', label: 'Send for review' },
  'send-back': { from: ['in-review'], to: 'draft', label: 'Send back to draft' },
  approve: { from: ['in-review'], to: 'approved', label: 'Approve as approved source' },
  clear: { from: ['in-review'], to: 'cleared', label: 'Clear' },
  'clear-with-conditions': { from: ['in-review'], to: 'cleared-with-conditions', label: 'Clear with conditions' },
  'clear-with-waiver': { from: ['in-review'], to: 'cleared-with-waiver', label: 'Clear with waiver' },
  reject: { from: ['in-review'], to: 'rejected', label: 'Reject' },
  withdraw: { from: ['draft', 'in-review'], to: 'withdrawn', label: 'Withdraw' },
  revoke: { from: ['approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver'], to: 'revoked', label: 'Revoke' },
  recheck: {
    from: ['approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver', 'rejected', 'revoked', 'waiver-lapsed'],
    to: null,
    label: 'Open a re-check',
  },
};

/** The decisions a second engineer makes; the preparer of a case may make none of them. */
export const DECISION_ACTIONS = ['approve', 'clear', 'clear-with-conditions', 'clear-with-waiver', 'reject'] as const satisfies readonly QualificationAction[];
export type DecisionAction = (typeof DECISION_ACTIONS)[number];
export function isDecisionAction(action: QualificationAction): action is DecisionAction {
  return (DECISION_ACTIONS as readonly string[]).includes(action);
}

/** Verdict of one check and of the whole evaluation. */
export const QUALIFICATION_VERDICTS = ['pass', 'marginal', 'fail', 'no-data'] as const;
export const qualificationVerdictSchema = z.enum(QUALIFICATION_VERDICTS);
export type QualificationVerdict = z.infer<typeof qualificationVerdictSchema>;

export const QUALIFICATION_VERDICT_LABELS: Record<QualificationVerdict, string> = {
  pass: 'pass',
  marginal: 'marginal',
  fail: 'fail',
  'no-data': 'no data',
};
