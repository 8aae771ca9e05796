import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import {
  DESIGNER_HOUSE_PART_STATUSES,
  QUALIFICATION_STATE_LABELS,
  isUsableState,
  type AddSourceRequest,
  type CreateHousePartRequest,
  type HousePart as HousePartDto,
  type HousePartListQuery,
  type Page,
  type PutSpecRequest,
  type Source,
  type Spec,
  type SpecVersion,
  type SpecVersionSummary,
  type UpdateHousePartRequest,
  type UpdateSourceRequest,
} from '@shuntwise/contracts';
import { sameSpec } from '@shuntwise/contracts';
import { UniqueConstraintError } from 'sequelize';
import { UnitOfWork } from '../database/unit-of-work';
import { CatalogueEvents } from '../catalogue-events/catalogue-events.service';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { StaleConflictException } from '../common/errors/stale-conflict.exception';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';
import type { HousePartSpec } from './house-part-spec.model';
import { HousePartsRepository, type HousePartRow, type SourceRow } from './house-parts.repository';

type ParsedSpecRequest = Omit<PutSpecRequest, 'spec'> & { spec: Spec };

@Injectable()
export class HousePartsService {
  constructor(
    private readonly houseParts: HousePartsRepository,
    private readonly vendorParts: VendorPartsRepository,
    private readonly events: CatalogueEvents,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  /** Designers are offered no drafts (contracts DESIGNER_HOUSE_PART_STATUSES); the other roles see every house part. */
  async list(query: HousePartListQuery, user: AuthUser): Promise<Page<HousePartDto>> {
    const { rows, total } = await this.houseParts.list(query, user.role === 'designer' ? DESIGNER_HOUSE_PART_STATUSES : undefined);
    return { items: rows.map(toHousePartDto), total, pageIndex: query.pageIndex, pageSize: query.pageSize };
  }

  async get(id: number): Promise<HousePartDto> {
    const row = await this.houseParts.findRow(id);
    if (!row) throw new NotFoundException(`No house part with id ${id}`);
    return toHousePartDto(row);
  }

  async create(request: CreateHousePartRequest, user: AuthUser): Promise<HousePartDto> {
    try {
      const part = await this.houseParts.create({
        partNumber: request.partNumber,
        description: request.description ?? '',
        status: request.status ?? 'draft',
        createdById: user.id,
      });
      return this.get(part.id);
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw duplicatePartNumber(request.partNumber);
      throw error;
    }
  }

  async update(id: number, request: UpdateHousePartRequest): Promise<HousePartDto> {
    const part = await this.houseParts.findById(id);
    if (!part) throw new NotFoundException(`No house part with id ${id}`);
    try {
      await this.houseParts.update(part, request);
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw duplicatePartNumber(request.partNumber ?? part.partNumber);
      throw error;
    }
    return this.get(id);
  }

  /** The current spec, or `version`; 404 when there is none. Also what the qualification reads. */
  async spec(housePartId: number, version?: number): Promise<SpecVersion> {
    const part = await this.houseParts.findById(housePartId);
    if (!part) throw new NotFoundException(`No house part with id ${housePartId}`);
    const wanted = version ?? part.specVersion;
    if (wanted === null) throw new NotFoundException(`House part ${part.partNumber} has no spec yet`);
    const row = await this.houseParts.findSpec(housePartId, wanted);
    if (!row) throw new NotFoundException(`House part ${part.partNumber} has no spec version ${wanted}`);
    return toSpecDto(row);
  }

  /** The current spec, or null while the house part has none yet (404 only for a house part that does not exist). */
  async currentSpec(housePartId: number): Promise<SpecVersion | null> {
    const part = await this.houseParts.findById(housePartId);
    if (!part) throw new NotFoundException(`No house part with id ${housePartId}`);
    return part.specVersion === null ? null : this.spec(housePartId, part.specVersion);
  }

  async specVersions(housePartId: number): Promise<SpecVersionSummary[]> {
    if (!(await this.houseParts.findById(housePartId))) throw new NotFoundException(`No house part with id ${housePartId}`);
    return (await this.houseParts.listSpecVersions(housePartId)).map((row) => {
      const { spec: _spec, ...summary } = toSpecDto(row);
      return summary;
    });
  }

  /**
   * A new spec version based on `baseVersion`; a stale base is a 409 (nothing is
   * overwritten), an unchanged spec makes no new version. Subscribers hear of it in the
   * same transaction.
   */
  async putSpec(housePartId: number, request: ParsedSpecRequest, user: AuthUser): Promise<SpecVersion> {
    const version = await this.unitOfWork.run(async (transaction) => {
      const part = await this.houseParts.findById(housePartId, transaction, true);
      if (!part) throw new NotFoundException(`No house part with id ${housePartId}`);
      const current = part.specVersion ?? 0;
      if (request.baseVersion !== current) {
        throw new StaleConflictException(
          `The spec of ${part.partNumber} is now at version ${current}; you edited version ${request.baseVersion}. Reload, compare and save again.`,
          {
            current: { version: current },
            errors: [{ path: 'baseVersion', message: `current version is ${current}` }],
          },
        );
      }
      if (current > 0) {
        // Nothing changed (a note alone is no change of the requirement): no version, no
        // event, so no decided case is flagged for a re-check it does not need.
        const previous = await this.houseParts.findSpec(housePartId, current, transaction);
        if (previous && sameSpec(previous.spec, request.spec)) return current;
      }
      const next = current + 1;
      await this.houseParts.createSpec({ housePartId, version: next, spec: request.spec, note: request.note ?? null, createdById: user.id }, transaction);
      await this.houseParts.update(part, { specVersion: next }, transaction);
      await this.events.publish({ kind: 'spec-changed', housePartId, version: next, previousVersion: current || null, userId: user.id }, transaction);
      return next;
    });
    return this.spec(housePartId, version);
  }

  async sources(housePartId: number): Promise<Source[]> {
    if (!(await this.houseParts.findById(housePartId))) throw new NotFoundException(`No house part with id ${housePartId}`);
    return (await this.houseParts.listSources(housePartId)).map(toSourceDto);
  }

  async addSource(housePartId: number, request: AddSourceRequest, user: AuthUser): Promise<Source> {
    const part = await this.houseParts.findById(housePartId);
    if (!part) throw new NotFoundException(`No house part with id ${housePartId}`);
    const vendorPart = await this.vendorParts.findById(request.vendorPartId);
    if (!vendorPart) throw new NotFoundException(`No vendor part with id ${request.vendorPartId}`);
    try {
      // A link only makes a candidate: the standing comes from decisions on its cases.
      await this.houseParts.createSource({ housePartId, vendorPartId: request.vendorPartId, note: request.note ?? null, addedById: user.id });
    } catch (error) {
      if (error instanceof UniqueConstraintError) {
        throw new ConflictException(`${vendorPart.manufacturer!.name} ${vendorPart.mpn} is already a source of ${part.partNumber}`);
      }
      throw error;
    }
    return toSourceDto((await this.houseParts.findSourceRow(housePartId, request.vendorPartId))!);
  }

  /** The link's note only: the request schema refuses a role, which only decisions give. */
  async updateSource(housePartId: number, vendorPartId: number, request: UpdateSourceRequest): Promise<Source> {
    const source = await this.houseParts.findSource(housePartId, vendorPartId);
    if (!source) throw new NotFoundException(`Vendor part ${vendorPartId} is not a source of house part ${housePartId}`);
    if (request.note !== undefined) await this.houseParts.updateSource(source, { note: request.note });
    return toSourceDto((await this.houseParts.findSourceRow(housePartId, vendorPartId))!);
  }

  /**
   * Unlinks a candidate. A source that a decision made usable (approved, cleared) stays
   * linked until a decision ends that (revoke): unlinking it would take it off the buyers'
   * list with no decision, no audit entry and no mail. The link is locked first, as the
   * decisions read it, so a decision and an unlink cannot cross.
   */
  async removeSource(housePartId: number, vendorPartId: number): Promise<void> {
    await this.unitOfWork.run(async (transaction) => {
      const source = await this.houseParts.findSource(housePartId, vendorPartId, transaction, true);
      if (!source) throw new NotFoundException(`Vendor part ${vendorPartId} is not a source of house part ${housePartId}`);
      const decision = await this.houseParts.latestDecision(housePartId, vendorPartId, transaction);
      if (decision && isUsableState(decision.state)) {
        throw new ConflictException(
          `Vendor part ${vendorPartId} is ${QUALIFICATION_STATE_LABELS[decision.state].toLowerCase()} for house part ${housePartId} by case #${decision.id}: revoke it on that case first (POST /api/qualifications/${decision.id}/revoke), which records why and tells the buyers`,
        );
      }
      await this.houseParts.deleteSource(source, transaction);
    });
  }
}

function duplicatePartNumber(partNumber: string): ConflictException {
  return new ConflictException({ message: `House part ${partNumber} already exists`, errors: [{ path: 'partNumber', message: 'must be unique' }] });
}

export function toHousePartDto(row: HousePartRow): HousePartDto {
  return {
    id: row.id,
    partNumber: row.partNumber,
    description: row.description,
    status: row.status,
    specVersion: row.specVersion,
    sourceCount: Number(row.sourceCount),
    createdAt: new Date(row.createdAt).toISOString(),
    updatedAt: new Date(row.updatedAt).toISOString(),
    createdBy: row.createdById !== null && row.createdByName !== null ? { id: row.createdById, name: row.createdByName } : null,
  };
}

export function toSpecDto(row: HousePartSpec): SpecVersion {
  return {
    housePartId: row.housePartId,
    version: row.version,
    spec: row.spec,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdBy ? { id: row.createdBy.id, name: row.createdBy.name } : null,
  };
}

export function toSourceDto(row: SourceRow): Source {
  return {
    housePartId: row.housePartId,
    vendorPartId: row.vendorPartId,
    manufacturer: row.manufacturer,
    mpn: row.mpn,
    package: row.package,
    lifecycleNote: row.lifecycleNote,
    role: row.role,
    note: row.note,
    cardVersion: row.cardVersion,
    addedBy: row.addedById !== null && row.addedByName !== null ? { id: row.addedById, name: row.addedByName } : null,
    createdAt: new Date(row.createdAt).toISOString(),
    updatedAt: new Date(row.updatedAt).toISOString(),
  };
}
