import { readFileSync } from 'node:fs';
import { Injectable } from '@nestjs/common';
import type { DemoCatalogue } from '@shuntwise/test-fixtures';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { MeasurementSetsService } from '../measurements/measurement-sets.service';
import { UsersRepository } from '../users/users.repository';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';

const MEASURING_ENGINEER = 'engineer@demo.test';

/**
 * The invented bench measurements of a few demo parts (@shuntwise/test-fixtures/measurements),
 * uploaded through the same service the API uses, so their files sit in the object store and a
 * decided case of a measured part is flagged for re-check. Idempotent: a file already stored for
 * its part (same sha256) is left alone.
 */
@Injectable()
export class MeasurementsSeeder {
  constructor(
    private readonly users: UsersRepository,
    private readonly vendorParts: VendorPartsRepository,
    private readonly measurements: MeasurementSetsService,
  ) {}

  async run(): Promise<{ created: number }> {
    const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');
    const catalogue: DemoCatalogue = fixtures.loadDemoCatalogue();
    const engineer = await this.users.findByEmail(MEASURING_ENGINEER);
    if (!engineer) throw new Error(`the demo measurements need the demo account ${MEASURING_ENGINEER}`);
    const user: AuthUser = { id: engineer.id, email: engineer.email, name: engineer.name, role: engineer.role };
    const vendorName = new Map(catalogue.vendors.map((v) => [v.code, v.name]));
    let created = 0;
    for (const m of fixtures.listMeasurementFixtures()) {
      const [part] = await this.vendorParts.findByNames([{ manufacturer: vendorName.get(m.vendor)!, mpn: m.mpn }]);
      if (!part) continue;
      const buffer = readFileSync(m.csvPath);
      if (await this.measurements.isStored(part.id, buffer)) continue;
      await this.measurements.upload(
        { buffer, originalName: m.file },
        { vendorPartId: part.id, instrument: m.instrument, measuredOn: m.measuredOn, note: m.note },
        user,
      );
      created++;
    }
    return { created };
  }
}
