import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  Logger,
  NotFoundException,
  UnprocessableEntityException,
  type OnModuleDestroy,
  type OnModuleInit,
} from '@nestjs/common';
import {
  QUALIFICATION_STATE_LABELS,
  QUALIFICATION_TRANSITIONS,
  QUALIFICATION_VERDICT_LABELS,
  CHECK_LABELS,
  USABLE_STATES,
  decisionRecordPath,
  actionBlock,
  isWaiverInForce,
  waiverGaps,
  type CheckId,
  type CheckQuantity,
  formatNumber,
  formatQuantity,
  allowedActionsFor,
  isDecidedState,
  isDecisionAction,
  isEvaluationFresh,
  isOpenState,
  isUsableState,
  type ActionBlock,
  toEngineeringCard,
  type AuditEntry,
  type CreateQualificationRequest,
  type Evaluation,
  type Page,
  type Qualification as QualificationDto,
  type QualificationAction,
  type QualificationListQuery,
  type QualificationState,
  type QualificationSummary,
  type RecheckReason,
  type UpdateQualificationRequest,
} from '@shuntwise/contracts';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { UnitOfWork } from '../database/unit-of-work';
import { CatalogueEvents, type CatalogueChange } from '../catalogue-events/catalogue-events.service';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { UsersRepository } from '../users/users.repository';
import { StaleConflictException } from '../common/errors/stale-conflict.exception';
import { DESIGN_CAUTION } from '../engineering/caution';
import { HousePartBuyersRepository } from '../house-part-buyers/house-part-buyers.repository';
import { HousePartsRepository } from '../house-parts/house-parts.repository';
import { MailService } from '../mail/mail.service';
import { evaluateCard } from './evaluation/evaluate';
import { DecisionRecordsService } from './records/decision-records.service';
import type { Qualification } from './qualification.model';
import { QualificationsRepository, type CaseRow, type CatalogueBasis } from './qualifications.repository';
import type { QualificationWaiver } from './waiver.model';
import { WaiversService, dateText } from './waivers.service';

/** Bodies of the state changes, as the contracts parse them (all optional fields may be absent). */
export interface ActionBody {
  version?: number;
  reviewerId?: number | null;
  note?: string | null;
  reason?: string | null;
  conditions?: string;
}

type Transition = { toState: QualificationState; fields: Partial<Qualification>; note: string | null };

/** A case just opened (a new one or a re-check), told to whoever subscribed, inside its transaction. */
export interface CaseOpened {
  caseId: number;
  revision: number;
  housePart: { id: number; partNumber: string; description: string };
  vendorPart: { id: number; manufacturer: string; mpn: string };
  by: AuthUser;
}
export type CaseOpenedHandler = (opened: CaseOpened, transaction: Transaction) => Promise<void>;

/**
 * Qualification cases: opening and evaluating them, the two-person decision, revocation,
 * re-checks after catalogue changes, comments and the audit trail. Every change runs in one
 * transaction with its audit entry and its mail; the case row is locked for update, after
 * shared locks on the house part and vendor part (the same order catalogue saves take), so
 * concurrent decisions queue and the second finds the case already decided.
 */
