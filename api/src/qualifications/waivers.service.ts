import {
  ConflictException,
  ForbiddenException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  UnprocessableEntityException,
  type OnModuleDestroy,
  type OnModuleInit,
} from '@nestjs/common';
import {
  CHECK_LABELS,
  QUALIFICATION_STATE_LABELS,
  dayOf,
  decideWaiverBlock,
  isWaiverDue,
  isWaiverInForce,
  prepareWaiverBlock,
  waiverGaps,
  type ApproveWaiverRequest,
  type CheckId,
  type CreateWaiverRequest,
  type RecheckReason,
  type RefuseWaiverRequest,
  type Waiver,
  type WaiverBlock,
  type WaiverBrief,
} from '@shuntwise/contracts';
import type { Transaction } from 'sequelize';
import { Clock } from '../common/clock';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, publicUrl, type Env } from '../config/env';
import { UnitOfWork } from '../database/unit-of-work';
import { HousePartBuyersRepository } from '../house-part-buyers/house-part-buyers.repository';
import { HousePartsRepository } from '../house-parts/house-parts.repository';
import { MailService } from '../mail/mail.service';
import { UsersRepository } from '../users/users.repository';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';
import type { Qualification } from './qualification.model';
import { QualificationsRepository } from './qualifications.repository';
import type { QualificationWaiver } from './waiver.model';
import { WaiversRepository, type WaiverRow } from './waivers.repository';

/** How often each process runs the lapse pass (every replica does; the case lock makes it happen once). */
const LAPSE_EVERY_MS = 60_000;

/**
 * Waivers of failing or marginal checks: prepared by one engineer, approved or refused by
 * another, each step audited on its case. The lapse pass ends approved waivers past their
 * expiry day: the case cleared on them becomes `waiver-lapsed` (not usable), is flagged for
 * a re-check and buyers and the preparer are mailed, all in one transaction per waiver
 * under the case's row lock, so replicas running the pass together do it once.
 */
