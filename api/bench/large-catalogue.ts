/**
 * The large invented catalogue the search benchmarks and `seed-large.ts` load: vendor parts
 * (90 % with cards) from 40 invented makers, 2 000 house parts with an approved source and
 * four alternates each, about 6 000 qualification cases in every state, and the text index
 * and tolerance column as the repositories write them (here in bulk). Invented data only.
 */
import { vzTolerance } from '@shuntwise/contracts';
import { QueryTypes, type Sequelize } from 'sequelize';
import { rebuildUsableSources } from '../src/source-standing/usable-sources.repository';
import { TextIndexRepository } from '../src/text-index/text-index.repository';
import { seededRandom } from './bench-support';

export const MAKERS = 40;
export const HOUSE_PARTS = 2_000;
export const ALTERNATES = 4;
export const PACKAGES = ['SOD-123', 'SOD-123F', 'SOD-323', 'SOD-523', 'DO-35', 'DO-41', 'SMA', 'SMB', 'SOT-23', 'MELF'];

const value = (v: number) => ({
  value: v,
  printed: null,
  provenance: { source: 'imported', datasheetId: null, page: null, text: null, confirmedBy: null, confirmedAt: null },
});

export async function loadLargeCatalogue(sequelize: Sequelize, PARTS: number, progress?: (done: number) => void): Promise<void> {
  const rnd = seededRandom(20261207);
  const textIndex = new TextIndexRepository(sequelize as never);
  const insert = (sql: string, replacements: unknown[]) => sequelize.query(sql, { replacements, type: QueryTypes.INSERT });
  // The cases need an engineer: the first user there is (the demo accounts when seeded), else an invented one.
  const [someone] = await sequelize.query<{ id: number }>('SELECT id FROM users ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  if (!someone)
    await insert(
      `INSERT INTO users (id, email, name, role, created_at, updated_at) VALUES (1, 'bench@example.invalid', 'Bench Engineer', 'engineer', NOW(), NOW())`,
      [],
    );
  const userId = someone?.id ?? 1;
  const makers = Array.from({ length: MAKERS }, (_, i) => `Invented Maker ${String(i).padStart(2, '0')}`);
  await insert(`INSERT INTO manufacturers (name, created_at, updated_at) VALUES ${makers.map(() => '(?, NOW(), NOW())').join(', ')}`, makers);
  await textIndex.writeNew(
    'manufacturer',
    makers.map((name, i) => ({ id: i + 1, texts: [name] })),
  );
  const CHUNK = 2000;
  for (let start = 0; start < PARTS; start += CHUNK) {
    const parts: unknown[] = [];
    const cards: unknown[] = [];
    const names: Array<{ id: number; texts: string[] }> = [];
    for (let i = start; i < Math.min(PARTS, start + CHUNK); i++) {
      const vz = Math.round(Math.exp(Math.log(2.4) + rnd() * Math.log(75 / 2.4)) * 10) / 10;
      const maker = Math.floor(rnd() * MAKERS);
      const hasCard = rnd() < 0.9;
      const tol = [0.01, 0.02, 0.05, 0.05, 0.1][Math.floor(rnd() * 5)];
      const pd = [0.35, 0.5, 0.5, 1, 1.5, 3][Math.floor(rnd() * 6)];
      const izt = vz < 12 ? 0.005 : 0.002;
      const mpn = `ZX${String(maker).padStart(2, '0')}-${vz.toFixed(1).replace('.', 'V')}-${i}`;
      const vzMin = Number((vz * (1 - tol)).toFixed(3));
      const vzMax = Number((vz * (1 + tol)).toFixed(3));
      const tolerance = hasCard ? vzTolerance({ vzNom: { value: vz }, vzMin: { value: vzMin }, vzMax: { value: vzMax } }) : null;
      parts.push(
        i + 1,
        maker + 1,
        makers[maker],
        mpn,
        PACKAGES[i % PACKAGES.length],
        hasCard ? 1 : null,
        hasCard ? vz : null,
        hasCard ? izt : null,
        hasCard ? pd : null,
        tolerance,
      );
      names.push({ id: i + 1, texts: [mpn] });
      if (hasCard) {
        const fields = {
          vzMin: value(vzMin),
          vzNom: value(vz),
          vzMax: value(vzMax),
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
      `INSERT INTO vendor_parts (id, manufacturer_id, manufacturer_name, mpn, package, card_version, vz_nom, izt, pd_max, vz_tolerance, created_at, updated_at) VALUES ${Array.from({ length: parts.length / 10 }, () => '(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, NOW(), NOW())').join(', ')}`,
      parts,
    );
    await textIndex.writeNew('vendorPart', names);
    progress?.(Math.min(PARTS, start + CHUNK));
    await insert(
      `INSERT INTO rating_cards (vendor_part_id, version, fields, created_at, updated_at) VALUES ${Array.from({ length: cards.length / 2 }, () => '(?, 1, ?, NOW(), NOW())').join(', ')}`,
      cards,
    );
  }

  // House parts, each with an approved source and four alternates; three of these carry cases.
  const houseParts: unknown[] = [];
  for (let h = 1; h <= HOUSE_PARTS; h++)
    houseParts.push(
      h,
      `HP-${String(h).padStart(5, '0')}`,
      `Regulator diode, invented bench part ${h}, ${['clamp', 'reference', 'shunt regulator', 'gate protection'][h % 4]}`,
    );
  await insert(
    `INSERT INTO house_parts (id, part_number, description, status, created_at, updated_at) VALUES ${Array.from({ length: HOUSE_PARTS }, () => "(?, ?, ?, 'active', NOW(), NOW())").join(', ')}`,
    houseParts,
  );
  const houseTexts: Array<{ id: number; texts: string[] }> = [];
  for (let i = 0; i < houseParts.length; i += 3)
    houseTexts.push({ id: houseParts[i] as number, texts: [houseParts[i + 1] as string, houseParts[i + 2] as string] });
  await textIndex.writeNew('housePart', houseTexts);
  const sources: unknown[] = [];
  const cases: unknown[] = [];
  const STATES: Array<[string, number]> = [
    ['cleared', 0.4],
    ['cleared-with-conditions', 0.1],
    ['rejected', 0.15],
    ['revoked', 0.05],
    ['in-review', 0.15],
    ['draft', 0.15],
  ];
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
    // The approved source stands by its own approval case (a standing only ever comes from a decision).
    const reference = pickPart();
    sources.push(h, reference);
    caseId++;
    cases.push(caseId, h, reference, 1, 'approved', null, userId, userId);
    for (let a = 0; a < ALTERNATES; a++) {
      const vp = pickPart();
      sources.push(h, vp);
      if (a === ALTERNATES - 1) continue;
      const state = pickState();
      const decided = ['cleared', 'cleared-with-conditions', 'rejected', 'revoked'].includes(state);
      caseId++;
      cases.push(
        caseId,
        h,
        vp,
        1,
        state,
        decided ? (state === 'cleared-with-conditions' ? 'sample five per lot' : null) : null,
        decided ? userId : null,
        userId,
      );
      // One decided case in twenty has a re-check open above it.
      if (decided && rnd() < 0.05) {
        caseId++;
        cases.push(caseId, h, vp, 2, 'draft', null, null, userId);
      }
    }
  }
  for (let i = 0; i < sources.length; i += 2000) {
    const chunk = sources.slice(i, i + 2000);
    await insert(
      `INSERT INTO house_part_sources (house_part_id, vendor_part_id, created_at, updated_at) VALUES ${Array.from({ length: chunk.length / 2 }, () => '(?, ?, NOW(), NOW())').join(', ')}`,
      chunk,
    );
  }
  for (let i = 0; i < cases.length; i += 8 * 500) {
    const chunk = cases.slice(i, i + 8 * 500);
    await insert(
      `INSERT INTO qualifications (id, house_part_id, vendor_part_id, revision, state, decision_text, decided_by_id, overall, spec_version, card_version, evaluation, summary, prepared_by_id, recheck_reasons, decided_at, created_at, updated_at)
       VALUES ${Array.from({ length: chunk.length / 8 }, () => "(?, ?, ?, ?, ?, ?, ?, 'pass', 1, 1, '{}', '', ?, '[]', NOW(), NOW(), NOW())").join(', ')}`,
      chunk,
    );
  }
  // The cases went in as plain INSERTs: the usable sources are read from them as the repositories would.
  await rebuildUsableSources(sequelize);
  await sequelize.query('ANALYZE TABLE vendor_parts, rating_cards, house_parts, house_part_sources, qualifications, text_grams, usable_sources', {
    type: QueryTypes.SELECT,
  });
}