@Injectable()
export class QualificationsService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('Qualifications');
  private unsubscribe?: () => void;
  private readonly openedHandlers = new Set<CaseOpenedHandler>();

  constructor(
    private readonly cases: QualificationsRepository,
    private readonly buyerLinks: HousePartBuyersRepository,
    private readonly users: UsersRepository,
    private readonly houseParts: HousePartsRepository,
    private readonly mail: MailService,
    private readonly events: CatalogueEvents,
    private readonly waivers: WaiversService,
    private readonly records: DecisionRecordsService,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  onModuleInit(): void {
    this.unsubscribe = this.events.subscribe((change, transaction) => this.onCatalogueChange(change, transaction));
  }

  onModuleDestroy(): void {
    this.unsubscribe?.();
  }

  /**
   * For whoever must react to a new case (requests for the pair are taken up). Handlers run
   * in the case's transaction, so the reaction commits with it; subscribe in onModuleInit.
   */
  onCaseOpened(handler: CaseOpenedHandler): () => void {
    this.openedHandlers.add(handler);
    return () => this.openedHandlers.delete(handler);
  }

  async list(query: QualificationListQuery, user: AuthUser): Promise<Page<QualificationSummary>> {
    // Designers see approved and cleared cases only: those are the parts they may design in.
    const { rows, total } = await this.cases.list(query, user.role === 'designer' ? USABLE_STATES : undefined);
    return { items: rows.map(toSummary), total, pageIndex: query.pageIndex, pageSize: query.pageSize };
  }

  async get(id: number, user: AuthUser): Promise<QualificationDto> {
    const row = await this.cases.findRow(id);
    if (!row) throw new NotFoundException(`No qualification case with id ${id}`);
    if (user.role === 'designer' && !isUsableState(row.state)) {
      throw new ForbiddenException(`Case #${id} is ${label(row.state).toLowerCase()}; designers see cleared cases only`);
    }
    const [comments, audit, current, next, waivers] = await Promise.all([
      this.cases.listComments(id),
      this.cases.listEvents(id),
      this.cases.currentVersions(row.housePartId, row.vendorPartId),
      row.nextId !== null ? this.cases.findById(row.nextId) : Promise.resolve(null),
      this.waivers.waiversOf(id),
    ]);
    const today = this.waivers.today();
    return {
      ...toSummary(row),
      summary: row.summary,
      evaluation: row.evaluation,
      current,
      comments: comments.map((c) => ({ id: c.id, at: c.createdAt.toISOString(), by: { id: c.userId, name: c.user?.name ?? '' }, text: c.text })),
      audit: audit.map((e): AuditEntry => ({
        id: e.id,
        at: e.createdAt.toISOString(),
        by: e.user ? { id: e.user.id, name: e.user.name } : null,
        action: e.action,
        fromState: e.fromState,
        toState: e.toState,
        changes: e.changes,
        note: e.note,
      })),
      allowedActions: allowedActions(row, user, current, next?.state ?? null, {
        gaps: waiverGaps(row.evaluation.checks, waivers, today),
        inForce: waivers.filter((w) => isWaiverInForce(w, today)).length,
      }),
      caution: DESIGN_CAUTION,
    };
  }

  /** `POST /qualifications`: opens a case for a house part and vendor part and evaluates it. */
  async create(request: CreateQualificationRequest, user: AuthUser): Promise<QualificationDto> {
    return this.get(await this.open(request, user), user);
  }

  /** Opens the case and answers its id (the seed uses it without reading the case back). */
  async open(request: CreateQualificationRequest, user: AuthUser): Promise<number> {
    let id: number;
    try {
      id = await this.unitOfWork.run(async (transaction) => {
        const basis = await this.basis(request.housePartId, request.vendorPartId, transaction);
        const latest = await this.cases.latestForPair(request.housePartId, request.vendorPartId, transaction);
        const pair = `${basis.vendorPart.manufacturer} ${basis.vendorPart.mpn} for ${basis.housePart.partNumber}`;
        if (latest && isOpenState(latest.state)) {
          throw new ConflictException(`Case #${latest.id} (${pair}) is still ${label(latest.state).toLowerCase()}: continue that one`);
        }
        if (latest && isDecidedState(latest.state)) {
          throw new ConflictException(
            `Case #${latest.id} (${pair}) was decided (${label(latest.state).toLowerCase()}); open a re-check of it (POST /api/qualifications/${latest.id}/recheck)`,
          );
        }
        const notes: string[] = [];
        if (basis.sourceRole === null) {
          await this.houseParts.createSource(
            { housePartId: request.housePartId, vendorPartId: request.vendorPartId, note: 'added when its qualification was opened', addedById: user.id },
            transaction,
          );
          notes.push(`${basis.vendorPart.manufacturer} ${basis.vendorPart.mpn} added to ${basis.housePart.partNumber} as an alternate source`);
        }
        if (latest) notes.push(`follows withdrawn case #${latest.id}`);
        const row = await this.openCase(
          basis,
          { revision: (latest?.revision ?? 0) + 1, previousId: latest?.id ?? null, summary: request.summary ?? '' },
          user,
          notes,
          transaction,
        );
        return row.id;
      });
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new ConflictException('Another case for this source was opened at the same moment; reload to see it');
      throw error;
    }
    return id;
  }

  /** `PATCH /qualifications/:id`: the preparer's notes and the named reviewer, in draft only. */
  async update(id: number, request: UpdateQualificationRequest, user: AuthUser): Promise<QualificationDto> {
    await this.unitOfWork.run(async (transaction) => {
      const row = await this.lockCase(id, transaction);
      checkVersion(row, request.version);
      if (isDecidedState(row.state)) throw immutable(row, 'edited');
      if (row.state !== 'draft')
        throw new ConflictException(
          `Case #${id} is ${label(row.state).toLowerCase()}; only a draft can be edited${row.state === 'in-review' ? ' (send it back to draft first)' : ''}`,
        );
      const changes: AuditEntry['changes'] = [];
      const values: Partial<Qualification> = {};
      if (request.summary !== undefined && request.summary !== row.summary) {
        changes.push({ field: 'summary', from: row.summary, to: request.summary });
        values.summary = request.summary;
      }
      if (request.reviewerId !== undefined && request.reviewerId !== row.reviewerId) {
        if (request.reviewerId !== null) await this.checkReviewer(request.reviewerId, row, transaction);
        changes.push({ field: 'reviewerId', from: row.reviewerId, to: request.reviewerId });
        values.reviewerId = request.reviewerId;
      }
      if (changes.length === 0) return;
      await this.cases.save(row, values, transaction);
      await this.cases.addEvent({ qualificationId: id, userId: user.id, action: 'edited', changes }, transaction);
    });
    return this.get(id, user);
  }

  async comment(id: number, text: string, user: AuthUser): Promise<QualificationDto> {
    await this.unitOfWork.run(async (transaction) => {
      const row = await this.cases.findById(id, transaction);
      if (!row) throw new NotFoundException(`No qualification case with id ${id}`);
      await this.cases.addComment({ qualificationId: id, userId: user.id, text }, transaction);
      await this.cases.addEvent({ qualificationId: id, userId: user.id, action: 'commented', note: excerpt(text) }, transaction);
    });
    return this.get(id, user);
  }

  /** `POST /qualifications/:id/<action>`: one state change, its audit entry and its mail in one transaction. */
  async act(id: number, action: QualificationAction, body: ActionBody, user: AuthUser): Promise<QualificationDto> {
    return this.get(await this.apply(id, action, body, user), user);
  }

  /** The state change of `act`, answering the id of the case it leaves (a re-check's new one); the seed uses it directly. */
  async apply(id: number, action: QualificationAction, body: ActionBody, user: AuthUser): Promise<number> {
    return this.unitOfWork.run(async (transaction) => {
      const peek = await this.cases.findById(id, transaction);
      if (!peek) throw new NotFoundException(`No qualification case with id ${id}`);
      // Catalogue rows first (shared), then the case (exclusive): the order catalogue saves take.
      const basis = await this.basis(peek.housePartId, peek.vendorPartId, transaction);
      const row = await this.lockCase(id, transaction);
      if (action !== 'recheck') checkVersion(row, body.version);
      // The rule (contracts/src/qualifications/source-standing.ts) decides; here it is said plainly.
      const next = action === 'revoke' || action === 'recheck' ? await this.cases.findNext(row.id, transaction) : null;
      const fresh = isEvaluationFresh(row, { specVersion: basis.housePart.specVersion, cardVersion: basis.vendorPart.cardVersion });
      const waived = action === 'clear-with-waiver' ? await this.waivers.factsFor(row, transaction) : undefined;
      const block = actionBlock(
        action,
        {
          state: row.state,
          preparedById: row.preparedById,
          overall: row.overall,
          fresh,
          nextId: next?.id ?? null,
          nextState: next?.state ?? null,
          waivers: waived,
        },
        user,
      );
      if (block) throw refusal(block, action, row, basis, next, waived?.gaps);
      if (action === 'recheck') return (await this.recheck(row, basis, body.note ?? null, user, transaction)).id;
      if (action === 'evaluate') {
        await this.reevaluate(row, basis, user, transaction);
        return row.id;
      }
      const transition = await this.transition(row, action, body, user, transaction);
      const fromState = row.state;
      await this.cases.save(row, { ...transition.fields, state: transition.toState }, transaction);
      await this.cases.addEvent(
        {
          qualificationId: id,
          userId: user.id,
          action: AUDIT_OF[action],
          fromState,
          toState: transition.toState,
          changes: [{ field: 'state', from: fromState, to: transition.toState }, ...auditChanges(action, row, basis)],
          note: transition.note,
        },
        transaction,
      );
      await this.notify(action, row, basis, user, transaction, waived?.waivers);
      // The decision's PDF record: frozen in this transaction, stored after commit (records/decision-records.service.ts).
      if (isDecisionAction(action)) await this.records.capture(row.id, transaction);
      return row.id;
    });
  }

  /** Field values of each plain state change (the rule has allowed it already). */
  private async transition(row: Qualification, action: QualificationAction, body: ActionBody, user: AuthUser, transaction: Transaction): Promise<Transition> {
    const now = new Date();
    if (isDecisionAction(action)) {
      if (action === 'approve' && row.overall !== 'pass' && !body.note) {
        throw new UnprocessableEntityException({
          message: `Case #${row.id} evaluates as ${QUALIFICATION_VERDICT_LABELS[row.overall]} (${row.evaluation.summary}): approving it as the approved source needs a note that says how that is covered`,
          errors: [{ path: 'note', message: 'required when the evaluation is not a pass' }],
        });
      }
      const state = QUALIFICATION_TRANSITIONS[action].to as 'approved' | 'cleared' | 'cleared-with-conditions' | 'cleared-with-waiver' | 'rejected';
      const text =
        action === 'clear' || action === 'approve' || action === 'clear-with-waiver'
          ? (body.note ?? null)
          : action === 'clear-with-conditions'
            ? body.conditions!
            : body.reason!;
      return { toState: state, fields: { decisionState: state, decidedById: user.id, decidedAt: now, decisionText: text || null }, note: text || null };
    }
    switch (action) {
      case 'submit': {
        const reviewerId = body.reviewerId === undefined ? row.reviewerId : body.reviewerId;
        if (reviewerId !== null) await this.checkReviewer(reviewerId, row, transaction);
        return { toState: 'in-review', fields: { submittedAt: now, reviewerId }, note: body.note ?? null };
      }
      case 'send-back':
        return { toState: 'draft', fields: { submittedAt: null }, note: body.reason! };
      case 'withdraw':
        return { toState: 'withdrawn', fields: {}, note: body.reason ?? null };
      case 'revoke':
        return { toState: 'revoked', fields: { revokedById: user.id, revokedAt: now, revokeReason: body.reason! }, note: body.reason! };
      default:
        throw new BadRequestException(`Unknown action ${action}`);
    }
  }

  private async checkReviewer(reviewerId: number, row: Qualification, transaction: Transaction): Promise<void> {
    const reviewer = await this.users.findById(reviewerId, transaction);
    if (!reviewer || !reviewer.active || reviewer.role !== 'engineer') {
      throw new UnprocessableEntityException({
        message: `User ${reviewerId} is not an active engineer and cannot review`,
        errors: [{ path: 'reviewerId', message: 'must be an active engineer' }],
      });
    }
    if (reviewer.id === row.preparedById) {
      throw new UnprocessableEntityException({
        message: 'The preparer cannot review their own case; name another engineer',
        errors: [{ path: 'reviewerId', message: 'must not be the preparer' }],
      });
    }
  }

  private async reevaluate(row: Qualification, basis: CatalogueBasis, user: AuthUser, transaction: Transaction): Promise<void> {
    const evaluation = this.evaluate(basis);
    const changes: AuditEntry['changes'] = [];
    if (row.specVersion !== evaluation.specVersion) changes.push({ field: 'specVersion', from: row.specVersion, to: evaluation.specVersion });
    if (row.cardVersion !== evaluation.cardVersion) changes.push({ field: 'cardVersion', from: row.cardVersion, to: evaluation.cardVersion });
    if (row.overall !== evaluation.overall) changes.push({ field: 'overall', from: row.overall, to: evaluation.overall });
    if (row.needsRecheck) changes.push({ field: 'needsRecheck', from: true, to: false });
    await this.cases.save(
      row,
      {
        evaluation,
        overall: evaluation.overall,
        specVersion: evaluation.specVersion,
        cardVersion: evaluation.cardVersion,
        needsRecheck: false,
        recheckReasons: [],
      },
      transaction,
    );
    await this.cases.addEvent({ qualificationId: row.id, userId: user.id, action: 'evaluated', changes, note: evaluation.summary }, transaction);
  }

  /** A new revision of a decided case, evaluated on the catalogue as it is now; the old case stays as decided. */
  private async recheck(row: Qualification, basis: CatalogueBasis, note: string | null, user: AuthUser, transaction: Transaction): Promise<Qualification> {
    const why = row.recheckReasons.map((r) => r.detail).join('; ');
    const summary = [`Re-check of case #${row.id} (${label(row.state).toLowerCase()})${why ? ` after: ${why}` : ''}.`, note ?? ''].filter(Boolean).join(' ');
    const created = await this.openCase(basis, { revision: row.revision + 1, previousId: row.id, summary }, user, [`re-check of case #${row.id}`], transaction);
    await this.cases.addEvent(
      {
        qualificationId: row.id,
        userId: user.id,
        action: 'recheck-opened',
        changes: [{ field: 'nextId', from: null, to: created.id }],
        note: note ?? `case #${created.id} opened`,
      },
      transaction,
    );
    return created;
  }

  private async openCase(
    basis: CatalogueBasis,
    values: { revision: number; previousId: number | null; summary: string },
    user: AuthUser,
    notes: string[],
    transaction: Transaction,
  ): Promise<Qualification> {
    const evaluation = this.evaluate(basis);
    const row = await this.cases.create(
      {
        housePartId: basis.housePart.id,
        vendorPartId: basis.vendorPart.id,
        revision: values.revision,
        previousId: values.previousId,
        state: 'draft',
        overall: evaluation.overall,
        specVersion: evaluation.specVersion,
        cardVersion: evaluation.cardVersion,
        evaluation,
        summary: values.summary,
        preparedById: user.id,
        needsRecheck: false,
        recheckReasons: [],
      },
      transaction,
    );
    await this.cases.addEvent(
      {
        qualificationId: row.id,
        userId: user.id,
        action: 'opened',
        toState: 'draft',
        changes: [
          { field: 'state', from: null, to: 'draft' },
          { field: 'specVersion', from: null, to: evaluation.specVersion },
          { field: 'cardVersion', from: null, to: evaluation.cardVersion },
          { field: 'overall', from: null, to: evaluation.overall },
        ],
        note: [...notes, evaluation.summary].join('; '),
      },
      transaction,
    );
    const { housePart: hp, vendorPart: vp } = basis;
    for (const handler of this.openedHandlers) {
      await handler(
        {
          caseId: row.id,
          revision: row.revision,
          housePart: { id: hp.id, partNumber: hp.partNumber, description: hp.description },
          vendorPart: { id: vp.id, manufacturer: vp.manufacturer, mpn: vp.mpn },
          by: user,
        },
        transaction,
      );
    }
    return row;
  }

  private evaluate(basis: CatalogueBasis): Evaluation {
    return evaluateCard({
      spec: basis.housePart.spec!,
      specVersion: basis.housePart.specVersion!,
      card: toEngineeringCard(basis.vendorPart.fields),
      cardVersion: basis.vendorPart.cardVersion,
      vendorPackage: basis.vendorPart.package,
    });
  }

  /** The catalogue under shared locks, or the plain refusal when a case cannot be evaluated. */
  private async basis(housePartId: number, vendorPartId: number, transaction: Transaction): Promise<CatalogueBasis> {
    const basis = await this.cases.catalogueBasis(housePartId, vendorPartId, transaction);
    if ('missing' in basis) throw new NotFoundException(`No ${basis.missing} with id ${basis.missing === 'house part' ? housePartId : vendorPartId}`);
    if (!basis.housePart.spec || basis.housePart.specVersion === null) {
      throw new UnprocessableEntityException({
        message: `House part ${basis.housePart.partNumber} has no spec yet: write its spec before qualifying a source`,
        errors: [{ path: 'housePartId', message: 'has no spec' }],
      });
    }
    if (basis.vendorPart.cardVersion === 0) {
      throw new UnprocessableEntityException({
        message: `${basis.vendorPart.manufacturer} ${basis.vendorPart.mpn} has no rating card yet: enter or extract its card first`,
        errors: [{ path: 'vendorPartId', message: 'has no rating card' }],
      });
    }
    return basis;
  }

  private async lockCase(id: number, transaction: Transaction): Promise<Qualification> {
    const row = await this.cases.findById(id, transaction, true);
    if (!row) throw new NotFoundException(`No qualification case with id ${id}`);
    return row;
  }

  /** Mail, written to the outbox in the decision's transaction: buyers on clearance and revocation, reviewers on submission. */
  private async notify(
    action: QualificationAction,
    row: Qualification,
    basis: CatalogueBasis,
    user: AuthUser,
    transaction: Transaction,
    waivers: readonly QualificationWaiver[] = [],
  ): Promise<void> {
    const part = `${basis.vendorPart.manufacturer} ${basis.vendorPart.mpn}`;
    const hp = basis.housePart.partNumber;
    const link = `/qualifications/${row.id}`;
    if (action === 'submit') {
      const to =
        row.reviewerId !== null
          ? [(await this.users.findById(row.reviewerId, transaction))!.email]
          : await this.users.activeEngineerEmails(row.preparedById, transaction);
      if (to.length === 0) return;
      await this.mail.enqueue(
        {
          to,
          kind: 'qualification.review',
          subject: `Waiting for your review: ${part} as a source of ${hp} (case #${row.id})`,
          body: [
            `${user.name} asks for a review of case #${row.id}: ${part} as a second source of ${hp} (${basis.housePart.description}).`,
            `Evaluation: ${QUALIFICATION_VERDICT_LABELS[row.overall]}. ${row.evaluation.summary}.`,
            `Spec version ${row.specVersion}, card version ${row.cardVersion}.`,
            '',
            `Open it in Shuntwise: ${link}`,
          ].join('\n'),
        },
        transaction,
      );
      return;
    }
    if (isDecisionAction(action)) await this.mailPreparer(row, part, hp, link, user, transaction);
    if (action !== 'approve' && action !== 'clear' && action !== 'clear-with-conditions' && action !== 'clear-with-waiver' && action !== 'revoke') return;
    const to = await this.buyerLinks.emailsOf(row.housePartId, transaction);
    if (to.length === 0) {
      this.logger.log(`case ${row.id}: no buyers linked to ${hp}, no mail`);
      return;
    }
    const lines =
      action === 'revoke'
        ? [
            `${user.name} revoked the clearance of ${part} as a source of ${hp} (case #${row.id}).`,
            `Reason: ${row.revokeReason}`,
            'Do not place new orders for it against this house part until it is cleared again.',
          ]
        : [
            action === 'approve'
              ? `${user.name} approved ${part} as the approved source of ${hp} (${basis.housePart.description}) (case #${row.id}).`
              : `${user.name} cleared ${part} as a source of ${hp} (${basis.housePart.description})${action === 'clear-with-conditions' ? ' with conditions' : action === 'clear-with-waiver' ? ' with waiver' : ''} (case #${row.id}).`,
            action === 'clear-with-conditions' ? `Conditions: ${row.decisionText}` : row.decisionText ? `Note: ${row.decisionText}` : '',
            ...waivers.map(
              (w) =>
                `Waived: ${CHECK_LABELS[w.checkId]}, accepted limit ${w.acceptedLimit === null ? 'as stated' : formatCheckValue(w.acceptedLimit, w.quantity)}, until ${dateText(w.expiresOn)} (${w.reason})`,
            ),
            waivers.length ? 'The clearance lapses when a waiver expires.' : '',
            `Prepared by ${await this.userName(row.preparedById, transaction)}; decided on spec version ${row.specVersion} and card version ${row.cardVersion}.`,
          ];
    await this.mail.enqueue(
      {
        to,
        kind: `qualification.${AUDIT_OF[action]}`,
        subject: `${hp}: ${part} ${action === 'revoke' ? 'revoked' : action === 'approve' ? 'approved as the approved source' : action === 'clear' ? 'cleared' : action === 'clear-with-waiver' ? 'cleared with waiver' : 'cleared with conditions'}`,
        body: [
          ...lines.filter(Boolean),
          '',
          `Sources of ${hp}: /sources?housePartId=${row.housePartId}`,
          `Case: ${link}`,
          `Decision record (PDF): ${decisionRecordPath(row.id)}`,
        ].join('\n'),
      },
      transaction,
    );
  }

  /** The engineer who prepared a case hears how it was decided (unless they decided it, or have left). */
  private async mailPreparer(row: Qualification, part: string, hp: string, link: string, user: AuthUser, transaction: Transaction): Promise<void> {
    if (row.preparedById === user.id) return;
    const preparer = await this.users.findById(row.preparedById, transaction);
    if (!preparer?.active) return;
    const outcome = QUALIFICATION_STATE_LABELS[row.state];
    await this.mail.enqueue(
      {
        to: [preparer.email],
        kind: 'qualification.decided',
        subject: `Case #${row.id} decided: ${part} for ${hp}: ${outcome}`,
        body: [
          `${user.name} decided case #${row.id} that you prepared: ${part} as a source of ${hp}.`,
          `Decision: ${outcome}.`,
          row.decisionText
            ? `${row.state === 'cleared-with-conditions' ? 'Conditions' : row.state === 'rejected' ? 'Reason' : 'Note'}: ${row.decisionText}`
            : '',
          '',
          `Open it in Shuntwise: ${link}`,
        ]
          .filter((line, i, all) => line !== '' || all[i - 1] !== '')
          .join('\n'),
      },
      transaction,
    );
  }

  private async userName(id: number, transaction: Transaction): Promise<string> {
    return (await this.users.findById(id, transaction))?.name ?? `user ${id}`;
  }

  /** A catalogue change marks the latest cases it touches: decided ones need a re-check, open ones a new evaluation. */
  async onCatalogueChange(change: CatalogueChange, transaction: Transaction): Promise<void> {
    const at = new Date().toISOString();
    let flagged: number[];
    let reason: RecheckReason;
    if (change.kind === 'card-changed') {
      reason = {
        cause: 'card-changed',
        at,
        detail: `rating card version ${change.version}${change.changedFields.length ? ` (changed: ${change.changedFields.join(', ')})` : ''}`,
      };
      flagged = await this.cases.flagForRecheck({ vendorPartId: change.vendorPartId }, reason, transaction, { cardVersionBelow: change.version });
    } else if (change.kind === 'spec-changed') {
      reason = { cause: 'spec-changed', at, detail: `spec version ${change.version}` };
      flagged = await this.cases.flagForRecheck({ housePartId: change.housePartId }, reason, transaction, { specVersionBelow: change.version });
    } else if (change.kind === 'measurements-added') {
      reason = {
        cause: 'measurements-added',
        at,
        detail: `measurement set #${change.measurementSetId} (${change.samples} sample${change.samples === 1 ? '' : 's'}) added`,
      };
      flagged = await this.cases.flagForRecheck({ vendorPartId: change.vendorPartId }, reason, transaction);
    } else {
      reason = { cause: 'datasheet-revised', at, detail: `datasheet ${change.revision ? `revision ${change.revision} ` : ''}(#${change.datasheetId}) added` };
      flagged = await this.cases.flagForRecheck({ vendorPartId: change.vendorPartId }, reason, transaction);
    }
    for (const qualificationId of flagged) {
      await this.cases.addEvent(
        {
          qualificationId,
          userId: change.userId,
          action: 'flagged-for-recheck',
          changes: [{ field: 'needsRecheck', from: null, to: true }],
          note: reason.detail,
        },
        transaction,
      );
    }
  }
}

