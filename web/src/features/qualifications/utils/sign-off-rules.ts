import {
  DECISION_ACTIONS,
  QUALIFICATION_TRANSITIONS,
  QUALIFICATION_VERDICT_LABELS,
  type Qualification,
  type QualificationAction,
  type Role,
} from '@shuntwise/contracts';

export interface Viewer {
  id: number;
  role: Role;
}

/** The order the panel offers actions in: the decision first, then the way out. */
const ORDER: readonly QualificationAction[] = ['submit', 'evaluate', 'clear', 'clear-with-conditions', 'reject', 'send-back', 'withdraw', 'revoke', 'recheck'];

function isDecision(action: QualificationAction): boolean {
  return (DECISION_ACTIONS as readonly string[]).includes(action);
}

/** True when the evaluation is on the spec and card the catalogue holds now, and nothing flagged it. */
export function isEvaluationCurrent(q: Pick<Qualification, 'needsRecheck' | 'specVersion' | 'cardVersion' | 'current'>): boolean {
  return !q.needsRecheck && q.specVersion === q.current.specVersion && q.cardVersion === q.current.cardVersion;
}

/**
 * The rules the panel applies on top of the server's list: only engineers act, only from
 * the states an action starts in, and the preparer never decides their own case. The
 * server refuses the same (403/409); this keeps a button from being offered at all.
 */
export function mayOffer(action: QualificationAction, q: Pick<Qualification, 'state' | 'preparedBy'>, viewer: Viewer): boolean {
  if (viewer.role !== 'engineer') return false;
  if (!QUALIFICATION_TRANSITIONS[action].from.includes(q.state)) return false;
  if (isDecision(action) && q.preparedBy.id === viewer.id) return false;
  return true;
}

/** The actions to show as buttons: what the server allows now, within the panel's own rules, in a fixed order. */
export function offeredActions(q: Pick<Qualification, 'state' | 'preparedBy' | 'allowedActions'>, viewer: Viewer): QualificationAction[] {
  return ORDER.filter((a) => q.allowedActions.includes(a) && mayOffer(a, q, viewer));
}

/**
 * Plain sentences saying why an expected action is missing, shown before anyone tries:
 * the two-person rule, an out-of-date evaluation, a verdict that rules out a plain clearance.
 */
export function signOffNotes(q: Qualification, viewer: Viewer): string[] {
  const notes: string[] = [];
  const mine = q.preparedBy.id === viewer.id;
  const current = isEvaluationCurrent(q);
  if (viewer.role !== 'engineer') {
    notes.push(`Only engineers prepare and decide cases; you can read this one${viewer.role === 'admin' ? ' and comment on it' : ''}.`);
    return notes;
  }
  switch (q.state) {
    case 'draft':
      if (!current) notes.push('The catalogue changed since this evaluation: evaluate it again before sending it for review.');
      if (mine) notes.push('Another engineer decides it once it is in review: you cannot clear a case you prepared (two-person rule).');
      break;
    case 'in-review':
      if (mine) {
        notes.push(`You prepared this case, so another engineer must decide it (two-person rule). You can still send it back to draft or withdraw it.`);
        break;
      }
      if (!current) {
        notes.push('The catalogue changed since this evaluation: send it back to draft to evaluate it again before it can be cleared. Rejecting stays possible.');
      } else if (q.overall === 'fail') {
        notes.push('The evaluation fails: a failing source cannot be cleared. Reject it or send it back.');
      } else if (q.overall !== 'pass') {
        notes.push(
          `The evaluation is ${QUALIFICATION_VERDICT_LABELS[q.overall]}: it can be cleared only with written conditions that say how the gap is covered, or rejected.`,
        );
      }
      break;
    case 'cleared':
    case 'cleared-with-conditions':
    case 'rejected':
    case 'revoked':
      notes.push(
        q.nextId !== null
          ? `Decided cases are fixed. This one was re-checked in case #${q.nextId}.`
          : 'Decided cases are fixed. To revise it, open a re-check: a new revision evaluated on the catalogue as it is now.',
      );
      break;
    case 'withdrawn':
      notes.push('This case was withdrawn before a decision. Open a new case for the source from the Board when it is ready.');
      break;
  }
  return notes;
}
