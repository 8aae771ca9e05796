import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
  UnprocessableEntityException,
  type OnModuleDestroy,
  type OnModuleInit,
} from '@nestjs/common';
import {
  QUALIFICATION_STATE_LABELS,
  isOfferedToDesigners,
  isRuledOutState,
  isUsableState,
  sourceStanding,
  isOpenState,
  type CreateQualificationRequestRequest,
  type DeclineQualificationRequest,
  type OpenCaseFromRequest,
  type Page,
  type QualificationRequest as QualificationRequestDto,
  type QualificationRequestListQuery,
} from '@shuntwise/contracts';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { UnitOfWork } from '../database/unit-of-work';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { UsersRepository } from '../users/users.repository';
import { MailService } from '../mail/mail.service';
import { QualificationsService, type CaseOpened } from '../qualifications/qualifications.service';
import type { QualificationRequest } from './qualification-request.model';
import { QualificationRequestsRepository, type RequestRow } from './qualification-requests.repository';

/** A date the design needs the part by may lie this many days back (time zones, a request typed late at night). */
const NEEDED_BY_GRACE_DAYS = 1;

/**
 * Requests for a qualification: designers (and engineers) ask; engineers take a request up
 * by opening a case from it, or decline it with a reply. A case opened for the same vendor
 * part and house part by any way takes up the open requests it answers, in the case's own
 * transaction. Every change enqueues its mail in its transaction.
 */
@Injectable()
export class QualificationRequestsService implements OnModuleInit, OnModuleDestroy {
  private unsubscribe?: () => void;

