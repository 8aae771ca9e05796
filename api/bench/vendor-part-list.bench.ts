/**
 * Vendor-part lists at 100 000 parts: the repository's list query (the SQL behind
 * GET /api/vendor-parts) for the sorts and filters the web's table sends, on a throw-away
 * MariaDB with the real migrations. Prints the median and the 90th percentile of each;
 * beside them, a primary-key lookup on the same connection as the floor for one round trip.
 * Figures only; never a timed test.
 */
import 'reflect-metadata';
import { rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { vendorPartListQuerySchema } from '@shuntwise/contracts';
import { QueryTypes, Sequelize } from 'sequelize';
import { migrateUp } from '../src/database/migrator';
import { freePort } from '../src/dev/free-port';
import { ensureDatabase, startMariaDb } from '../src/dev/mariadb-server';
import { VendorPartsRepository } from '../src/vendor-parts/vendor-parts.repository';
import { TextIndexRepository } from '../src/text-index/text-index.repository';
import { median, p90, seededRandom } from './bench-support';

const PARTS = 100_000;
const MAKERS = 40;
const ROUNDS = 25;

async function main() {
  const dir = resolve(__dirname, '..', '..', '.data-test', `bench-list-${process.pid}`);
  const server = await startMariaDb({ dir, port: await freePort(), quiet: true });
  try {
    await ensureDatabase(server, 'bench', 'bench', 'bench-only-local');
    const sequelize = new Sequelize({
      dialect: 'mariadb',
      host: '127.0.0.1',
      port: server.port,
      database: 'bench',
      username: 'bench',
      password: 'bench-only-local',
      logging: false,
      define: { underscored: true },
      timezone: '+00:00',
    });
    await migrateUp(sequelize);

    const t0 = performance.now();
    const rnd = seededRandom(20261201);
    const makers = Array.from({ length: MAKERS }, (_, i) => `Invented Maker ${String(i).padStart(2, '0')}`);
    await sequelize.query(`INSERT INTO manufacturers (name, created_at, updated_at) VALUES ${makers.map(() => '(?, NOW(), NOW())').join(', ')}`, {
      replacements: makers,
      type: QueryTypes.INSERT,
    });
    const packages = ['SOD-123', 'SOD-123F', 'SOD-323', 'SOD-523', 'DO-35', 'DO-41', 'SMA', 'SOT-23'];
    const CHUNK = 2000;
    for (let start = 0; start < PARTS; start += CHUNK) {
      const parts: unknown[] = [];
      const cards: unknown[] = [];
      for (let i = start; i < Math.min(PARTS, start + CHUNK); i++) {
        const vz = Math.round(Math.exp(Math.log(2.4) + rnd() * Math.log(75 / 2.4)) * 10) / 10;
        const maker = Math.floor(rnd() * MAKERS);
        const hasCard = rnd() < 0.9;
        const mpn = `ZX${String(maker).padStart(2, '0')}-${vz.toFixed(1).replace('.', 'V')}-${i}`;
        parts.push(
          i + 1,
          maker + 1,
          makers[maker],
          mpn,
          packages[i % packages.length],
          hasCard ? 1 : null,
          hasCard ? vz : null,
          hasCard ? 0.005 : null,
          hasCard ? (rnd() < 0.5 ? 0.5 : 1.3) : null,
        );
        if (hasCard) cards.push(i + 1);
      }
      await sequelize.query(
        `INSERT INTO vendor_parts (id, manufacturer_id, manufacturer_name, mpn, package, card_version, vz_nom, izt, pd_max, created_at, updated_at) VALUES ${Array.from({ length: parts.length / 9 }, () => '(?, ?, ?, ?, ?, ?, ?, ?, ?, NOW(), NOW())').join(', ')}`,
        { replacements: parts, type: QueryTypes.INSERT },
      );
      await sequelize.query(
        `INSERT INTO rating_cards (vendor_part_id, version, fields, created_at, updated_at) VALUES ${cards.map(() => "(?, 1, '{}', NOW(), NOW())").join(', ')}`,
        {
          replacements: cards,
          type: QueryTypes.INSERT,
        },
      );
    }
    // The text index, as the repositories write it with each part (here in bulk).
    const textIndex = new TextIndexRepository(sequelize as never);
    const names = await sequelize.query<{ id: number; mpn: string }>('SELECT id, mpn FROM vendor_parts', { type: QueryTypes.SELECT });
    await textIndex.writeNew(
      'vendorPart',
      names.map((n) => ({ id: n.id, texts: [n.mpn] })),
    );
    const makerRows = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM manufacturers', { type: QueryTypes.SELECT });
    await textIndex.writeNew(
      'manufacturer',
      makerRows.map((m) => ({ id: m.id, texts: [m.name] })),
    );
    await sequelize.query('ANALYZE TABLE vendor_parts, rating_cards, manufacturers, text_grams', { type: QueryTypes.SELECT });
    console.log(`loaded ${PARTS} vendor parts (${MAKERS} manufacturers, about 90 % with cards) in ${((performance.now() - t0) / 1000).toFixed(1)} s`);

    const repository = new VendorPartsRepository(sequelize as never, undefined as never, undefined as never, textIndex);
    const cases: Array<[string, Record<string, string>]> = [
      ['first page, by mpn', {}],
      ['page 1000 of 50, by mpn', { pageIndex: '1000' }],
      ['by manufacturer, then mpn', { sort: 'manufacturer,mpn' }],
      ['by vzNom descending', { sort: '-vzNom' }],
      ['by pdMax, then vzNom', { sort: 'pdMax,vzNom' }],
      ['by updatedAt descending', { sort: '-updatedAt' }],
      ['mpn prefix "ZX07-5V1"', { mpn: 'ZX07-5V1' }],
      ['global filter "Invented Maker 3"', { q: 'Invented Maker 3' }],
      ['substring "5V1-77" (n-gram index)', { q: '5V1-77' }],
      ['vzNom 4.5…5.5 V, by vzNom', { vzNomMin: '4.5', vzNomMax: '5.5', sort: 'vzNom' }],
      ['one manufacturer, by vzNom', { manufacturer: 'Invented Maker 13', sort: 'vzNom' }],
      ['package SOD-323, by mpn', { package: 'SOD-323' }],
      ['without a card', { hasCard: 'false' }],
    ];
    const floor: number[] = [];
    for (let r = 0; r < ROUNDS; r++) {
      const s = performance.now();
      await sequelize.query('SELECT id FROM vendor_parts WHERE id = ?', { replacements: [1 + r], type: QueryTypes.SELECT });
      floor.push(performance.now() - s);
    }
    console.log(`${'primary-key lookup (floor)'.padEnd(34)} median ${median(floor).toFixed(2).padStart(7)} ms   p90 ${p90(floor).toFixed(2).padStart(7)} ms`);
    for (const [name, raw] of cases) {
      const query = vendorPartListQuerySchema.parse(raw);
      const times: number[] = [];
      let total = 0;
      for (let r = 0; r < ROUNDS; r++) {
        const s = performance.now();
        total = (await repository.list(query)).total;
        times.push(performance.now() - s);
      }
      console.log(
        `${name.padEnd(34)} median ${median(times).toFixed(2).padStart(7)} ms   p90 ${p90(times).toFixed(2).padStart(7)} ms   (${total} rows match, page + count)`,
      );
    }
    await sequelize.close();
  } finally {
    await server.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message.slice(0, 2000) : error);
  process.exit(1);
});
