import type { Role } from '../auth/auth.schema';
import type { SourceRole } from '../parts/source.schema';
import {
  QUALIFICATION_ACTIONS,
  QUALIFICATION_STATES,
  QUALIFICATION_TRANSITIONS,
  isDecidedState,
  isDecisionAction,
  isOpenState,
  type QualificationAction,
  type QualificationState,
  type QualificationVerdict,
} from './qualification-state.schema';

/**
 * Who may stand as a source of a house part, in one place. The API enforces it, the read
 * models (Board, Sources, Compare, search) derive from it and build their SQL state lists
 * from it, and the web's sign-off panel applies it. No route sets a standing: it comes
 * only from decisions on qualification cases, which a second engineer makes (approve,
 * clear, clear with conditions, reject) or any engineer ends (revoke).
 */

/** Decided states in which the vendor part may be used as a source: designers design it in, buyers order it. */
export const USABLE_STATES = ['approved', 'cleared', 'cleared-with-conditions'] as const satisfies readonly QualificationState[];
export type UsableState = (typeof USABLE_STATES)[number];

export function isUsableState(state: QualificationState | null | undefined): state is UsableState {
  return state != null && (USABLE_STATES as readonly string[]).includes(state);
}

/** Where a source stands: the state its cases give it, or `not-qualified` before any case. */
export const SOURCE_STANDINGS = [...QUALIFICATION_STATES, 'not-qualified'] as const;
export type SourceStandingValue = (typeof SOURCE_STANDINGS)[number];

/** The least a case must say for the standing of its source to be read from it. */
export interface StandingCase {
  id: number;
  revision: number;
  state: QualificationState;
}

/**
 * Where a source stands from its cases (any order): the state of its latest decided case
 * (a decision counts until a newer decision replaces it); before any decision, the state
 * of its latest case; with no case, not qualified. `openCase` is a newer case still open
 * beside the decision (a re-check under way).
 */
export function sourceStanding<T extends StandingCase>(cases: readonly T[]): { standing: SourceStandingValue; basis: T | null; openCase: T | null } {
  const ordered = [...cases].sort((a, b) => a.revision - b.revision);
  const latest = ordered.at(-1) ?? null;
  const decided = ordered.reverse().find((c) => isDecidedState(c.state)) ?? null;
  const basis = decided ?? latest;
  const openCase = latest && latest !== basis && isOpenState(latest.state) ? latest : null;
  return { standing: basis ? basis.state : 'not-qualified', basis, openCase };
}

/** Whether a source with this standing may be used (designed in, ordered). */
export function isUsableStanding(standing: SourceStandingValue): boolean {
  return standing !== 'not-qualified' && isUsableState(standing);
}

/** The decided state that makes a part the house part's approved source. */
export const APPROVED_SOURCE_STATE = 'approved' as const satisfies UsableState;

/**
 * A source's role as lists show it, read from its standing: `approved` only when a second
 * engineer's decision made it the approved source; every other linked part is an alternate.
 */
export function sourceRoleOf(standing: SourceStandingValue | null | undefined): SourceRole {
  return standing === APPROVED_SOURCE_STATE ? 'approved' : 'alternate';
}

/** The roles that prepare and decide cases. */
export const CASE_ROLES = ['engineer'] as const satisfies readonly Role[];

/** What a rule needs to know of a case to say whether an action is open to someone. */
export interface CaseFacts {
  state: QualificationState;
  preparedById: number;
  overall: QualificationVerdict;
  /** The evaluation is on the spec and card the catalogue holds now and nothing flagged it. */
  fresh: boolean;
  /** The case that revised this one, if any, and its state (undefined: not known to the caller). */
  nextId: number | null;
  nextState?: QualificationState | null;
}

/**
 * Why an action is not open, or null when it is:
 * - `role`: only engineers act on cases;
 * - `state`: the action does not start from the case's state;
 * - `two-person`: the preparer never decides their own case;
 * - `stale`: the evaluation is behind the catalogue (submit, approve, clear);
 * - `verdict`: clear needs a pass; approve and clear with conditions anything but a fail
 *   (an approval short of a pass must say in its note how the margin is covered);
 * - `superseded`: a re-check of the case was decided: revoke that one instead;
 * - `recheck-exists`: the case already has a re-check.
 */
export type ActionBlock = 'role' | 'state' | 'two-person' | 'stale' | 'verdict' | 'superseded' | 'recheck-exists';

export function actionBlock(action: QualificationAction, facts: CaseFacts, actor: { id: number; role: Role }): ActionBlock | null {
  if (!(CASE_ROLES as readonly string[]).includes(actor.role)) return 'role';
  if (!QUALIFICATION_TRANSITIONS[action].from.includes(facts.state)) return 'state';
  if (isDecisionAction(action) && facts.preparedById === actor.id) return 'two-person';
  switch (action) {
    case 'submit':
      return facts.fresh ? null : 'stale';
    case 'clear':
      if (!facts.fresh) return 'stale';
      return facts.overall === 'pass' ? null : 'verdict';
    case 'approve':
    case 'clear-with-conditions':
      if (!facts.fresh) return 'stale';
      return facts.overall !== 'fail' ? null : 'verdict';
    case 'revoke':
      return facts.nextState != null && isDecidedState(facts.nextState) ? 'superseded' : null;
    case 'recheck':
      return facts.nextId === null ? null : 'recheck-exists';
    default:
      return null;
  }
}

/** Every action open to the actor now, in the order of QUALIFICATION_ACTIONS. */
export function allowedActionsFor(facts: CaseFacts, actor: { id: number; role: Role }): QualificationAction[] {
  return QUALIFICATION_ACTIONS.filter((action) => actionBlock(action, facts, actor) === null);
}

/** Whether an evaluation made on these versions is still current. */
export function isEvaluationFresh(evaluated: { needsRecheck: boolean; specVersion: number; cardVersion: number }, current: { specVersion: number | null; cardVersion: number | null }): boolean {
  return !evaluated.needsRecheck && evaluated.specVersion === current.specVersion && evaluated.cardVersion === current.cardVersion;
}

/**
 * A state list for SQL (`('approved', 'cleared')`), built from the lists above so the
 * read models never spell states by hand. The states are this module's own literals.
 */
export function sqlStateList(states: readonly QualificationState[]): string {
  for (const s of states) if (!/^[a-z-]+$/.test(s)) throw new Error(`not a state: ${s}`);
  return `(${states.map((s) => `'${s}'`).join(', ')})`;
}