  constructor(
    private readonly requests: QualificationRequestsRepository,
    private readonly users: UsersRepository,
    private readonly cases: QualificationsService,
    private readonly mail: MailService,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  onModuleInit(): void {
    this.unsubscribe = this.cases.onCaseOpened((opened, transaction) => this.takeUp(opened, transaction));
  }

  onModuleDestroy(): void {
    this.unsubscribe?.();
  }

  async list(query: QualificationRequestListQuery, user: AuthUser): Promise<Page<QualificationRequestDto>> {
    // Designers see their own requests only; engineers and admins the whole queue, or theirs.
    const requestedById = user.role === 'designer' || query.mine ? user.id : undefined;
    const { rows, total } = await this.requests.list({ openOnly: query.status === 'open', requestedById, vendorPartId: query.vendorPartId }, query);
    return { items: rows.map(toDto), total, pageIndex: query.pageIndex, pageSize: query.pageSize };
  }

  async get(id: number, user: AuthUser): Promise<QualificationRequestDto> {
    const row = await this.requests.findRow(id);
    if (!row) throw new NotFoundException(`No qualification request with id ${id}`);
    if (user.role === 'designer' && row.requestedById !== user.id)
      throw new ForbiddenException(`Request #${id} is ${row.requestedByName}'s; designers see their own requests only`);
    return toDto(row);
  }

  /** `POST /qualification-requests`: records the request and tells the engineers. */
  async create(request: CreateQualificationRequestRequest, user: AuthUser): Promise<QualificationRequestDto> {
    const housePartId = request.housePartId ?? null;
    let id: number;
    try {
      id = await this.unitOfWork.run(async (transaction) => {
        const vp = await this.requests.vendorPart(request.vendorPartId, transaction);
        if (!vp)
          throw new NotFoundException({
            message: `No vendor part with id ${request.vendorPartId}`,
            errors: [{ path: 'vendorPartId', message: 'no such vendor part' }],
          });
        const hp = housePartId !== null ? await this.requests.housePart(housePartId, transaction) : null;
        if (housePartId !== null && !hp)
          throw new NotFoundException({ message: `No house part with id ${housePartId}`, errors: [{ path: 'housePartId', message: 'no such house part' }] });
        if (hp && user.role === 'designer' && !isOfferedToDesigners(hp.status)) {
          throw new UnprocessableEntityException({
            message: `House part ${hp.partNumber} is a draft still being specified: ask for the part without a house part, or choose one in use`,
            errors: [{ path: 'housePartId', message: 'a draft house part' }],
          });
        }
        checkNeededBy(request.neededBy ?? null);
        const part = `${vp.manufacturer} ${vp.mpn}`;
        if (hp) await this.refuseAnswered(hp, part, vp.id, transaction);
        const duplicate = await this.requests.openDuplicate(user.id, vp.id, housePartId, transaction);
        if (duplicate) throw duplicateRequest(part, hp?.partNumber ?? null, duplicate);
        const row = await this.requests.create(
          { vendorPartId: vp.id, housePartId, requestedById: user.id, note: request.note, neededBy: request.neededBy ?? null, state: 'open' },
          transaction,
        );
        await this.notifyEngineers(row, vp, hp, user, transaction);
        return row.id;
      });
    } catch (error) {
      // Two requests at the same moment: the open-request index refused the second.
      if (error instanceof UniqueConstraintError) throw duplicateRequest('this part', null, null);
      throw error;
    }
    return this.get(id, user);
  }

  /**
   * `POST /qualification-requests/:id/open-case`: opens the case through the qualification
   * service's own opening (its checks, its evaluation, its audit entry); the case's
   * transaction takes the request up through the opened-case hook.
   */
  async openCase(id: number, body: OpenCaseFromRequest, user: AuthUser): Promise<QualificationRequestDto> {
    const row = await this.requests.findById(id);
    if (!row) throw new NotFoundException(`No qualification request with id ${id}`);
    if (row.state !== 'open') throw await this.closed(row);
    if (row.housePartId !== null && body.housePartId !== undefined && body.housePartId !== row.housePartId) {
      const hp = await this.requests.housePart(row.housePartId);
      throw new BadRequestException({
        message: `Request #${id} asks for ${hp?.partNumber ?? `house part ${row.housePartId}`}: open the case for that house part, or leave housePartId out`,
        errors: [{ path: 'housePartId', message: 'differs from the house part the request names' }],
      });
    }
    const housePartId = row.housePartId ?? body.housePartId;
    if (housePartId === undefined) {
      throw new BadRequestException({
        message: `Request #${id} names no house part: choose the house part to qualify the part for`,
        errors: [{ path: 'housePartId', message: 'required: the request names no house part' }],
      });
    }
    const requester = await this.requests.user(row.requestedById);
    const needed = row.neededBy ? `, needed by ${row.neededBy}` : '';
    const summary = body.summary ?? `Asked for by ${requester?.name ?? `user ${row.requestedById}`} in request #${id}${needed}: ${row.note}`;
    await this.cases.create({ housePartId, vendorPartId: row.vendorPartId, summary }, user);
    return this.get(id, user);
  }

  /** `POST /qualification-requests/:id/decline`: closes the request with the engineer's reply, mailed to the requester. */
  async decline(id: number, body: DeclineQualificationRequest, user: AuthUser): Promise<QualificationRequestDto> {
    await this.unitOfWork.run(async (transaction) => {
      const row = await this.requests.findById(id, transaction, true);
      if (!row) throw new NotFoundException(`No qualification request with id ${id}`);
      if (row.state !== 'open') throw await this.closed(row);
      await this.requests.save(row, { state: 'declined', reply: body.reply, closedById: user.id, closedAt: new Date() }, transaction);
      const vp = (await this.requests.vendorPart(row.vendorPartId, transaction))!;
      const hp = row.housePartId !== null ? await this.requests.housePart(row.housePartId, transaction) : null;
      await this.mailRequester(
        row,
        {
          kind: 'qualification-request.declined',
          subject: `Your request #${row.id} was declined: ${vp.manufacturer} ${vp.mpn}${hp ? ` for ${hp.partNumber}` : ''}`,
          lines: [
            `${user.name} declined your request to qualify ${vp.manufacturer} ${vp.mpn}${hp ? ` as a source of ${hp.partNumber}` : ''}.`,
            `Reply: ${body.reply}`,
            '',
            `Your request: ${excerpt(row.note)}`,
            '',
            'Your requests: /find, under My qualification requests',
          ],
        },
        transaction,
      );
    });
    return this.get(id, user);
  }

  /** The opened-case hook: takes up every open request the new case answers and tells each requester. */
  private async takeUp(opened: CaseOpened, transaction: Transaction): Promise<void> {
    const rows = await this.requests.openForCase(opened.vendorPart.id, opened.housePart.id, transaction);
    const part = `${opened.vendorPart.manufacturer} ${opened.vendorPart.mpn}`;
    for (const row of rows) {
      await this.requests.save(row, { state: 'taken-up', qualificationId: opened.caseId, closedById: opened.by.id, closedAt: new Date() }, transaction);
      await this.mailRequester(
        row,
        {
          kind: 'qualification-request.taken-up',
          subject: `Your request #${row.id} was taken up: case #${opened.caseId} (${opened.vendorPart.mpn} for ${opened.housePart.partNumber})`,
          lines: [
            `${opened.by.name} opened case #${opened.caseId}${opened.revision > 1 ? ` (revision ${opened.revision})` : ''} to qualify ${part} as a source of ${opened.housePart.partNumber} (${opened.housePart.description}).`,
            `Your request: ${excerpt(row.note)}`,
            'The case starts as a draft; a second engineer decides it. Once it is cleared the part shows as cleared for that house part on Find parts.',
            '',
            `Case: /qualifications/${opened.caseId}`,
            'Where it stands: /find, under My qualification requests',
          ],
        },
        transaction,
      );
    }
  }

  /** A request for a pair that is already cleared or under way is refused: there is nothing to ask for. */
  private async refuseAnswered(hp: { id: number; partNumber: string }, part: string, vendorPartId: number, transaction: Transaction): Promise<void> {
    const { basis, openCase } = sourceStanding(await this.requests.pairCases(hp.id, vendorPartId, transaction));
    if (basis && isUsableState(basis.state)) {
      throw new ConflictException(
        `${part} is already ${QUALIFICATION_STATE_LABELS[basis.state].toLowerCase()} for ${hp.partNumber} (case #${basis.id}): you may design it in; Find parts shows its conditions`,
      );
    }
    const underWay = openCase ?? (basis && isOpenState(basis.state) ? basis : null);
    if (underWay) {
      throw new ConflictException(
        `A qualification of ${part} for ${hp.partNumber} is already under way (case #${underWay.id}); Find parts shows it once it is cleared`,
      );
    }
  }

  private async closed(row: QualificationRequest): Promise<ConflictException> {
    const by = row.closedById !== null ? (await this.requests.user(row.closedById))?.name : undefined;
    const who = by ? ` by ${by}` : '';
    return new ConflictException(
      row.state === 'taken-up'
        ? `Request #${row.id} was already taken up${who} (case #${row.qualificationId})`
        : `Request #${row.id} was already declined${who}`,
    );
  }

  private async notifyEngineers(
    row: QualificationRequest,
    vp: { manufacturer: string; mpn: string },
    hp: { partNumber: string; description: string } | null,
    user: AuthUser,
    transaction: Transaction,
  ): Promise<void> {
    const to = await this.users.activeEngineerEmails(user.id, transaction);
    if (to.length === 0) return;
    const part = `${vp.manufacturer} ${vp.mpn}`;
    await this.mail.enqueue(
      {
        to,
        kind: 'qualification-request.new',
        subject: `Qualification asked for: ${part}${hp ? ` for ${hp.partNumber}` : ''} (request #${row.id})`,
        body: [
          `${user.name} asks for ${part} to be qualified${hp ? ` as a source of ${hp.partNumber} (${hp.description})` : '; no house part named: choose one when you open the case'}.`,
          ...(row.neededBy ? [`Needed by: ${row.neededBy}`] : []),
          'What it is for:',
          row.note,
          '',
          'Open a case from it, or decline it with a reply, on the Board: /board',
        ].join('\n'),
      },
      transaction,
    );
  }

  /** Mail to the requester, unless they closed the request themself or are no longer active. */
  private async mailRequester(row: QualificationRequest, message: { kind: string; subject: string; lines: string[] }, transaction: Transaction): Promise<void> {
    if (row.closedById === row.requestedById) return;
    const requester = await this.requests.user(row.requestedById, transaction);
    if (!requester?.active) return;
    await this.mail.enqueue({ to: [requester.email], kind: message.kind, subject: message.subject, body: message.lines.join('\n') }, transaction);
  }
}

/** A date in the past is refused (with a day's grace), naming the field. */
export function checkNeededBy(neededBy: string | null, now = new Date()): void {
  if (neededBy === null) return;
  const earliest = new Date(now.getTime() - NEEDED_BY_GRACE_DAYS * 86_400_000).toISOString().slice(0, 10);
  if (neededBy < earliest) {
    throw new BadRequestException({
      message: `neededBy (${neededBy}) is in the past: give the date the design needs the part by, or leave it out`,
      errors: [{ path: 'neededBy', message: 'in the past' }],
    });
  }
}

function duplicateRequest(part: string, housePart: string | null, existing: { id: number; createdAt: Date } | null): ConflictException {
  const what = `${part}${housePart ? ` for ${housePart}` : ' (no house part named)'}`;
  return new ConflictException(
    existing
      ? `You already asked for ${what} in request #${existing.id} on ${new Date(existing.createdAt).toISOString().slice(0, 10)}; it is waiting for an engineer`
      : `You already asked for ${what}; it is waiting for an engineer`,
  );
}

function excerpt(text: string): string {
  return text.length > 300 ? `${text.slice(0, 297)}…` : text;
}

export function toDto(row: RequestRow): QualificationRequestDto {
  const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());
  return {
    id: row.id,
    vendorPart: { id: row.vendorPartId, manufacturer: row.manufacturer, mpn: row.mpn, package: row.package },
    housePart: row.housePartId !== null ? { id: row.housePartId, partNumber: row.partNumber ?? '', description: row.housePartDescription ?? '' } : null,
    note: row.note,
    neededBy: row.neededBy,
    state: row.state,
    requestedBy: { id: row.requestedById, name: row.requestedByName },
    createdAt: iso(row.createdAt)!,
    closedBy: row.closedById !== null ? { id: row.closedById, name: row.closedByName ?? '' } : null,
    closedAt: iso(row.closedAt),
    reply: row.reply,
    case:
      row.caseId !== null && row.caseHousePartId !== null
        ? {
            id: row.caseId,
            revision: row.caseRevision ?? 1,
            state: row.caseState!,
            housePart: { id: row.caseHousePartId, partNumber: row.casePartNumber ?? '', description: row.caseHousePartDescription ?? '' },
          }
        : null,
    ruledOut:
      row.decidedCaseId !== null && isRuledOutState(row.decidedState)
        ? {
            caseId: row.decidedCaseId,
            state: row.decidedState,
            reason: row.decidedState === 'revoked' ? row.revokeReason : row.decisionText,
            at: iso(row.decidedState === 'revoked' ? row.revokedAt : row.decidedAt),
          }
        : null,
  };
}
