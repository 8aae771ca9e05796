import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import {
  CARD_FIELDS,
  normalizeBasis,
  normalizeRequestFor,
  tcVoltsPerKelvin,
  toEngineeringCard,
  type Actor,
  type CardField,
  type CardValue,
  type EngineeringCardInput,
  type NormalizeResponse,
  type RatingCard as RatingCardDto,
  type CardFieldChange,
  type RatingCardFields,
  type RatingCardFieldsParsed,
  type RatingCardQuery,
  type RatingCardVersionSummary,
  type RatingCardView,
  type TcValue,
  type VendorPartModel,
} from '@shuntwise/contracts';
import type { Transaction } from 'sequelize';
import { UnitOfWork } from '../database/unit-of-work';
import { CatalogueEvents } from '../catalogue-events/catalogue-events.service';
import { StaleConflictException } from '../common/errors/stale-conflict.exception';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { fitBreakdownModel, modelSummary } from '../engineering/breakdown-model';
import { checkCard } from '../engineering/card-checks';
import { DESIGN_CAUTION } from '../engineering/caution';
import { EngineeringInputError } from '../engineering/engineering-input.error';
import { normalize } from '../engineering/normalize';
import { spiceModelLine } from '../engineering/spice-model';
import { RatingCardsRepository, type SpecBasis } from './rating-cards.repository';
import { VendorPartsRepository } from './vendor-parts.repository';

/** Thrown inside a write when the base version is stale (callers turn it into a 409). */
export class StaleCardError extends Error {
  constructor(
    readonly vendorPartId: number,
    readonly currentVersion: number,
    readonly baseVersion: number,
  ) {
    super(`The card of vendor part ${vendorPartId} is at version ${currentVersion}; this save was based on version ${baseVersion}`);
    this.name = 'StaleCardError';
  }
}

export interface CardWrite {
  /** The version the change is based on (0 for a new card). */
  baseVersion: number;
  fields: RatingCardFieldsParsed;
  note?: string | null;
}

export interface CardWriteResult {
  version: number;
  changed: boolean;
  changedFields: string[];
}

