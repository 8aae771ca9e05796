import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { User } from '../users/user.model';
import { MeasurementSetRow } from './measurement-set.model';

/** The only place that queries measurement sets. */
@Injectable()
export class MeasurementSetsRepository {
  constructor(@InjectModel(MeasurementSetRow) private readonly sets: typeof MeasurementSetRow) {}

  findById(id: number): Promise<MeasurementSetRow | null> {
    return this.sets.findByPk(id, { include: [{ model: User, attributes: ['id', 'name'] }] });
  }

  findByVendorPart(vendorPartId: number): Promise<MeasurementSetRow[]> {
    return this.sets.findAll({
      where: { vendorPartId },
      include: [{ model: User, attributes: ['id', 'name'] }],
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
    });
  }

  findBySha256(vendorPartId: number, sha256: string): Promise<MeasurementSetRow | null> {
    return this.sets.findOne({ where: { vendorPartId, sha256 } });
  }

  create(
    values: Pick<
      MeasurementSetRow,
      | 'vendorPartId'
      | 'storageKey'
      | 'sha256'
      | 'fileName'
      | 'sizeBytes'
      | 'lot'
      | 'instrument'
      | 'measuredOn'
      | 'note'
      | 'samples'
      | 'sampleCount'
      | 'pointCount'
      | 'uploadedById'
    >,
    transaction: Transaction,
  ): Promise<MeasurementSetRow> {
    return this.sets.create(values, { transaction });
  }
}
