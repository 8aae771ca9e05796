import { QueryTypes, Sequelize } from 'sequelize';
import { createMigrator } from '../src/database/migrator';
import { MIGRATIONS } from '../src/database/migrations';
import { DemoSeedService } from '../src/seed/demo-seed.service';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('migrations (real MariaDB)', () => {
  let sequelize: Sequelize;
  const name = `t_migr_${process.pid}`;

  beforeAll(async () => {
    const admin = new Sequelize({
      dialect: 'mariadb',
      host: '127.0.0.1',
      port: Number(process.env.TEST_DB_PORT),
      username: 'tester',
      password: 'tester-only-local',
      logging: false,
    });
    await admin.query(`CREATE DATABASE \`${name}\``, { type: QueryTypes.RAW }).catch(() => undefined);
    await admin.close();
    sequelize = new Sequelize({
      dialect: 'mariadb',
      host: '127.0.0.1',
      port: Number(process.env.TEST_DB_PORT),
      database: name,
      username: 'tester',
      password: 'tester-only-local',
      logging: false,
    });
  });
  afterAll(async () => {
    await sequelize.query(`DROP DATABASE \`${name}\``, { type: QueryTypes.RAW });
    await sequelize.close();
  });

  const tables = async () =>
    (
      await sequelize.query<{ t: string }>('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ?', {
        replacements: [name],
        type: QueryTypes.SELECT,
      })
    )
      .map((r) => r.t)
      .filter((t) => t !== 'schema_migrations')
      .sort();

  it('run up from an empty database, down to empty again, and up again', async () => {
    expect(await tables()).toEqual([]);
    const migrator = createMigrator(sequelize);
    const up = await migrator.up();
    expect(up.map((m) => m.name)).toEqual(MIGRATIONS.map((m) => m.name));
    expect(await tables()).toEqual(expect.arrayContaining(['users', 'invitations', 'outgoing_mail', 'captured_mail']));
    expect(await migrator.pending()).toEqual([]);

    await migrator.down({ to: 0 });
    expect(await tables()).toEqual([]);

    const again = await migrator.up();
    expect(again).toHaveLength(MIGRATIONS.length);
  });
});

describe('demo seed', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seed: 'users' });
  });
  afterAll(() => t.close());

  it('is idempotent: a second run adds nothing and keeps changed data', async () => {
    const count = async () => (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM users'))[0].n;
    const before = Number(await count());
    expect(before).toBe(5);
    await t.exec("UPDATE users SET name = 'Renamed Person' WHERE email = 'buyer@demo.test'");
    const second = await t.stack.app.get(DemoSeedService).run('users');
    expect(second.created).toBe(0);
    expect(Number(await count())).toBe(before);
    const [buyer] = await t.select<{ name: string }>("SELECT name FROM users WHERE email = 'buyer@demo.test'");
    expect(buyer.name).toBe('Renamed Person');
  });
});
