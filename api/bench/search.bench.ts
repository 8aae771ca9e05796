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
import { SearchRepository } from '../src/search/search.repository';
import { SearchService } from '../src/search/search.service';
import { rankByText, type TextRecord } from '../src/search/text-ranking';
import { median, p90, seededRandom } from './bench-support';

const PARTS = 100_000;
const MAKERS = 40;
const HOUSE_PARTS = 2_000;
const ALTERNATES = 4;
const ROUNDS = 15;
const PACKAGES = ['SOD-123', 'SOD-123F', 'SOD-323', 'SOD-523', 'DO-35', 'DO-41', 'SMA', 'SMB', 'SOT-23', 'MELF'];


const value = (v: number) => ({ value: v, printed: null, provenance: { source: 'imported', datasheetId: null, page: null, text: null, confirmedBy: null, confirmedAt: null } });

async function load(sequelize: Sequelize): Promise<void> {
  const rnd = seededRandom(20261207);
  const insert = (sql: string, replacements: unknown[]) => sequelize.query(sql, { replacements, type: QueryTypes.INSERT });
  await insert(`INSERT INTO users (id, email, name, role, created_at, updated_at) VALUES (1, 'bench@example.invalid', 'Bench Engineer', 'engineer', NOW(), NOW())`, []);
  const makers = Array.from({ length: MAKERS }, (_, i) => `Invented Maker ${String(i).padStart(2, '0')}`);
  await insert(`INSERT INTO manufacturers (name, created_at, updated_at) VALUES ${makers.map(() => '(?, NOW(), NOW())').join(', ')}`, makers);
  const CHUNK = 2000;
  for (let start = 0; start < PARTS; start += CHUNK) {
    const parts: unknown[] = [];
    const cards: unknown[] = [];
    for (let i = start; i < Math.min(PARTS, start + CHUNK); i++) {
      const vz = Math.round(Math.exp(Math.log(2.4) + rnd() * Math.log(75 / 2.4)) * 10) / 10;
      const maker = Math.floor(rnd() * MAKERS);
      const hasCard = rnd() < 0.9;
      const tol = [0.01, 0.02, 0.05, 0.05, 0.1][Math.floor(rnd() * 5)];
      const pd = [0.35, 0.5, 0.5, 1, 1.5, 3][Math.floor(rnd() * 6)];
      const izt = vz < 12 ? 0.005 : 0.002;
      const mpn = `ZX${String(maker).padStart(2, '0')}-${vz.toFixed(1).replace('.', 'V')}-${i}`;
      parts.push(i + 1, maker + 1, makers[maker], mpn, PACKAGES[i % PACKAGES.length], hasCard ? 1 : null, hasCard ? vz : null, hasCard ? izt : null, hasCard ? pd : null);
      if (hasCard) {
        const fields = {
          vzMin: value(Number((vz * (1 - tol)).toFixed(3))),
          vzNom: value(vz),
          vzMax: value(Number((vz * (1 + tol)).toFixed(3))),
          izt: value(izt),
          zzt: value(Math.round(5 + vz * 1.5)),
          izk: value(0.00025),
          zzk: value(Math.round(400 + vz * 20)),
          pdMax: value(pd),
          tjMax: value(150),
          rthJA: value(Math.round(125 / pd)),
        };
        cards.push(i + 1, JSON.stringify(fields));
      }
    }
    await insert(
      `INSERT INTO vendor_parts (id, manufacturer_id, manufacturer_name, mpn, package, card_version, vz_nom, izt, pd_max, created_at, updated_at) VALUES ${Array.from({ length: parts.length / 9 }, () => '(?, ?, ?, ?, ?, ?, ?, ?, ?, NOW(), NOW())').join(', ')}`,
      parts,
    );
    await insert(`INSERT INTO rating_cards (vendor_part_id, version, fields, created_at, updated_at) VALUES ${Array.from({ length: cards.length / 2 }, () => '(?, 1, ?, NOW(), NOW())').join(', ')}`, cards);
  }

  // House parts, each with an approved source (approved by its case) and four alternates; three of these carry cases.
  const houseParts: unknown[] = [];
  for (let h = 1; h <= HOUSE_PARTS; h++) houseParts.push(h, `HP-${String(h).padStart(5, '0')}`, `Regulator diode, invented bench part ${h}, ${['clamp', 'reference', 'shunt regulator', 'gate protection'][h % 4]}`);
  await insert(`INSERT INTO house_parts (id, part_number, description, status, created_at, updated_at) VALUES ${Array.from({ length: HOUSE_PARTS }, () => "(?, ?, ?, 'active', NOW(), NOW())").join(', ')}`, houseParts);
  const sources: unknown[] = [];
  const cases: unknown[] = [];
  const STATES: Array<[string, number]> = [['cleared', 0.4], ['cleared-with-conditions', 0.1], ['rejected', 0.15], ['revoked', 0.05], ['in-review', 0.15], ['draft', 0.15]];
  const pickState = () => {
    let x = rnd();
    for (const [state, share] of STATES) if ((x -= share) < 0) return state;
    return 'draft';
  };
  const used = new Set<number>();
  const pickPart = () => {
    for (;;) {
      const id = 1 + Math.floor(rnd() * PARTS);
      if (!used.has(id)) {
        used.add(id);
        return id;
      }
    }
  };
  let caseId = 0;
  for (let h = 1; h <= HOUSE_PARTS; h++) {
    const reference = pickPart();
    sources.push(h, reference);
    caseId++;
    cases.push(caseId, h, reference, 1, 'approved', null, 1);
    for (let a = 0; a < ALTERNATES; a++) {
      const vp = pickPart();
      sources.push(h, vp);
      if (a === ALTERNATES - 1) continue;
      const state = pickState();
      const decided = ['cleared', 'cleared-with-conditions', 'rejected', 'revoked'].includes(state);
      caseId++;
      cases.push(caseId, h, vp, 1, state, decided ? (state === 'cleared-with-conditions' ? 'sample five per lot' : null) : null, decided ? 1 : null);
      // One decided case in twenty has a re-check open above it.
      if (decided && rnd() < 0.05) {
        caseId++;
        cases.push(caseId, h, vp, 2, 'draft', null, null);
      }
    }
  }
  for (let i = 0; i < sources.length; i += 2000) {
    const chunk = sources.slice(i, i + 2000);
    await insert(`INSERT INTO house_part_sources (house_part_id, vendor_part_id, created_at, updated_at) VALUES ${Array.from({ length: chunk.length / 2 }, () => '(?, ?, NOW(), NOW())').join(', ')}`, chunk);
  }
  for (let i = 0; i < cases.length; i += 7 * 500) {
    const chunk = cases.slice(i, i + 7 * 500);
    await insert(
      `INSERT INTO qualifications (id, house_part_id, vendor_part_id, revision, state, decision_text, decided_by_id, overall, spec_version, card_version, evaluation, summary, prepared_by_id, recheck_reasons, decided_at, created_at, updated_at)
       VALUES ${Array.from({ length: chunk.length / 7 }, () => "(?, ?, ?, ?, ?, ?, ?, 'pass', 1, 1, '{}', '', 1, '[]', NOW(), NOW(), NOW())").join(', ')}`,
      chunk,
    );
  }
  await sequelize.query('ANALYZE TABLE vendor_parts, rating_cards, house_parts, house_part_sources, qualifications', { type: QueryTypes.SELECT });
}