@Injectable()
export class WaiversService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('Waivers');
  private timer?: NodeJS.Timeout;

  constructor(
    private readonly waivers: WaiversRepository,
    private readonly cases: QualificationsRepository,
    private readonly buyerLinks: HousePartBuyersRepository,
    private readonly users: UsersRepository,
    private readonly houseParts: HousePartsRepository,
    private readonly vendorParts: VendorPartsRepository,
    private readonly mail: MailService,
    private readonly clock: Clock,
    @Inject(ENV) private readonly env: Env,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  /** The day of this process's last finished lapse pass (lapseBeforeRead). */
  private lapsedThrough: string | null = null;

  onModuleInit(): void {
    this.timer = setInterval(() => void this.lapseDue().catch((error: unknown) => this.logger.warn(`lapse pass failed: ${String(error)}`)), LAPSE_EVERY_MS);
    this.timer.unref();
  }

  onModuleDestroy(): void {
    if (this.timer) clearInterval(this.timer);
  }

  today(): string {
    return dayOf(this.clock.now());
  }

  /** A case's waivers, oldest first (the decision record lists them too). */
  async waiversOf(qualificationId: number, transaction?: Transaction): Promise<Waiver[]> {
    const rows = await this.waivers.rowsOf(qualificationId, transaction);
    return rows.map(toWaiver);
  }

  async list(qualificationId: number): Promise<{ items: Waiver[] }> {
    if (!(await this.cases.findById(qualificationId))) throw new NotFoundException(`No qualification case with id ${qualificationId}`);
    return { items: await this.waiversOf(qualificationId) };
  }

  /** Approved and lapsed waivers of these cases, for the lists that show a standing (Sources, search). */
  async briefsOf(caseIds: readonly number[]): Promise<Map<number, WaiverBrief[]>> {
    const out = new Map<number, WaiverBrief[]>();
    if (caseIds.length === 0) return out;
    const rows = await this.waivers.briefRowsOf(caseIds);
    for (const r of rows) {
      const brief: WaiverBrief = {
        id: r.id,
        checkId: r.checkId,
        quantity: r.quantity,
        acceptedLimit: r.acceptedLimit,
        expiresOn: dateText(r.expiresOn),
        state: r.state,
      };
      out.set(r.qualificationId, [...(out.get(r.qualificationId) ?? []), brief]);
    }
    return out;
  }

  /** What clear with waiver needs to know (read under the case's lock): checks left uncovered, waivers in force. */
  async factsFor(row: Qualification, transaction: Transaction): Promise<{ gaps: CheckId[]; inForce: number; waivers: QualificationWaiver[] }> {
    const waivers = await this.waivers.findAllOf(row.id, transaction);
    const today = this.today();
    const facts = waivers.map((w) => ({ checkId: w.checkId, state: w.state, expiresOn: dateText(w.expiresOn) }));
    return {
      gaps: waiverGaps(row.evaluation.checks, facts, today),
      inForce: facts.filter((w) => isWaiverInForce(w, today)).length,
      waivers: waivers.filter((w) => isWaiverInForce({ state: w.state, expiresOn: dateText(w.expiresOn) }, today)),
    };
  }

  async create(qualificationId: number, request: CreateWaiverRequest, user: AuthUser): Promise<Waiver> {
    const id = await this.unitOfWork.run(async (transaction) => {
      const row = await this.lockCase(qualificationId, transaction);
      const existing = await this.waivers.findAllOf(qualificationId, transaction);
      const today = this.today();
      const block = prepareWaiverBlock(
        { checkId: request.checkId, acceptedLimit: request.acceptedLimit, expiresOn: request.expiresOn },
        {
          state: row.state,
          checks: row.evaluation.checks,
          waivers: existing.map((w) => ({ checkId: w.checkId, state: w.state, expiresOn: dateText(w.expiresOn) })),
        },
        user,
        today,
      );
      if (block) throw waiverRefusal(block, row, request.checkId, today);
      const check = row.evaluation.checks.find((c) => c.id === request.checkId)!;
      const waiver = await this.waivers.create(
        {
          qualificationId,
          housePartId: row.housePartId,
          vendorPartId: row.vendorPartId,
          checkId: check.id,
          quantity: check.quantity,
          limitKind: check.limitKind,
          specLimit: check.limit,
          acceptedLimit: request.acceptedLimit,
          value: check.value,
          reason: request.reason,
          expiresOn: request.expiresOn,
          state: 'proposed',
          preparedById: user.id,
        },
        transaction,
      );
      await this.cases.addEvent(
        {
          qualificationId,
          userId: user.id,
          action: 'waiver-prepared',
          changes: [
            { field: `waiver#${waiver.id}.state`, from: null, to: 'proposed' },
            { field: `waiver#${waiver.id}.acceptedLimit`, from: check.limit, to: request.acceptedLimit },
            { field: `waiver#${waiver.id}.expiresOn`, from: null, to: request.expiresOn },
          ],
          note: `${CHECK_LABELS[check.id]} (${check.verdict}) waived until ${request.expiresOn}: ${request.reason}`,
        },
        transaction,
      );
      return waiver.id;
    });
    return this.one(qualificationId, id);
  }

  approve(qualificationId: number, waiverId: number, body: ApproveWaiverRequest, user: AuthUser): Promise<Waiver> {
    return this.decide(qualificationId, waiverId, 'approved', body.note ?? null, user);
  }

  refuse(qualificationId: number, waiverId: number, body: RefuseWaiverRequest, user: AuthUser): Promise<Waiver> {
    return this.decide(qualificationId, waiverId, 'refused', body.reason, user);
  }

  private async decide(qualificationId: number, waiverId: number, to: 'approved' | 'refused', note: string | null, user: AuthUser): Promise<Waiver> {
    await this.unitOfWork.run(async (transaction) => {
      const row = await this.lockCase(qualificationId, transaction);
      const waiver = await this.waivers.findOfCaseLocked(waiverId, qualificationId, transaction);
      if (!waiver) throw new NotFoundException(`Case #${qualificationId} has no waiver with id ${waiverId}`);
      const today = this.today();
      const block = decideWaiverBlock(
        { state: waiver.state, preparedById: waiver.preparedById, expiresOn: dateText(waiver.expiresOn) },
        row.state,
        user,
        today,
      );
      if (block) throw waiverRefusal(block, row, waiver.checkId, today, waiver);
      await this.waivers.save(waiver, { state: to, decidedById: user.id, decidedAt: this.clock.now(), decisionNote: note }, transaction);
      await this.cases.addEvent(
        {
          qualificationId,
          userId: user.id,
          action: to === 'approved' ? 'waiver-approved' : 'waiver-refused',
          changes: [{ field: `waiver#${waiver.id}.state`, from: 'proposed', to }],
          note: `${CHECK_LABELS[waiver.checkId]} waiver #${waiver.id} ${to}${to === 'approved' ? ` until ${dateText(waiver.expiresOn)}` : ''}${note ? `: ${note}` : ''}`,
        },
        transaction,
      );
    });
    return this.one(qualificationId, waiverId);
  }

  /**
   * The lapse pass: every approved waiver past its expiry day is ended once. Safe to run on
   * several processes at the same time and more than once: each waiver is re-read under
   * its case's row lock and only an approved, due one is changed. Answers how many lapsed.
   */
  /**
   * The lapse pass a read of usability runs first (search, Sources). Once a pass has finished
   * for a day, no waiver can fall due again until the next day — a waiver is prepared and
   * approved only with an expiry after its day (prepareWaiverBlock, decideWaiverBlock) — so
   * the later reads of that day in this process skip the statement. Every replica keeps its own
   * day; the interval pass still runs.
   */
  async lapseBeforeRead(): Promise<void> {
    const today = this.today();
    if (this.lapsedThrough === today) return;
    await this.lapseDue();
    this.lapsedThrough = today;
  }

  async lapseDue(): Promise<number> {
    const today = this.today();
    const due = await this.waivers.due(today);
    let lapsed = 0;
    for (const { id, qualificationId } of due) {
      if (await this.lapseOne(id, qualificationId, today)) lapsed += 1;
    }
    if (lapsed > 0) this.logger.log(`${lapsed} waiver(s) lapsed`);
    return lapsed;
  }

  private async lapseOne(waiverId: number, qualificationId: number, today: string): Promise<boolean> {
    return this.unitOfWork.run(async (transaction) => {
      const row = await this.cases.findById(qualificationId, transaction, true);
      const waiver = await this.waivers.findLocked(waiverId, transaction);
      if (!row || !waiver || !isWaiverDue({ state: waiver.state, expiresOn: dateText(waiver.expiresOn) }, today)) return false;
      const now = this.clock.now();
      const expiresOn = dateText(waiver.expiresOn);
      await this.waivers.save(waiver, { state: 'lapsed', lapsedAt: now }, transaction);
      const what = `${CHECK_LABELS[waiver.checkId]} waiver #${waiver.id} expired on ${expiresOn}`;
      const standingEnds = row.state === 'cleared-with-waiver';
      if (standingEnds) {
        const reason: RecheckReason = { cause: 'waiver-expired', at: now.toISOString(), detail: what };
        await this.cases.save(row, { state: 'waiver-lapsed', needsRecheck: true, recheckReasons: [...(row.recheckReasons ?? []), reason] }, transaction);
      }
      await this.cases.addEvent(
        {
          qualificationId,
          userId: null,
          action: 'waiver-lapsed',
          fromState: standingEnds ? 'cleared-with-waiver' : null,
          toState: standingEnds ? 'waiver-lapsed' : null,
          changes: [
            { field: `waiver#${waiver.id}.state`, from: 'approved', to: 'lapsed' },
            ...(standingEnds
              ? [
                  { field: 'state', from: 'cleared-with-waiver', to: 'waiver-lapsed' },
                  { field: 'needsRecheck', from: row.needsRecheck, to: true },
                ]
              : []),
          ],
          note: standingEnds ? `${what}: the source is no longer usable until a re-check clears it` : what,
        },
        transaction,
      );
      await this.mailLapse(row, waiver, what, standingEnds, transaction);
      return true;
    });
  }

  private async mailLapse(row: Qualification, waiver: QualificationWaiver, what: string, standingEnds: boolean, transaction: Transaction): Promise<void> {
    const housePart = await this.houseParts.findById(row.housePartId, transaction);
    const vendorPart = await this.vendorParts.findById(row.vendorPartId, transaction);
    const pair = { partNumber: housePart!.partNumber, manufacturer: vendorPart!.manufacturerName, mpn: vendorPart!.mpn };
    const preparer = await this.users.findById(waiver.preparedById, transaction);
    const buyers = standingEnds ? await this.buyerLinks.emailsOf(row.housePartId, transaction) : [];
    const to = [...buyers, ...(preparer?.active ? [preparer.email] : [])];
    if (to.length === 0) return;
    const base = publicUrl(this.env);
    const part = `${pair.manufacturer} ${pair.mpn}`;
    await this.mail.enqueue(
      {
        to,
        kind: 'qualification.waiver-lapsed',
        subject: `${pair.partNumber}: ${part} ${standingEnds ? 'no longer usable, a waiver expired' : 'waiver expired'} (case #${row.id})`,
        body: [
          `${what} (case #${row.id}, ${part} as a source of ${pair.partNumber}).`,
          standingEnds
            ? `The case was ${QUALIFICATION_STATE_LABELS['cleared-with-waiver'].toLowerCase()}; it is now ${QUALIFICATION_STATE_LABELS['waiver-lapsed'].toLowerCase()} and needs a re-check. Do not place new orders for it against this house part until it is cleared again.`
            : 'The case was not cleared on it; the waiver no longer counts.',
          '',
          `Sources of ${pair.partNumber}: ${base}/sources?housePartId=${row.housePartId}`,
          `Case: ${base}/qualifications/${row.id}`,
        ].join('\n'),
      },
      transaction,
    );
  }

  private async one(qualificationId: number, waiverId: number): Promise<Waiver> {
    return (await this.waiversOf(qualificationId)).find((w) => w.id === waiverId)!;
  }

  private async lockCase(id: number, transaction: Transaction): Promise<Qualification> {
    const row = await this.cases.findById(id, transaction, true);
    if (!row) throw new NotFoundException(`No qualification case with id ${id}`);
    return row;
  }
}

