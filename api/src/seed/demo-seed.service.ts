import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { hashPassword } from '../auth/passwords';
import { ENV, type Env } from '../config/env';
import { QualificationsSeeder } from './qualifications-seeder.service';
import { UsersRepository } from '../users/users.repository';
import { CatalogueSeeder } from './catalogue-seeder.service';
import { DEMO_USERS } from './demo-users';
import { MeasurementsSeeder } from './measurements-seeder.service';

/** 'users': the demo accounts only (fast, for tests); 'demo': the whole invented catalogue too. */
export type SeedLevel = 'none' | 'users' | 'demo';

type SeedStep = 'users' | 'catalogue' | 'qualifications' | 'measurements';

/**
 * Loads the local demo, once. Each step (accounts, catalogue, qualification cases, bench measurements) is
 * recorded in `demo_seed_steps` when it completes, and a recorded step never runs again:
 * a restart keeps what people did to the demo (a buyer who stopped following a part, a
 * removed datasheet, a changed password) instead of putting demo rows back. Inside a step
 * every record is looked up by its natural key first, so a step cut short by a crash is
 * finished on the next start without doubles.
 */
@Injectable()
export class DemoSeedService {
  private readonly logger = new Logger('Seed');

  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly users: UsersRepository,
    private readonly catalogue: CatalogueSeeder,
    private readonly qualifications: QualificationsSeeder,
    private readonly measurements: MeasurementsSeeder,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  async run(level: SeedLevel = 'demo'): Promise<{ created: number }> {
    if (level === 'none') return { created: 0 };
    let created = await this.step('users', () => this.seedUsers());
    if (level === 'demo') created += await this.step('catalogue', async () => (await this.catalogue.run()).created);
    if (level === 'demo') created += await this.step('qualifications', async () => (await this.qualifications.run()).created);
    // After the cases, so a decided case of a measured part shows the re-check the new evidence asks for.
    if (level === 'demo') created += await this.step('measurements', async () => (await this.measurements.run()).created);
    if (created) this.logger.log(`demo: ${created} records added`);
    return { created };
  }

  private async step(name: SeedStep, load: () => Promise<number>): Promise<number> {
    const [done] = await this.sequelize.query('SELECT name FROM demo_seed_steps WHERE name = ?', { replacements: [name], type: QueryTypes.SELECT });
    if (done) return 0;
    const records = await load();
    await this.sequelize.query('INSERT IGNORE INTO demo_seed_steps (name, records, done_at) VALUES (?, ?, ?)', {
      replacements: [name, records, new Date()],
      type: QueryTypes.INSERT,
    });
    return records;
  }

  private async seedUsers(): Promise<number> {
    let created = 0;
    let hash: string | undefined;
    for (const demo of DEMO_USERS) {
      if (await this.users.findByEmail(demo.email)) continue;
      hash ??= await hashPassword(this.env.DEMO_PASSWORD);
      await this.users.create({ email: demo.email, name: demo.name, role: demo.role, passwordHash: hash });
      created++;
    }
    return created;
  }
}
