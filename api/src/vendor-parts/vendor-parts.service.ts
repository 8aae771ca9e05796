import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type {
  CreateVendorPartRequest,
  Manufacturer,
  Page,
  UpdateVendorPartRequest,
  VendorPart as VendorPartDto,
  VendorPartDetail,
  VendorPartListQuery,
} from '@shuntwise/contracts';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { UnitOfWork } from '../database/unit-of-work';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import type { VendorPart } from './vendor-part.model';
import { VendorPartsRepository, type VendorPartRow } from './vendor-parts.repository';

@Injectable()
export class VendorPartsService {
  constructor(
    private readonly vendorParts: VendorPartsRepository,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  async list(query: VendorPartListQuery): Promise<Page<VendorPartDto>> {
    const { rows, total } = await this.vendorParts.list(query);
    return { items: rows.map(toVendorPartDto), total, pageIndex: query.pageIndex, pageSize: query.pageSize };
  }

  async get(id: number): Promise<VendorPartDetail> {
    const [row, part, datasheets, sourceOf] = await Promise.all([
      this.vendorParts.findRow(id),
      this.vendorParts.findById(id),
      this.vendorParts.datasheetsOf(id),
      this.vendorParts.sourceOf(id),
    ]);
    if (!row || !part) throw new NotFoundException(`No vendor part with id ${id}`);
    return {
      ...toVendorPartDto(row),
      createdBy: part.createdBy ? { id: part.createdBy.id, name: part.createdBy.name } : null,
      datasheets: datasheets.map((d) => ({ ...d, createdAt: new Date(d.createdAt).toISOString() })),
      sourceOf,
    };
  }

  async create(request: CreateVendorPartRequest, user: AuthUser): Promise<VendorPartDetail> {
    const id = await this.unitOfWork.run(async (transaction) => (await this.createIn(request, user, transaction)).id);
    return this.get(id);
  }

  /** Creates a vendor part inside the caller's transaction (the manufacturer too, when new). */
  async createIn(request: CreateVendorPartRequest, user: AuthUser | null, transaction: Transaction): Promise<VendorPart> {
    const manufacturer = await this.vendorParts.findOrCreateManufacturer(request.manufacturer, transaction);
    try {
      return await this.vendorParts.create(
        { manufacturer, mpn: request.mpn, package: request.package ?? null, lifecycleNote: request.lifecycleNote ?? null, createdById: user?.id ?? null },
        transaction,
      );
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw duplicate(manufacturer.name, request.mpn);
      throw error;
    }
  }

  /** Finds a vendor part by manufacturer and mpn inside a transaction, creating it when missing. */
  async findOrCreateIn(request: CreateVendorPartRequest, user: AuthUser | null, transaction: Transaction): Promise<{ part: VendorPart; created: boolean }> {
    const manufacturer = await this.vendorParts.findOrCreateManufacturer(request.manufacturer, transaction);
    const existing = await this.vendorParts.findByManufacturerAndMpn(manufacturer.id, request.mpn, transaction);
    if (existing) return { part: existing, created: false };
    return { part: await this.createIn(request, user, transaction), created: true };
  }

  async update(id: number, request: UpdateVendorPartRequest): Promise<VendorPartDetail> {
    await this.unitOfWork.run(async (transaction) => {
      const part = await this.vendorParts.findById(id, transaction, true);
      if (!part) throw new NotFoundException(`No vendor part with id ${id}`);
      const values: Parameters<VendorPartsRepository['update']>[1] = {};
      if (request.manufacturer !== undefined) values.manufacturer = await this.vendorParts.findOrCreateManufacturer(request.manufacturer, transaction);
      if (request.mpn !== undefined) values.mpn = request.mpn;
      if (request.package !== undefined) values.package = request.package;
      if (request.lifecycleNote !== undefined) values.lifecycleNote = request.lifecycleNote;
      try {
        await this.vendorParts.update(part, values, transaction);
      } catch (error) {
        if (error instanceof UniqueConstraintError) throw duplicate(request.manufacturer ?? part.manufacturer!.name, request.mpn ?? part.mpn);
        throw error;
      }
    });
    return this.get(id);
  }

  manufacturers(): Promise<Manufacturer[]> {
    return this.vendorParts.listManufacturers();
  }
}

function duplicate(manufacturer: string, mpn: string): ConflictException {
  return new ConflictException({
    message: `${manufacturer} ${mpn} already exists: a manufacturer part number is unique per manufacturer`,
    errors: [{ path: 'mpn', message: `${mpn} already exists for ${manufacturer}` }],
  });
}

export function toVendorPartDto(row: VendorPartRow): VendorPartDto {
  return {
    id: row.id,
    manufacturer: row.manufacturer,
    mpn: row.mpn,
    package: row.package,
    lifecycleNote: row.lifecycleNote,
    card:
      row.cardVersion === null
        ? null
        : { version: row.cardVersion, vzNom: Number(row.vzNom), izt: Number(row.izt), pdMax: row.pdMax === null ? null : Number(row.pdMax) },
    createdAt: new Date(row.createdAt).toISOString(),
    updatedAt: new Date(row.updatedAt).toISOString(),
  };
}