const AUDIT_OF: Record<QualificationAction, AuditEntry['action']> = {
  evaluate: 'evaluated',
  submit: 'submitted',
  'send-back': 'sent-back',
  approve: 'approved',
  clear: 'cleared',
  'clear-with-conditions': 'cleared-with-conditions',
  'clear-with-waiver': 'cleared-with-waiver',
  reject: 'rejected',
  withdraw: 'withdrawn',
  revoke: 'revoked',
  recheck: 'recheck-opened',
};

function auditChanges(action: QualificationAction, row: Qualification, basis: CatalogueBasis): AuditEntry['changes'] {
  if (!isDecisionAction(action)) return [];
  // A decision records what it was made on.
  return [
    { field: 'specVersion', from: null, to: basis.housePart.specVersion },
    { field: 'cardVersion', from: null, to: basis.vendorPart.cardVersion },
    { field: 'overall', from: null, to: row.overall },
  ];
}

function checkVersion(row: Qualification, version: number | undefined): void {
  if (version !== undefined && version !== row.version) {
    throw new StaleConflictException(
      `Case #${row.id} changed after you loaded it (you saw version ${version}, it is now ${row.version}); reload and try again`,
      {
        current: { version: row.version },
        errors: [{ path: 'version', message: `current version is ${row.version}` }],
      },
    );
  }
}

