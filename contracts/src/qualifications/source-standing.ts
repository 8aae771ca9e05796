import type { Role } from '../auth/auth.schema';
import type { SourceRole } from '../parts/source.schema';
import type { CheckId, LimitKind, QualificationCheck } from './evaluation.schema';
import type { WaiverState } from './waiver.schema';
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
export const USABLE_STATES = ['approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver'] as const satisfies readonly QualificationState[];
export type UsableState = (typeof USABLE_STATES)[number];

export function isUsableState(state: QualificationState | null | undefined): state is UsableState {
  return state != null && (USABLE_STATES as readonly string[]).includes(state);
}

/**
 * Decided states that rule a part out for that house part: a second engineer rejected it, or
 * a decision that let it be used was revoked. Designers are told (Find parts), and engineers
 * see it beside a request to qualify the same pair again.
 */
export const RULED_OUT_STATES = ['rejected', 'revoked'] as const satisfies readonly QualificationState[];
export type RuledOutState = (typeof RULED_OUT_STATES)[number];

export function isRuledOutState(state: QualificationState | null | undefined): state is RuledOutState {
  return state != null && (RULED_OUT_STATES as readonly string[]).includes(state);
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

/**
 * The text a list shows beside a standing: the conditions of a clearance with conditions,
 * the reason of a rejection or a revocation; nothing for an approval or a plain clearance,
 * whose decision note is no condition (the case page keeps it).
 */
export function standingConditions(standing: SourceStandingValue, decisionText: string | null, revokeReason: string | null = null): string | null {
  if (standing === 'revoked') return revokeReason;
  if (standing === 'cleared-with-conditions' || standing === 'rejected') return decisionText;
  return null;
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

/** Actions only the case's preparer takes: abandoning the work is theirs; a reviewer sends back or rejects. */
export const PREPARER_ACTIONS: readonly QualificationAction[] = ['withdraw'];

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
  /**
   * For clear with waiver: the checks that fail, are marginal or lack data and no waiver in
   * force covers (`waiverGaps`), and whether any waiver is in force at all. Undefined: not
   * known to the caller, and the action is not offered.
   */
  waivers?: { gaps: readonly CheckId[]; inForce: number };
}

/**
 * Why an action is not open, or null when it is:
 * - `role`: only engineers act on cases;
 * - `state`: the action does not start from the case's state;
 * - `two-person`: the preparer never decides their own case;
 * - `preparer-only`: only the engineer who prepared a case withdraws it (a reviewer sends it
 *   back with a reason, or rejects it);
 * - `stale`: the evaluation is behind the catalogue (submit, approve, clear);
 * - `verdict`: clear needs a pass; approve and clear with conditions anything but a fail
 *   (an approval short of a pass must say in its note how the margin is covered);
 * - `superseded`: a re-check of the case was decided: revoke that one instead;
 * - `recheck-exists`: the case already has a re-check;
 * - `waiver`: clear with waiver needs every failing or marginal check covered by an approved,
 *   unexpired waiver (and at least one such waiver; a clean pass is simply cleared).
 */
export type ActionBlock = 'role' | 'state' | 'two-person' | 'preparer-only' | 'stale' | 'verdict' | 'superseded' | 'recheck-exists' | 'waiver';

export function actionBlock(action: QualificationAction, facts: CaseFacts, actor: { id: number; role: Role }): ActionBlock | null {
  if (!(CASE_ROLES as readonly string[]).includes(actor.role)) return 'role';
  if (!QUALIFICATION_TRANSITIONS[action].from.includes(facts.state)) return 'state';
  if (isDecisionAction(action) && facts.preparedById === actor.id) return 'two-person';
  if (PREPARER_ACTIONS.includes(action) && facts.preparedById !== actor.id) return 'preparer-only';
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
    case 'clear-with-waiver':
      if (!facts.fresh) return 'stale';
      if (!facts.waivers || facts.waivers.inForce === 0 || facts.waivers.gaps.length > 0) return 'waiver';
      return null;
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
export function isEvaluationFresh(
  evaluated: { needsRecheck: boolean; specVersion: number; cardVersion: number },
  current: { specVersion: number | null; cardVersion: number | null },
): boolean {
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

/* ------------------------------------------------------------------------------------------
 * Waivers: a failing or marginal check of one case (one house part, one vendor part) accepted
 * against a stated limit until an expiry date. The same two-person rule as decisions: one
 * engineer prepares, another approves or refuses.
 * ---------------------------------------------------------------------------------------- */

/** Check verdicts a waiver may cover: a no-data check needs data, not a waiver. */
export const WAIVABLE_VERDICTS = ['fail', 'marginal'] as const satisfies readonly QualificationVerdict[];

/** The least a waiver must say for the rule. `expiresOn` is the last day it holds (YYYY-MM-DD). */
export interface WaiverFacts {
  checkId: CheckId;
  state: WaiverState;
  expiresOn: string;
  preparedById: number;
}

/** Today's date (UTC) as `YYYY-MM-DD`, from the clock's instant. */
export function dayOf(now: Date): string {
  return now.toISOString().slice(0, 10);
}

/** A waiver counts when it was approved and its expiry day has not passed. */
export function isWaiverInForce(waiver: Pick<WaiverFacts, 'state' | 'expiresOn'>, today: string): boolean {
  return waiver.state === 'approved' && waiver.expiresOn >= today;
}

/** An approved waiver whose expiry day has passed: the lapse pass ends it (and the standing it carried). */
export function isWaiverDue(waiver: Pick<WaiverFacts, 'state' | 'expiresOn'>, today: string): boolean {
  return waiver.state === 'approved' && waiver.expiresOn < today;
}

/** The checks that are not a pass and no waiver in force covers, in the evaluation's order. */
export function waiverGaps(
  checks: readonly Pick<QualificationCheck, 'id' | 'verdict'>[],
  waivers: readonly Pick<WaiverFacts, 'checkId' | 'state' | 'expiresOn'>[],
  today: string,
): CheckId[] {
  const covered = new Set(waivers.filter((w) => isWaiverInForce(w, today)).map((w) => w.checkId));
  return checks.filter((c) => c.verdict !== 'pass' && !covered.has(c.id)).map((c) => c.id);
}

/** What the rule needs of a case to take a waiver. */
export interface WaiverCaseFacts {
  state: QualificationState;
  checks: readonly Pick<QualificationCheck, 'id' | 'verdict' | 'limitKind' | 'value' | 'quantity'>[];
}

/**
 * Why a waiver step is not open, or null when it is:
 * - `role`: only engineers prepare and decide waivers;
 * - `state`: the case is not open (prepare, approve, refuse) or the waiver is not waiting;
 * - `check`: the check is not in the evaluation, or it is not failing or marginal;
 * - `limit`: the accepted limit does not cover the part's value, or is missing (or given for a text check);
 * - `expiry`: the expiry day is not after today;
 * - `duplicate`: the check already has a waiver waiting or in force on this case;
 * - `two-person`: the preparer never approves or refuses their own waiver.
 */
export type WaiverBlock = 'role' | 'state' | 'check' | 'limit' | 'expiry' | 'duplicate' | 'two-person';

export function prepareWaiverBlock(
  request: { checkId: CheckId; acceptedLimit: number | null; expiresOn: string },
  facts: WaiverCaseFacts & { waivers: readonly Pick<WaiverFacts, 'checkId' | 'state' | 'expiresOn'>[] },
  actor: { role: Role },
  today: string,
): WaiverBlock | null {
  if (!(CASE_ROLES as readonly string[]).includes(actor.role)) return 'role';
  if (!isOpenState(facts.state)) return 'state';
  const check = facts.checks.find((c) => c.id === request.checkId);
  if (!check || !(WAIVABLE_VERDICTS as readonly string[]).includes(check.verdict)) return 'check';
  if (!limitCovers(check, request.acceptedLimit)) return 'limit';
  if (request.expiresOn <= today) return 'expiry';
  if (facts.waivers.some((w) => w.checkId === request.checkId && (w.state === 'proposed' || isWaiverInForce(w, today)))) return 'duplicate';
  return null;
}

/** Whether an accepted limit covers the part's value the check found (a text check takes no limit). */
export function limitCovers(check: { limitKind: LimitKind; value: number | null; quantity: string }, acceptedLimit: number | null): boolean {
  if (check.quantity === 'text' || check.limitKind === 'member') return acceptedLimit === null;
  if (acceptedLimit === null || !Number.isFinite(acceptedLimit)) return false;
  if (check.value === null) return true;
  if (check.limitKind === 'max') return check.value <= acceptedLimit;
  if (check.limitKind === 'min') return check.value >= acceptedLimit;
  // A window check's value is its end nearest the limit; the accepted limit widens that end.
  return true;
}

export function decideWaiverBlock(
  waiver: Pick<WaiverFacts, 'state' | 'preparedById' | 'expiresOn'>,
  caseState: QualificationState,
  actor: { id: number; role: Role },
  today: string,
): WaiverBlock | null {
  if (!(CASE_ROLES as readonly string[]).includes(actor.role)) return 'role';
  if (waiver.state !== 'proposed' || !isOpenState(caseState)) return 'state';
  if (waiver.preparedById === actor.id) return 'two-person';
  if (waiver.expiresOn <= today) return 'expiry';
  return null;
}
