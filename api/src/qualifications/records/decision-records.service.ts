import { randomUUID } from 'node:crypto';
import {
  ConflictException,
  ForbiddenException,
  Injectable,
  InternalServerErrorException,
  Logger,
  NotFoundException,
  ServiceUnavailableException,
} from '@nestjs/common';
import {
  CARD_FIELDS,
  QUALIFICATION_STATE_LABELS,
  decisionRecordPath,
  isDecidedState,
  isUsableState,
  type DecisionRecordMeta,
  type RatingCardFields,
} from '@shuntwise/contracts';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { UnitOfWork } from '../../database/unit-of-work';
import type { AuthUser } from '../../common/decorators/current-user.decorator';
import { DESIGN_CAUTION } from '../../engineering/caution';
import { MeasurementSetsService } from '../../measurements/measurement-sets.service';
import { StorageService } from '../../storage/storage.service';
import { QualificationsRepository } from '../qualifications.repository';
import type { DecisionRecord } from './decision-record.model';
import { DecisionRecordsRepository } from './decision-records.repository';
import { canonicalJson, recordCurve, sha256Hex, type RecordInputs } from './record-inputs';
import { renderDecisionRecord } from './record-pdf';

const iso = (d: Date | string) => new Date(d).toISOString();
/** Whole seconds, as the database keeps its times. */
const toSecond = (d: Date) => new Date(Math.floor(d.getTime() / 1000) * 1000);

/**
 * The PDF record of each decided case, made once and never again.
 *
 * When the store fails: the decision's transaction writes the record row `pending` with the
 * frozen inputs (canonical JSON and its sha256), so the decision and what its record will
 * show commit together; the PDF is drawn and stored right after commit. If the object store
 * refuses, the decision stands and the row stays pending; the next read of the record
 * (download or meta) draws it from the same frozen inputs — the same bytes — and stores it.
 * A stored record is served as stored, its bytes checked against their sha256; a re-render
 * must equal those bytes, and inputs that differ from the frozen ones are refused.
 */
@Injectable()
export class DecisionRecordsService {
  private readonly logger = new Logger('DecisionRecords');