async function main() {
  const dir = resolve(__dirname, '..', '..', '.data-test', `bench-search-${process.pid}`);
  const server = await startMariaDb({ dir, port: await freePort(), quiet: true });
  try {
    await ensureDatabase(server, 'bench', 'bench', 'bench-only-local');
    const sequelize = new Sequelize({ dialect: 'mariadb', host: '127.0.0.1', port: server.port, database: 'bench', username: 'bench', password: 'bench-only-local', logging: false, define: { underscored: true }, timezone: '+00:00' });
    await migrateUp(sequelize);
    const t0 = performance.now();
    await load(sequelize);
    const [{ n: caseCount }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM qualifications', { type: QueryTypes.SELECT });
    console.log(`loaded ${PARTS} vendor parts (90 % with cards), ${HOUSE_PARTS} house parts, ${HOUSE_PARTS * (1 + ALTERNATES)} sources, ${caseCount} cases in ${((performance.now() - t0) / 1000).toFixed(1)} s`);

    const service = new SearchService(new SearchRepository(sequelize as never));
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
      console.log(`${name.padEnd(52)} median ${median(times).toFixed(2).padStart(7)} ms   p90 ${p90(times).toFixed(2).padStart(7)} ms   ×${(median(times) / floorMs).toFixed(0).padStart(4)} floor   (${info})`);
    }

    // The ranking step alone, over candidates shaped like the SQL's.
    const rnd = seededRandom(7);
    const records: TextRecord[] = Array.from({ length: SEARCH_TEXT_CANDIDATES }, (_, i) => {
      const vz = (2.4 + rnd() * 70).toFixed(1).replace('.', 'V');
      return { id: i + 1, mpn: `ZX${String(i % 40).padStart(2, '0')}-${vz}-${i}`, manufacturer: `Invented Maker ${String(i % 40).padStart(2, '0')}`, package: PACKAGES[i % PACKAGES.length], houseParts: [`HP-${String(i % 2000).padStart(5, '0')}`], descriptions: ['Regulator diode, invented bench part, clamp'] };
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