function immutable(row: Qualification, doing: string): ConflictException {
  return new ConflictException(`Case #${row.id} is ${label(row.state).toLowerCase()}: a decided case cannot be ${doing}. Open a re-check to revise it.`);
}

function actionWord(action: QualificationAction): string {
  return action === 'evaluate' ? 'evaluated again' : action === 'submit' ? 'sent for review' : action === 'withdraw' ? 'withdrawn' : 'decided again';
}

function label(state: QualificationState): string {
  return QUALIFICATION_STATE_LABELS[state];
}

function excerpt(text: string): string {
  return text.length > 200 ? `${text.slice(0, 197)}…` : text;
}

/** What the caller may do with the case now: the same rule (contracts' actionBlock) the server enforces on each action. */
export function allowedActions(
  row: Pick<CaseRow, 'state' | 'preparedById' | 'overall' | 'needsRecheck' | 'nextId' | 'specVersion' | 'cardVersion'>,
  user: AuthUser,
  current: { specVersion: number | null; cardVersion: number | null },
  nextState: QualificationState | null,
  waivers?: { gaps: readonly CheckId[]; inForce: number },
): QualificationAction[] {
  return allowedActionsFor(
    { state: row.state, preparedById: row.preparedById, overall: row.overall, fresh: isEvaluationFresh(row, current), nextId: row.nextId, nextState, waivers },
    user,
  );
}

