import { QUALIFICATION_VERDICT_LABELS, actionBlock, isEvaluationFresh, type Qualification, type QualificationAction, type Role } from '@shuntwise/contracts';

export interface Viewer {
  id: number;
  role: Role;
}

/** The order the panel offers actions in: the decision first, then the way out. */
const ORDER: readonly QualificationAction[] = [
  'submit',
  'evaluate',
  'approve',
  'clear',
  'clear-with-conditions',
  'clear-with-waiver',
  'reject',
  'send-back',
  'withdraw',
  'revoke',
  'recheck',
];

/** True when the evaluation is on the spec and card the catalogue holds now, and nothing flagged it. */
export function isEvaluationCurrent(q: Pick<Qualification, 'needsRecheck' | 'specVersion' | 'cardVersion' | 'current'>): boolean {
  return isEvaluationFresh(q, q.current);
}

type OfferFacts = Pick<Qualification, 'state' | 'preparedBy' | 'overall' | 'nextId'> &
  Partial<Pick<Qualification, 'needsRecheck' | 'specVersion' | 'cardVersion' | 'current'>>;

/**
 * The same rule the server enforces (actionBlock in contracts/qualifications/source-standing.ts):
 * only engineers act, only from the states an action starts in, the preparer never decides
 * their own case, stale evaluations and verdicts rule out what they rule out. The server's
 * list is applied too; this keeps a button from being offered at all.
 */
export function mayOffer(action: QualificationAction, q: OfferFacts, viewer: Viewer, waivers?: { gaps: readonly never[]; inForce: number }): boolean {
  const fresh =
    q.current && q.specVersion !== undefined && q.cardVersion !== undefined
      ? isEvaluationFresh({ needsRecheck: q.needsRecheck ?? false, specVersion: q.specVersion, cardVersion: q.cardVersion }, q.current)
      : true;
  // The state of a newer revision is the server's to know: its list decides revoke.
  return (
    actionBlock(
      action,
      { state: q.state, preparedById: q.preparedBy.id, overall: q.overall, fresh, nextId: q.nextId, nextState: undefined, waivers },
      viewer,
    ) === null
  );
}

/** The actions to show as buttons: what the server allows now, within the same rule, in a fixed order. */
export function offeredActions(q: OfferFacts & Pick<Qualification, 'allowedActions'>, viewer: Viewer): QualificationAction[] {
  // Which waivers are in force is the server's to know (it keeps them and the date): when it lists
  // clear-with-waiver, every failing check is covered; the rest of the rule still applies here.
  const waivers = q.allowedActions.includes('clear-with-waiver') ? { gaps: [] as never[], inForce: 1 } : undefined;
  return ORDER.filter((a) => q.allowedActions.includes(a) && mayOffer(a, q, viewer, waivers));
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
    notes.push('Only engineers prepare, discuss and decide cases; you can read this one.');
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
        notes.push(
          'The catalogue changed since this evaluation: send it back to draft to evaluate it again before it can be cleared. Rejecting stays possible.',
        );
      } else if (q.overall === 'fail') {
        notes.push('The evaluation fails: a failing source cannot be cleared. Reject it or send it back.');
      } else if (q.overall !== 'pass') {
        notes.push(
          `The evaluation is ${QUALIFICATION_VERDICT_LABELS[q.overall]}: it can be cleared only with written conditions that say how the gap is covered, or rejected.`,
        );
      }
      break;
    case 'approved':
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
