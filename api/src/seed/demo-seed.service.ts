import { Inject, Injectable, Logger } from '@nestjs/common';
import { hashPassword } from '../auth/passwords';
import { ENV, type Env } from '../config/env';
import { QualificationsSeeder } from '../qualifications/qualifications-seeder.service';
import { UsersRepository } from '../users/users.repository';
import { CatalogueSeeder } from './catalogue-seeder.service';
import { DEMO_USERS } from './demo-users';
import { MeasurementsSeeder } from './measurements-seeder.service';

/**
 * Loads the local demo. Idempotent: every record is looked up by its natural key first,
 * so a second start keeps what is there (including changed passwords) and adds nothing twice.
 */
/** 'users': the demo accounts only (fast, for tests); 'demo': the whole invented catalogue too. */
export type SeedLevel = 'none' | 'users' | 'demo';

@Injectable()
export class DemoSeedService {
  private readonly logger = new Logger('Seed');

  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly users: UsersRepository,
    private readonly catalogue: CatalogueSeeder,
    private readonly qualifications: QualificationsSeeder,
    private readonly measurements: MeasurementsSeeder,
  ) {}

  async run(level: SeedLevel = 'demo'): Promise<{ created: number }> {
    if (level === 'none') return { created: 0 };
    let created = 0;
    let hash: string | undefined;
    for (const demo of DEMO_USERS) {
      if (await this.users.findByEmail(demo.email)) continue;
      hash ??= await hashPassword(this.env.DEMO_PASSWORD);
      await this.users.create({ email: demo.email, name: demo.name, role: demo.role, passwordHash: hash });
      created++;
    }
    if (level === 'demo') created += (await this.catalogue.run()).created;
    if (level === 'demo') created += (await this.qualifications.run()).created;
    // After the cases, so a decided case of a measured part shows the re-check the new evidence asks for.
    if (level === 'demo') created += (await this.measurements.run()).created;
    if (created) this.logger.log(`demo: ${created} records added`);
    return { created };
  }
}