/** The refusal of an action the rule blocks, in plain words and with its status. */
function refusal(
  block: ActionBlock,
  action: QualificationAction,
  row: Qualification,
  basis: CatalogueBasis,
  next: Qualification | null,
  gaps: readonly CheckId[] = [],
): Error {
  const doing = action === 'submit' ? 'sending it for review' : action === 'approve' ? 'approving it' : 'clearing it';
  switch (block) {
    case 'role':
      return new ForbiddenException('Only engineers prepare and decide qualification cases');
    case 'state': {
      if (isDecidedState(row.state) && action !== 'revoke' && action !== 'recheck') return immutable(row, actionWord(action));
      const from = QUALIFICATION_TRANSITIONS[action].from;
      return new ConflictException(
        `Case #${row.id} is ${label(row.state).toLowerCase()}; "${QUALIFICATION_TRANSITIONS[action].label}" needs ${from.map((s) => label(s).toLowerCase()).join(' or ')}`,
      );
    }
    case 'two-person':
      return new ForbiddenException(`You prepared case #${row.id}; another engineer must decide it (two-person rule)`);
    case 'preparer-only':
      return new ForbiddenException(`Only the engineer who prepared case #${row.id} can withdraw it; send it back or reject it instead`);
    case 'stale':
      return new ConflictException(
        `Case #${row.id} was evaluated on spec version ${row.specVersion} and card version ${row.cardVersion}; the catalogue is now at spec ${basis.housePart.specVersion ?? '—'} and card ${basis.vendorPart.cardVersion}. ` +
          `Evaluate it again (in draft) before ${doing}.`,
      );
    case 'verdict':
      if (row.overall === 'fail')
        return new UnprocessableEntityException(
          `Case #${row.id} fails (${row.evaluation.summary}): a failing source cannot be ${action === 'approve' ? 'approved' : 'cleared'}; reject it`,
        );
      return new UnprocessableEntityException(
        `Case #${row.id} evaluates as ${QUALIFICATION_VERDICT_LABELS[row.overall]} (${row.evaluation.summary}): clear it with conditions that say how the gap is covered, or reject it`,
      );
    case 'superseded':
      return new ConflictException(`Case #${row.id} was superseded by case #${next!.id} (${label(next!.state).toLowerCase()}); revoke that one`);
    case 'recheck-exists':
      return new ConflictException(`Case #${row.id} already has a re-check: case #${next!.id}`);
    case 'waiver':
      return new UnprocessableEntityException(
        gaps.length > 0
          ? `Case #${row.id} cannot be cleared with waiver: ${gaps.map((g) => `"${CHECK_LABELS[g]}"`).join(', ')} ${gaps.length === 1 ? 'is' : 'are'} not a pass and not covered by an approved, unexpired waiver`
          : `Case #${row.id} has no approved, unexpired waiver: clear it (a pass) or prepare a waiver for each failing or marginal check first`,
      );
  }
}

