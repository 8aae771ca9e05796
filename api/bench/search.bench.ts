/**
 * The designers' search at 100 000 vendor parts: the service and repository behind
 * GET /api/search (SQL narrowing, fuse.js ranking, the page read in full) on a throw-away
 * MariaDB with the real migrations, 2 000 house parts with 10 000 sources and about 6 000
 * qualification cases in every state. Beside it the ranking step alone, per candidate,
 * and a primary-key lookup as the floor for one round trip. Figures only; never a timed test.
 */
import 'reflect-metadata';
import { rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { SEARCH_TEXT_CANDIDATES, searchQuerySchema } from '@shuntwise/contracts';
import { QueryTypes, Sequelize } from 'sequelize';
import { migrateUp } from '../src/database/migrator';
import { freePort } from '../src/dev/free-port';
import { ensureDatabase, startMariaDb } from '../src/dev/mariadb-server';
import { RawRows } from '../src/database/raw-rows';
import { SearchRepository } from '../src/search/search.repository';
import { SearchService } from '../src/search/search.service';
import { rankByText, type TextRecord } from '../src/search/text-ranking';
import { TextIndexRepository } from '../src/text-index/text-index.repository';
import { median, p90, seededRandom } from './bench-support';
import { ALTERNATES, HOUSE_PARTS, loadLargeCatalogue, PACKAGES } from './large-catalogue';

const PARTS = Number(process.env.BENCH_PARTS ?? 100_000);
const ROUNDS = 15;

async function main() {
  const dir = resolve(__dirname, '..', '..', '.data-test', `bench-search-${process.pid}`);
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
    await loadLargeCatalogue(sequelize, PARTS);
    const [{ n: caseCount }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM qualifications', { type: QueryTypes.SELECT });
    console.log(
      `loaded ${PARTS} vendor parts (90 % with cards), ${HOUSE_PARTS} house parts, ${HOUSE_PARTS * (1 + ALTERNATES)} sources, ${caseCount} cases in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );

    const service = new SearchService(new SearchRepository(sequelize as never, new RawRows(sequelize as never)), new TextIndexRepository(sequelize as never));
    const floor: number[] = [];
    for (let r = 0; r < ROUNDS; r++) {
      const s = performance.now();
      await sequelize.query('SELECT id FROM vendor_parts WHERE id = ?', { replacements: [1 + r], type: QueryTypes.SELECT });
      floor.push(performance.now() - s);
    }
    const floorMs = median(floor);
    console.log(`${'primary-key lookup (floor)'.padEnd(52)} median ${floorMs.toFixed(2).padStart(7)} ms`);

    const facets: number[] = [];
    let usable = 0;
    for (let r = 0; r < 5; r++) {
      const s = performance.now();
      usable = (await service.facets()).clearedParts;
      facets.push(performance.now() - s);
    }
    console.log(`${'GET /search/facets'.padEnd(52)} median ${median(facets).toFixed(2).padStart(7)} ms   (${usable} usable parts)`);

    const cases: Array<[string, Record<string, string>]> = [
      ['usable, first page by Vz', {}],
      ['usable, page 100 of 25', { pageIndex: '100' }],
      ['usable, Vz 4.5…5.5 V, SOD-123, ≥ 0.5 W', { vzFrom: '4.5', vzTo: '5.5', package: 'SOD-123', pdMin: '0.5' }],
      ['usable, window in 4.5…5.5 V, tolerance ≤ 2 %', { vzFrom: '4.5', vzTo: '5.5', vzWindow: 'true', toleranceMax: '0.02' }],
      ['usable, one house part', { housePartId: '777' }],
      ['usable, two manufacturers, by -pdMax', { manufacturer: 'Invented Maker 03,Invented Maker 17', sort: '-pdMax' }],
      ['catalogue, first page by Vz', { includeNotCleared: 'true' }],
      ['catalogue, Vz 4.5…5.5 V', { includeNotCleared: 'true', vzFrom: '4.5', vzTo: '5.5' }],
      ['text "ZX07-5V1" (usable)', { q: 'ZX07-5V1' }],
      ['text "ZX7-5V1" typo, Vz 4.5…5.5 V (usable)', { q: 'ZX7-5V1', vzFrom: '4.5', vzTo: '5.5' }],
      ['text "HP-00777" (usable)', { q: 'HP-00777' }],
      ['text "gate protection" (usable)', { q: 'gate protection' }],
      ['text "ZX07-5V1" (catalogue)', { q: 'ZX07-5V1', includeNotCleared: 'true' }],
      ['text "ZX" (catalogue, too many)', { q: 'ZX', includeNotCleared: 'true' }],
    ];
    for (const [name, raw] of cases) {
      const query = searchQuerySchema.parse(raw);
      const times: number[] = [];
      let info = '';
      for (let r = 0; r < ROUNDS; r++) {
        const s = performance.now();
        const page = await service.search(query);
        times.push(performance.now() - s);
        info = `${page.total} match, text ${page.text.mode}${page.text.mode !== 'none' ? ` over ${page.text.candidates}` : ''}${page.text.truncated ? ', truncated' : ''}`;
      }
      console.log(
        `${name.padEnd(52)} median ${median(times).toFixed(2).padStart(7)} ms   p90 ${p90(times).toFixed(2).padStart(7)} ms   ×${(median(times) / floorMs).toFixed(0).padStart(4)} floor   (${info})`,
      );
    }

    // The ranking step alone, over candidates shaped like the SQL's.
    const rnd = seededRandom(7);
    const records: TextRecord[] = Array.from({ length: SEARCH_TEXT_CANDIDATES }, (_, i) => {
      const vz = (2.4 + rnd() * 70).toFixed(1).replace('.', 'V');
      return {
        id: i + 1,
        mpn: `ZX${String(i % 40).padStart(2, '0')}-${vz}-${i}`,
        manufacturer: `Invented Maker ${String(i % 40).padStart(2, '0')}`,
        package: PACKAGES[i % PACKAGES.length],
        houseParts: [`HP-${String(i % 2000).padStart(5, '0')}`],
        descriptions: ['Regulator diode, invented bench part, clamp'],
      };
    });
    for (const n of [500, 1000, SEARCH_TEXT_CANDIDATES]) {
      const slice = records.slice(0, n);
      const times: number[] = [];
      for (let r = 0; r < ROUNDS; r++) {
        const s = performance.now();
        rankByText(slice, r % 2 ? 'ZX07-5V1' : 'maker 07 clamp');
        times.push(performance.now() - s);
      }
      const ms = median(times);
      console.log(`${`ranking alone, ${n} candidates`.padEnd(52)} median ${ms.toFixed(2).padStart(7)} ms   (${((ms * 1000) / n).toFixed(1)} µs per candidate)`);
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