@Injectable()
export class RatingCardsService {
  constructor(
    private readonly cards: RatingCardsRepository,
    private readonly vendorParts: VendorPartsRepository,
    private readonly events: CatalogueEvents,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  /** The card (current or an earlier version), with the engineering core's reading of it only when asked (`include=engineering`). */
  async view(vendorPartId: number, query: RatingCardQuery = {}): Promise<RatingCardView> {
    const card = await this.card(vendorPartId, query.version);
    const engineeringCard = toEngineeringCard(card.fields);
    const view: RatingCardView = { ...card, issues: engineeringCard ? checkCard(engineeringCard) : [] };
    if (query.include !== 'engineering') return view;
    const basis = await this.cards.specBasis(vendorPartId, query.housePartId);
    let reason: string | null = null;
    let result: NormalizeResponse | null = null;
    if (!engineeringCard) reason = 'the card needs vzNom and izt before the engineering core can read it';
    else {
      try {
        result = normalizeAt(engineeringCard, basis);
      } catch (error) {
        if (!(error instanceof EngineeringInputError)) throw error;
        reason = error.message;
      }
    }
    if (query.housePartId !== undefined && !basis) reason ??= `house part ${query.housePartId} has no spec yet: normalised at the card's own test currents`;
    view.engineering = {
      basis: basis ? { housePartId: basis.housePartId, partNumber: basis.partNumber, specVersion: basis.specVersion } : null,
      result,
      reason,
    };
    return view;
  }

  /**
   * The card as stored, for the qualification too: the current one, or `version`. A part
   * without a card gives version 0 and no fields.
   */
  async card(vendorPartId: number, version?: number): Promise<RatingCardDto> {
    if (version === undefined) {
      // The common read: part, card and who saved it in one raw primary-key query.
      const found = await this.cards.currentRow(vendorPartId);
      if (!found) throw new NotFoundException(`No vendor part with id ${vendorPartId}`);
      const c = found.card;
      if (!c) return { vendorPartId, version: 0, fields: {}, note: null, updatedAt: null, updatedBy: null };
      return { vendorPartId, version: c.version, fields: c.fields, note: c.note, updatedAt: new Date(c.updatedAt).toISOString(), updatedBy: c.updatedBy };
    }
    const part = await this.vendorParts.findById(vendorPartId);
    if (!part) throw new NotFoundException(`No vendor part with id ${vendorPartId}`);
    const row = await this.cards.findVersion(vendorPartId, version);
    if (!row) throw new NotFoundException(`Vendor part ${vendorPartId} has no card version ${version}`);
    return { vendorPartId, version: row.version, fields: row.fields, note: row.note, updatedAt: row.createdAt.toISOString(), updatedBy: actor(row.changedBy) };
  }

  /** The current card as SPICE `.model` lines: nominal, and the tolerance ends the card gives. */
  async model(vendorPartId: number): Promise<VendorPartModel> {
    const card = await this.card(vendorPartId);
    const engineeringCard = toEngineeringCard(card.fields);
    if (!engineeringCard) throw new NotFoundException(`Vendor part ${vendorPartId} has no card with vzNom and izt yet: there is nothing to model`);
    const part = await this.vendorParts.findById(vendorPartId);
    const name = part!.mpn.replace(/[^A-Za-z0-9_]/g, '_');
    const fitted = fitBreakdownModel(engineeringCard);
    return {
      vendorPartId,
      cardVersion: card.version,
      name,
      lines: {
        nom: spiceModelLine(fitted, { name }),
        min: fitted.hasVzMin ? spiceModelLine(fitted, { name: `${name}_MIN`, corner: 'min' }) : null,
        max: fitted.hasVzMax ? spiceModelLine(fitted, { name: `${name}_MAX`, corner: 'max' }) : null,
      },
      model: modelSummary(fitted),
      warnings: fitted.warnings,
      caution: DESIGN_CAUTION,
    };
  }

  async versions(vendorPartId: number): Promise<RatingCardVersionSummary[]> {
    if (!(await this.vendorParts.findById(vendorPartId))) throw new NotFoundException(`No vendor part with id ${vendorPartId}`);
    const list = await this.cards.listVersions(vendorPartId);
    return list.map((v, i) => ({
      version: v.version,
      changedFields: v.changedFields,
      // newest first: the version before this one is the next in the list
      changes: fieldChanges(list[i + 1]?.fields ?? null, v.fields, v.changedFields),
      note: v.note,
      changedBy: actor(v.changedBy),
      createdAt: v.createdAt.toISOString(),
    }));
  }

  /** `PUT …/rating-card`: saves a new version, or answers 409 with the current card when the base is stale. */
  async put(vendorPartId: number, request: CardWrite, user: AuthUser, read: Pick<RatingCardQuery, 'include' | 'housePartId'> = {}): Promise<RatingCardView> {
    try {
      await this.unitOfWork.run((transaction) => this.write(vendorPartId, request, user, transaction));
    } catch (error) {
      if (error instanceof StaleCardError) {
        // The stale-conflict body with the card as it is now, so the editor can merge (ratingCardConflictSchema).
        throw new StaleConflictException(
          `Someone else saved this card (now version ${error.currentVersion}) after you loaded version ${error.baseVersion}: compare both and save again on version ${error.currentVersion}`,
          { current: await this.view(vendorPartId, read), errors: [{ path: 'version', message: `current version is ${error.currentVersion}` }] },
        );
      }
      throw error;
    }
    return this.view(vendorPartId, read);
  }

  /**
   * Writes a card inside the caller's transaction: locks the vendor part, checks the base
   * version, records who confirmed each value, keeps a version row, tells subscribers.
   * A save that changes nothing makes no new version. `path` prefixes error paths.
   */
  async write(vendorPartId: number, request: CardWrite, user: AuthUser | null, transaction: Transaction, path = 'fields'): Promise<CardWriteResult> {
    if (!(await this.vendorParts.lock(vendorPartId, transaction))) throw new NotFoundException(`No vendor part with id ${vendorPartId}`);
    const existing = await this.cards.findCurrent(vendorPartId, transaction);
    const currentVersion = existing?.version ?? 0;
    if (request.baseVersion !== currentVersion) throw new StaleCardError(vendorPartId, currentVersion, request.baseVersion);

    await this.checkDatasheets(request.fields, path, transaction);
    const who: Actor | null = user ? { id: user.id, name: user.name } : null;
    const fields = storedFields(request.fields, existing?.fields ?? null, who, new Date().toISOString());
    const changedFields = diffFields(existing?.fields ?? null, fields);
    const note = request.note ?? null;
    if (existing && changedFields.length === 0 && note === (existing.note ?? null)) {
      return { version: currentVersion, changed: false, changedFields };
    }
    const version = currentVersion + 1;
    await this.cards.save(
      {
        vendorPartId,
        version,
        fields,
        note,
        vzNom: fields.vzNom!.value,
        izt: fields.izt!.value,
        pdMax: fields.pdMax?.value ?? null,
        userId: user?.id ?? null,
        changedFields,
      },
      existing,
      transaction,
    );
    await this.events.publish(
      { kind: 'card-changed', vendorPartId, version, previousVersion: existing ? currentVersion : null, changedFields, userId: user?.id ?? null },
      transaction,
    );
    return { version, changed: true, changedFields };
  }

  private async checkDatasheets(fields: RatingCardFieldsParsed, path: string, transaction: Transaction): Promise<void> {
    const named = CARD_FIELDS.flatMap((f) => {
      const id = fields[f]?.provenance.datasheetId;
      return id != null ? [{ field: f, id }] : [];
    });
    const found = await this.vendorParts.existingDatasheetIds([...new Set(named.map((n) => n.id))], transaction);
    const missing = named.filter((n) => !found.has(n.id));
    if (missing.length) {
      throw new BadRequestException({
        message: `Invalid request: ${path}.${missing[0].field}.provenance.datasheetId: no datasheet with id ${missing[0].id}`,
        errors: missing.map((m) => ({ path: `${path}.${m.field}.provenance.datasheetId`, message: `no datasheet with id ${m.id}` })),
      });
    }
  }
}

/** The card normalised at the one basis the editor uses too (contracts' normalizeBasis): the spec's currents, else the stated defaults. */
export function normalizeAt(card: EngineeringCardInput, basis: SpecBasis | null): NormalizeResponse {
  const chosen = normalizeBasis(card, basis ? { spec: basis.spec, partNumber: basis.partNumber, version: basis.specVersion } : null);
  return normalize(normalizeRequestFor(card, chosen) as Parameters<typeof normalize>[0]);
}

function actor(user: { id?: number; name: string } | null | undefined): Actor | null {
  return user && user.id !== undefined ? { id: user.id, name: user.name } : null;
}

type StoredValue = CardValue | TcValue;

/** What makes two stored values the same, apart from who confirmed them and when. */
function fingerprint(v: StoredValue | undefined): string {
  if (!v) return '';
  const p = v.provenance;
  return JSON.stringify([v.value, v.printed, 'unit' in v ? v.unit : null, p.source, p.datasheetId, p.page, p.text, p.confirmedBy !== null]);
}

/** The input as stored: provenance completed, confirmation kept when a confirmed value did not change. */
export function storedFields(input: RatingCardFieldsParsed, previous: RatingCardFields | null, who: Actor | null, now: string): RatingCardFields {
  const out: RatingCardFields = {};
  const vzNom = input.vzNom.value;
  for (const field of CARD_FIELDS) {
    const value = input[field];
    if (!value) continue;
    const base: CardValue = {
      value: value.value,
      printed: value.printed ?? null,
      provenance: {
        source: value.provenance.source,
        datasheetId: value.provenance.datasheetId ?? null,
        page: value.provenance.page ?? null,
        text: value.provenance.text ?? null,
        confirmedBy: value.confirmed ? who : null,
        confirmedAt: value.confirmed && who ? now : null,
      },
    };
    const stored: StoredValue =
      field === 'tc' && 'unit' in value
        ? { ...base, unit: value.unit, voltsPerKelvin: tcVoltsPerKelvin({ value: value.value, unit: value.unit }, vzNom) }
        : base;
    const before = previous?.[field];
    if (before && before.provenance.confirmedBy && stored.provenance.confirmedBy && fingerprint(before) === fingerprint(stored)) {
      stored.provenance.confirmedBy = before.provenance.confirmedBy;
      stored.provenance.confirmedAt = before.provenance.confirmedAt;
    }
    (out as Record<CardField, StoredValue>)[field] = stored;
  }
  return out;
}

/** Fields whose value, unit, provenance or confirmation differ (tc also when its V/K moved with vzNom). */
/** Old → new of each changed field, for the card history. */
export function fieldChanges(before: RatingCardFields | null, after: RatingCardFields, changed: readonly string[]): CardFieldChange[] {
  const side = (fields: RatingCardFields | null, field: string): CardFieldChange['from'] => {
    const v = fields?.[field as keyof RatingCardFields];
    if (!v) return null;
    return field === 'tc' ? { value: v.value, unit: (v as TcValue).unit } : { value: v.value };
  };
  return changed.map((field) => ({ field, from: side(before, field), to: side(after, field) }));
}

export function diffFields(before: RatingCardFields | null, after: RatingCardFields): string[] {
  return CARD_FIELDS.filter((f) => {
    const a = before?.[f];
    const b = after[f];
    if (fingerprint(a) !== fingerprint(b)) return true;
    return f === 'tc' && a && b && (a as TcValue).voltsPerKelvin !== (b as TcValue).voltsPerKelvin;
  });
}