export function toSummary(row: CaseRow): QualificationSummary {
  const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());
  return {
    id: row.id,
    revision: row.revision,
    previousId: row.previousId,
    nextId: row.nextId,
    housePart: { id: row.housePartId, partNumber: row.partNumber, description: row.housePartDescription },
    vendorPart: { id: row.vendorPartId, manufacturer: row.manufacturer, mpn: row.mpn, package: row.package },
    sourceRole: row.sourceRole,
    state: row.state,
    overall: row.overall,
    specVersion: row.specVersion,
    cardVersion: row.cardVersion,
    preparedBy: { id: row.preparedById, name: row.preparedByName },
    reviewer: row.reviewerId !== null ? { id: row.reviewerId, name: row.reviewerName ?? '' } : null,
    submittedAt: iso(row.submittedAt),
    decision:
      row.decisionState !== null && row.decidedById !== null && row.decidedAt !== null
        ? {
            state: row.decisionState,
            by: { id: row.decidedById, name: row.decidedByName ?? '' },
            at: iso(row.decidedAt)!,
            specVersion: row.specVersion,
            cardVersion: row.cardVersion,
            text: row.decisionText,
          }
        : null,
    revocation:
      row.revokedById !== null && row.revokedAt !== null
        ? { by: { id: row.revokedById, name: row.revokedByName ?? '' }, at: iso(row.revokedAt)!, reason: row.revokeReason ?? '' }
        : null,
    needsRecheck: row.needsRecheck,
    recheckReasons: row.recheckReasons,
    version: row.version,
    createdAt: iso(row.createdAt)!,
    updatedAt: iso(row.updatedAt)!,
  };
}

/** A check's value in its unit (SI prefixes), as the evaluation shows it. */
function formatCheckValue(value: number, quantity: CheckQuantity): string {
  if (quantity === 'ratio') return formatNumber(value, 4, { trim: true });
  if (quantity === 'text') return String(value);
  return formatQuantity(value, quantity);
}