  constructor(
    private readonly records: DecisionRecordsRepository,
    private readonly cases: QualificationsRepository,
    private readonly measurements: MeasurementSetsService,
    private readonly storage: StorageService,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  private deferring = 0;

  /**
   * Runs work whose decisions leave their records pending, to be drawn on first read (the demo
   * seed makes dozens of decisions at start-up). The inputs are frozen all the same, so the
   * bytes are those an immediate drawing would have given.
   */
  async deferStoring<T>(work: () => Promise<T>): Promise<T> {
    this.deferring++;
    try {
      return await work();
    } finally {
      this.deferring--;
    }
  }

  /**
   * Called inside a decision's transaction: freezes the case as decided into a pending record,
   * and stores the PDF once the transaction commits. A case that has its record keeps it: the
   * same inputs again are a no-op, other inputs are refused.
   */
  async capture(qualificationId: number, transaction: Transaction, madeAt?: Date): Promise<void> {
    const inputs = await this.snapshot(qualificationId, transaction, madeAt);
    const text = canonicalJson(inputs);
    const inputsSha256 = sha256Hex(text);
    const existing = await this.records.find(qualificationId, transaction, true);
    if (existing) {
      if (existing.inputsSha256 !== inputsSha256) {
        throw new ConflictException(
          `Case #${qualificationId} already has its decision record (inputs sha256 ${existing.inputsSha256}); a record is never made again from other inputs`,
        );
      }
      return;
    }
    await this.records.create(
      { qualificationId, state: 'pending', storageKey: `records/${randomUUID()}.pdf`, inputsSha256, inputs: text, createdAt: new Date(inputs.madeAt) },
      transaction,
    );
    if (this.deferring > 0) return;
    // Runs after commit (Sequelize also runs it after a failed commit: then there is no row and nothing happens).
    transaction.afterCommit(async () => {
      try {
        await this.complete(qualificationId);
      } catch (error) {
        this.logger.warn(`case ${qualificationId}: record left pending (${(error as Error).message}); the next read makes it`);
      }
    });
  }

  /** `GET /qualifications/:id/record/meta`. */
  async meta(qualificationId: number, user: AuthUser): Promise<DecisionRecordMeta> {
    await this.checkAccess(qualificationId, user);
    const row = await this.ensure(qualificationId);
    return toMeta(row);
  }

  /** `GET /qualifications/:id/record`: the stored bytes, checked against their sha256. */
  async download(qualificationId: number, user: AuthUser): Promise<{ bytes: Uint8Array; fileName: string; sha256: string }> {
    await this.checkAccess(qualificationId, user);
    const row = await this.ensure(qualificationId);
    if (row.state !== 'stored' || !row.sha256)
      throw new ServiceUnavailableException(`The record of case #${qualificationId} is waiting for the object store; try again in a moment`);
    let bytes: Uint8Array;
    try {
      bytes = await this.storage.getBytes(row.storageKey);
    } catch (error) {
      this.logger.error(`case ${qualificationId}: record ${row.storageKey} not readable: ${(error as Error).message}`);
      throw new ServiceUnavailableException('The object store did not return the record; try again in a moment');
    }
    if (sha256Hex(bytes) !== row.sha256) {
      this.logger.error(`case ${qualificationId}: stored record ${row.storageKey} does not match its sha256 ${row.sha256}`);
      throw new InternalServerErrorException(`The stored record of case #${qualificationId} does not match its recorded sha256; it is not served`);
    }
    return { bytes, fileName: `decision-record-case-${qualificationId}.pdf`, sha256: row.sha256 };
  }

  /**
   * Draws the record again, from its frozen inputs or from `inputs` given: refused when the
   * inputs differ from the frozen ones, or when the drawing differs from the stored bytes.
   */
  async rerender(qualificationId: number, inputs?: RecordInputs): Promise<Buffer> {
    const row = await this.records.find(qualificationId);
    if (!row) throw new NotFoundException(`Case #${qualificationId} has no decision record`);
    const given = inputs ?? (JSON.parse(row.inputs) as RecordInputs);
    const givenSha = sha256Hex(canonicalJson(given));
    if (givenSha !== row.inputsSha256)
      throw new ConflictException(
        `Refused: these inputs (sha256 ${givenSha}) are not the ones case #${qualificationId}'s record was made from (${row.inputsSha256})`,
      );
    const pdf = await renderDecisionRecord(given);
    const sha = sha256Hex(pdf);
    if (row.sha256 !== null && sha !== row.sha256)
      throw new ConflictException(`Refused: the re-drawn record (sha256 ${sha}) differs from the stored one (${row.sha256})`);
    return pdf;
  }

  /** The record row, made now for a case decided before records existed, and stored if still pending. */
  private async ensure(qualificationId: number): Promise<DecisionRecord> {
    let row = await this.records.find(qualificationId);
    if (!row) {
      try {
        await this.unitOfWork.run((transaction) => this.capture(qualificationId, transaction, toSecond(new Date())));
      } catch (error) {
        if (!(error instanceof UniqueConstraintError)) throw error; // another reader made it first
      }
      row = (await this.records.find(qualificationId))!;
    }
    if (row.state === 'pending') {
      try {
        await this.complete(qualificationId);
      } catch (error) {
        this.logger.warn(`case ${qualificationId}: record still pending (${(error as Error).message})`);
      }
      row = (await this.records.find(qualificationId))!;
    }
    return row;
  }

  /** Draws a pending record from its frozen inputs and stores it under its key (the same bytes whoever does it). */
  private async complete(qualificationId: number): Promise<void> {
    const row = await this.records.find(qualificationId);
    if (!row || row.state === 'stored') return;
    if (sha256Hex(row.inputs) !== row.inputsSha256) throw new Error(`frozen inputs of case ${qualificationId} do not match their sha256`);
    try {
      const pdf = await renderDecisionRecord(JSON.parse(row.inputs) as RecordInputs);
      const sha256 = sha256Hex(pdf);
      await this.storage.put(row.storageKey, pdf, 'application/pdf', sha256);
      await this.records.markStored(qualificationId, { sha256, size: pdf.byteLength, storedAt: toSecond(new Date()) });
    } catch (error) {
      await this.records.markFailed(qualificationId, (error as Error).message).catch(() => undefined);
      throw error;
    }
  }

  private async checkAccess(qualificationId: number, user: AuthUser): Promise<void> {
    const row = await this.cases.findById(qualificationId);
    if (!row) throw new NotFoundException(`No qualification case with id ${qualificationId}`);
    const state = QUALIFICATION_STATE_LABELS[row.state].toLowerCase();
    // Designers read the cases they may design in, as the case itself (GET /qualifications/:id) decides.
    if (user.role === 'designer' && !isUsableState(row.state))
      throw new ForbiddenException(`Case #${qualificationId} is ${state}; designers see the records of cleared cases only`);
    if (!isDecidedState(row.state)) throw new NotFoundException(`Case #${qualificationId} is ${state}: a record is made when it is decided`);
  }

  /** The case as decided, read inside the decision's transaction. */
  async snapshot(qualificationId: number, transaction?: Transaction, madeAt?: Date): Promise<RecordInputs> {
    const row = await this.cases.findRow(qualificationId, transaction);
    if (!row) throw new NotFoundException(`No qualification case with id ${qualificationId}`);
    // One after another: they share the transaction's connection.
    const spec = await this.records.specVersion(row.housePartId, row.specVersion, transaction);
    const card = await this.records.cardVersion(row.vendorPartId, row.cardVersion, transaction);
    const events = await this.records.events(qualificationId, transaction);
    const comments = await this.records.comments(qualificationId, transaction);
    // Committed sets, analysed against the part's current card and the house part's current spec (the service's reading).
    const sets = await this.measurements.listForVendorPart(row.vendorPartId, row.housePartId);
    const datasheets = await this.records.datasheets(citedDatasheets(card?.fields ?? null), transaction);
    const { curve, note } = recordCurve(card?.fields ?? null, spec);
    const decision =
      row.decisionState !== null && row.decidedAt !== null && row.decidedById !== null
        ? {
            state: row.decisionState,
            stateLabel: QUALIFICATION_STATE_LABELS[row.decisionState],
            at: iso(row.decidedAt),
            by: { id: row.decidedById, name: row.decidedByName ?? '' },
            text: row.decisionText,
          }
        : null;
    return {
      format: 1,
      madeAt: iso(madeAt ?? row.decidedAt ?? toSecond(new Date())),
      case: {
        id: row.id,
        revision: row.revision,
        previousId: row.previousId,
        state: row.state,
        stateLabel: QUALIFICATION_STATE_LABELS[row.state],
        overall: row.overall,
        summary: row.summary,
        openedAt: iso(row.createdAt),
        submittedAt: row.submittedAt ? iso(row.submittedAt) : null,
        preparedBy: { id: row.preparedById, name: row.preparedByName },
        reviewer: row.reviewerId !== null ? { id: row.reviewerId, name: row.reviewerName ?? '' } : null,
        decision,
        revocation:
          row.revokedAt && row.revokedById !== null
            ? { at: iso(row.revokedAt), by: { id: row.revokedById, name: row.revokedByName ?? '' }, reason: row.revokeReason ?? '' }
            : null,
      },
      housePart: { id: row.housePartId, partNumber: row.partNumber, description: row.housePartDescription, specVersion: row.specVersion, spec },
      vendorPart: {
        id: row.vendorPartId,
        manufacturer: row.manufacturer,
        mpn: row.mpn,
        package: row.package,
        cardVersion: row.cardVersion,
        card: card?.fields ?? null,
        cardNote: card?.note ?? null,
      },
      datasheets,
      evaluation: row.evaluation,
      measurementSets: sets.map((s) => ({
        id: s.id,
        fileName: s.fileName,
        sha256: s.sha256,
        sizeBytes: s.sizeBytes,
        lot: s.lot,
        instrument: s.instrument,
        measuredOn: s.measuredOn,
        uploadedAt: s.createdAt,
        samples: s.samples.length,
        points: s.samples.reduce((n, sample) => n + sample.points.length, 0),
        analysis: {
          overall: s.analysis.overall,
          checks: s.analysis.checks,
          cardVersion: s.analysis.cardVersion,
          specVersion: s.analysis.specVersion,
          warnings: s.analysis.warnings,
        },
      })),
      curve,
      curveNote: note,
      comments: comments.map((c) => ({ at: iso(c.at), by: c.by, text: c.text })),
      audit: events.map((e) => ({ at: iso(e.at), by: e.by, action: e.action, fromState: e.fromState, toState: e.toState, note: e.note, changes: e.changes })),
      caution: DESIGN_CAUTION,
    };
  }
}

function citedDatasheets(fields: RatingCardFields | null): number[] {
  if (!fields) return [];
  const ids = new Set<number>();
  for (const field of CARD_FIELDS) {
    const id = fields[field]?.provenance.datasheetId;
    if (typeof id === 'number') ids.add(id);
  }
  return [...ids].sort((a, b) => a - b);
}

function toMeta(row: DecisionRecord): DecisionRecordMeta {
  return {
    qualificationId: row.qualificationId,
    state: row.state,
    sha256: row.sha256,
    inputsSha256: row.inputsSha256,
    size: row.size,
    createdAt: iso(row.createdAt),
    storedAt: row.storedAt ? iso(row.storedAt) : null,
    path: decisionRecordPath(row.qualificationId),
  };
}