function toWaiver(r: WaiverRow): Waiver {
  const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());
  return {
    id: r.id,
    qualificationId: r.qualificationId,
    housePartId: r.housePartId,
    vendorPartId: r.vendorPartId,
    checkId: r.checkId,
    checkLabel: CHECK_LABELS[r.checkId],
    quantity: r.quantity,
    limitKind: r.limitKind,
    specLimit: r.specLimit,
    acceptedLimit: r.acceptedLimit,
    value: r.value,
    reason: r.reason,
    expiresOn: dateText(r.expiresOn),
    state: r.state,
    preparedBy: { id: r.preparedById, name: r.preparedByName },
    decidedBy: r.decidedById !== null ? { id: r.decidedById, name: r.decidedByName ?? '' } : null,
    decidedAt: iso(r.decidedAt),
    decisionNote: r.decisionNote,
    lapsedAt: iso(r.lapsedAt),
    createdAt: iso(r.createdAt)!,
  };
}

/** A DATEONLY column as `YYYY-MM-DD` (the driver may answer a string or a Date). */
export function dateText(value: string | Date): string {
  return typeof value === 'string' ? value.slice(0, 10) : value.toISOString().slice(0, 10);
}

function waiverRefusal(block: WaiverBlock, row: Qualification, checkId: CheckId, today: string, waiver?: QualificationWaiver): Error {
  const check = CHECK_LABELS[checkId];
  switch (block) {
    case 'role':
      return new ForbiddenException('Only engineers prepare and decide waivers');
    case 'state':
      return waiver && waiver.state !== 'proposed'
        ? new ConflictException(`Waiver #${waiver.id} is already ${waiver.state}; only a waiver waiting for approval can be approved or refused`)
        : new ConflictException(
            `Case #${row.id} is ${QUALIFICATION_STATE_LABELS[row.state].toLowerCase()}; waivers are prepared and decided while a case is open (draft or in review)`,
          );
    case 'two-person':
      return new ForbiddenException(`You prepared waiver #${waiver!.id}; another engineer must approve or refuse it (two-person rule)`);
    case 'check':
      return new UnprocessableEntityException({
        message: `Check "${check}" is not failing or marginal in case #${row.id}'s evaluation: only a failing or marginal check can be waived`,
        errors: [{ path: 'checkId', message: 'must be a failing or marginal check of the case' }],
      });
    case 'limit':
      return new UnprocessableEntityException({
        message: `The accepted limit does not cover the part's value for "${check}" (or a limit was given for a check that compares names): state the limit actually accepted, in SI units`,
        errors: [{ path: 'acceptedLimit', message: 'must cover the part value (SI), or be null for a text check' }],
      });
    case 'expiry':
      return new UnprocessableEntityException({
        message: `A waiver must expire after today (${today})`,
        errors: [{ path: 'expiresOn', message: `must be after ${today}` }],
      });
    case 'duplicate':
      return new ConflictException(`Check "${check}" of case #${row.id} already has a waiver waiting or in force`);
  }
}
