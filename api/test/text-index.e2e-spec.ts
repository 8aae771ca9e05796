import type { HousePartPage, SearchPage, SourcesView, VendorPartPage } from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { searchQuerySchema } from '@shuntwise/contracts';
import { HousePartsRepository } from '../src/house-parts/house-parts.repository';
import { SearchRepository, branchCondition } from '../src/search/search.repository';
import { SearchService } from '../src/search/search.service';
import { TextIndexRepository } from '../src/text-index/text-index.repository';
import { VendorPartsRepository } from '../src/vendor-parts/vendor-parts.repository';
import { createVendorPart, demoCardFields } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

/**
 * The n-gram text index (text_grams) on the real MariaDB with the demo seed: written in the
 * transaction of the record it indexes, and serving substring part-number search on every
 * list that takes `q`.
 */
describe('text index (real MariaDB, demo seed)', () => {
  let t: TestApp;
  let engineer: string;
  let designer: string;
  let buyer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const get = async <T>(path: string, token = engineer): Promise<T> => {
    const res = await t.http.get(path).set(auth(token));
    expect(res.status).toBe(200);
    return res.body as T;
  };
  const gramsOf = async (kind: number, id: number) =>
    Number((await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM text_grams WHERE kind = ? AND entity_id = ?', [kind, id]))[0].n);

  beforeAll(async () => {
    t = await createTestApp({ seed: 'demo' });
    [engineer, designer, buyer] = await Promise.all([t.tokenFor('engineer@demo.test'), t.tokenFor('designer'), t.tokenFor('buyer')]);
  });
  afterAll(() => t.close());

  it('indexes every seeded part, and a rolled-back write leaves no index rows', async () => {
    const [{ unindexed }] = await t.select<{ unindexed: number }>(
      'SELECT COUNT(*) AS unindexed FROM vendor_parts vp WHERE NOT EXISTS (SELECT 1 FROM text_grams g WHERE g.kind = 1 AND g.entity_id = vp.id)',
    );
    expect(Number(unindexed)).toBe(0);
    const sequelize = t.stack.app.get(Sequelize);
    const houseParts = t.stack.app.get(HousePartsRepository);
    const vendorParts = t.stack.app.get(VendorPartsRepository);
    let housePartId = 0;
    let vendorPartId = 0;
    let insideTransaction = 0;
    await expect(
      sequelize.transaction(async (transaction) => {
        const part = await houseParts.create({ partNumber: 'OHI-RB-7777', description: 'rolled back', status: 'draft', createdById: null }, transaction);
        housePartId = part.id;
        const maker = await vendorParts.findOrCreateManufacturer('Rollback Invented Devices', transaction);
        const vp = await vendorParts.create({ manufacturer: maker, mpn: 'RBZ-7V7', package: null, lifecycleNote: null, createdById: null }, transaction);
        vendorPartId = vp.id;
        const [{ n }] = await sequelize.query<{ n: number }>(
          'SELECT COUNT(*) AS n FROM text_grams WHERE (kind = 2 AND entity_id = ?) OR (kind = 1 AND entity_id = ?)',
          {
            replacements: [housePartId, vendorPartId],
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        insideTransaction = Number(n);
        throw new Error('roll back');
      }),
    ).rejects.toThrow('roll back');
    expect(insideTransaction).toBeGreaterThan(0);
    expect(await gramsOf(2, housePartId)).toBe(0);
    expect(await gramsOf(1, vendorPartId)).toBe(0);
    expect(await t.select("SELECT id FROM manufacturers WHERE name = 'Rollback Invented Devices'")).toEqual([]);
    expect((await get<HousePartPage>('/api/house-parts?q=RB-7777')).total).toBe(0);
  });

  it('finds house parts by any part of their number on House parts, Board and Sources', async () => {
    const houseList = await get<HousePartPage>('/api/house-parts?q=1051');
    expect(houseList.items.map((h) => h.partNumber)).toEqual(['OHI-ZD-1051']);
    // other case and separators left out
    expect((await get<HousePartPage>('/api/house-parts?q=zd1051')).items.map((h) => h.partNumber)).toEqual(['OHI-ZD-1051']);
    const board = await get<{ items: Array<{ housePart: { partNumber: string } }> }>('/api/qualification-views/board?q=1051');
    expect(board.items.map((r) => r.housePart.partNumber)).toEqual(['OHI-ZD-1051']);
    const sources = await get<SourcesView>('/api/qualification-views/sources?q=1051', buyer);
    expect(sources.items.map((r) => r.housePart.partNumber)).toEqual(['OHI-ZD-1051']);
  });

  it('finds house parts whose sources carry the text in their part number (5V1), and vendor parts by any part of theirs', async () => {
    const withSource = await t.select<{ partNumber: string }>(
      `SELECT DISTINCT h.part_number AS partNumber FROM house_parts h JOIN house_part_sources s ON s.house_part_id = h.id JOIN vendor_parts vp ON vp.id = s.vendor_part_id
       WHERE vp.mpn LIKE '%5V1%' OR h.part_number LIKE '%5V1%' OR h.description LIKE '%5V1%' OR REPLACE(h.description, '.', '') LIKE '%5V1%' ORDER BY h.part_number`,
    );
    expect(withSource.length).toBeGreaterThan(0);
    const found = (await get<HousePartPage>('/api/house-parts?q=5V1&pageSize=100')).items.map((h) => h.partNumber);
    for (const { partNumber } of withSource) expect(found).toContain(partNumber);
    const board = (await get<{ items: Array<{ housePart: { partNumber: string } }> }>('/api/qualification-views/board?q=5v1&pageSize=100')).items.map(
      (r) => r.housePart.partNumber,
    );
    expect(board.sort()).toEqual([...found].sort());

    const expected = (await t.select<{ mpn: string }>("SELECT mpn FROM vendor_parts WHERE mpn LIKE '%5V1%' ORDER BY mpn")).map((r) => r.mpn);
    expect(expected).toEqual(expect.arrayContaining(['BRZ05-5V1', 'QHZ5V1AF']));
    const vendorList = (await get<VendorPartPage>('/api/vendor-parts?q=5V1&pageSize=100')).items.map((v) => v.mpn).sort();
    expect(vendorList).toEqual(expected);
  });

  it("finds parts in the designers' search by a middle part of their number or of a house part they serve", async () => {
    const byHousePart = await get<SearchPage>('/api/search?q=1051', designer);
    expect(byHousePart.text.mode).toBe('fuzzy');
    const sources = await get<SourcesView>('/api/qualification-views/sources?q=OHI-ZD-1051', buyer);
    const usable = sources.items[0].sources
      .filter(
        (s) => s.standing === 'cleared' || s.standing === 'cleared-with-conditions' || (s.role === 'approved' && !['rejected', 'revoked'].includes(s.standing)),
      )
      .map((s) => s.vendorPart.mpn);
    expect(usable.length).toBeGreaterThan(0);
    expect(byHousePart.items.map((i) => i.vendorPart.mpn)).toEqual(expect.arrayContaining(usable));
    const middle = await get<SearchPage>('/api/search?q=5V1&includeNotCleared=true&pageSize=50', designer);
    expect(middle.items.map((i) => i.vendorPart.mpn)).toEqual(expect.arrayContaining(['BRZ05-5V1', 'QHZ5V1AF']));
  });

  // At a million parts every piece of "ZX7-5V1" was held by more than COMMON_PIECE parts and the
  // search found nothing. The same shape here with the threshold injected at one record.
  it('still narrows, by the least common pieces, when every piece of the text is common', async () => {
    const ids = [];
    for (const mpn of ['CQZQ7-5V1-A', 'CQZQ7-5V1-B', 'CQZQ7-5V6'])
      ids.push(await createVendorPart(t.http, engineer, { manufacturer: 'Commonplace Fabricated Diodes', mpn }));
    const sequelize = t.stack.app.get(Sequelize);
    const tight = new TextIndexRepository(sequelize, { commonPiece: 1, commonFloor: 0 });
    // Each piece of the text the part numbers hold is held by two parts or more: all common at this threshold.
    const counts = await t.select<{ gram: string; n: number }>(
      "SELECT gram, COUNT(*) AS n FROM text_grams WHERE kind = 1 AND gram IN ('zq7', 'q75', '75v', '5v1') GROUP BY gram",
    );
    expect(counts.map((c) => c.gram).sort()).toEqual(['5v1', '75v', 'q75', 'zq7']);
    for (const c of counts) expect(Number(c.n)).toBeGreaterThan(1);
    const scored = await tight.scoredVendorParts('ZQ7-5V1');
    expect(scored).not.toBeNull();
    const found = await sequelize.query<{ id: number; score: number }>(`SELECT id, score FROM (${scored!.sql}) m ORDER BY score DESC, id`, {
      replacements: scored!.params,
      type: QueryTypes.SELECT,
    });
    // The two that hold the whole text, scored 1; the 5V6 holds 'zq7', 'q75' but not '5v1'.
    expect(found.filter((f) => Number(f.score) === 1).map((f) => f.id)).toEqual([ids[0], ids[1]]);
    expect(found.length).toBeLessThan(10);
    // Through the whole search, as a designer would type it, with one typo too.
    const search = new SearchService(t.stack.app.get(SearchRepository), tight);
    const page = await search.search(searchQuerySchema.parse({ q: 'ZQ7-5V1', includeNotCleared: 'true' }));
    expect(
      page.items
        .slice(0, 2)
        .map((i) => i.vendorPart.mpn)
        .sort(),
    ).toEqual(['CQZQ7-5V1-A', 'CQZQ7-5V1-B']);
    expect(page.text.mode).toBe('fuzzy');
    const typo = await search.search(searchQuerySchema.parse({ q: 'CQZQ7-5V1-8', includeNotCleared: 'true' }));
    expect(typo.items.map((i) => i.vendorPart.mpn)).toEqual(expect.arrayContaining(['CQZQ7-5V1-A', 'CQZQ7-5V1-B']));
  });

  // A branch keeps its best matches only (2 000); the filters on a part's own columns are tested
  // before that cut, so a Vz range finds its parts however many others hold the text.
  it('applies the Vz range before a text branch keeps its best matches', async () => {
    const entered = { source: 'entered' as const };
    const ids: number[] = [];
    for (const [mpn, vz] of [
      ['KRZ-2V4', 2.4],
      ['KRZ-3V3', 3.3],
      ['KRZ-4V7', 4.7],
      ['KRZ-6V8', 6.8],
      ['KRZ-9V1', 9.1],
    ] as const) {
      const id = await createVendorPart(t.http, engineer, { manufacturer: 'Branchcut Invented Devices', mpn });
      const fields = demoCardFields({
        vzMin: { value: vz * 0.95, printed: null, provenance: entered },
        vzNom: { value: vz, printed: null, provenance: entered },
        vzMax: { value: vz * 1.05, printed: null, provenance: entered },
      });
      expect((await t.http.put(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer)).send({ version: 0, fields })).status).toBe(200);
      ids.push(id);
    }
    // Every one holds the text outright; a branch may hand on two of them.
    const narrow = new TextIndexRepository(t.stack.app.get(Sequelize), { branchLimit: 2 });
    const search = new SearchService(t.stack.app.get(SearchRepository), narrow);
    const page = await search.search(searchQuerySchema.parse({ q: 'KRZ', includeNotCleared: 'true', vzFrom: '6', vzTo: '10' }));
    expect(page.items.map((i) => i.vendorPart.mpn).sort()).toEqual(['KRZ-6V8', 'KRZ-9V1']);
    expect(page.text.mode).toBe('fuzzy');
    // Without a filter the cut shows: two parts, the first by score then id.
    const all = await search.search(searchQuerySchema.parse({ q: 'KRZ', includeNotCleared: 'true' }));
    expect(all.items.map((i) => i.vendorPart.id).sort((a, b) => a - b)).toEqual(ids.slice(0, 2));
  });

  // The search reads only the best SEARCH_TEXT_CANDIDATES + 1 parts when nothing is filtered after
  // the index (scoredVendorParts' `keep`): they must be the very parts the whole match, cut by
  // (score, id), gives. Texts drawn afresh from the seeded names each run (seed printed).
  it("keeping the best k matches gives the whole match's best k by score then id, with and without filters", async () => {
    const seed = Number(process.env.TEXT_SEED ?? Math.floor(Math.random() * 2 ** 31));
    console.log(`keep-cut texts: TEXT_SEED=${seed}`);
    let state = seed;
    const rand = () => (state = (state * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const names = (
      await t.select<{ name: string }>(
        'SELECT mpn AS name FROM vendor_parts UNION ALL SELECT name FROM manufacturers UNION ALL SELECT part_number FROM house_parts UNION ALL SELECT description FROM house_parts',
      )
    ).map((r) => r.name);
    const index = t.stack.app.get(TextIndexRepository);
    const sequelize = t.stack.app.get(Sequelize);
    const run = (sql: string, params: unknown[]) =>
      sequelize.query<{ id: number; score: string | number }>(sql, { replacements: params, type: QueryTypes.SELECT });
    const key = (rows: Array<{ id: number; score: string | number }>) => rows.map((r) => `${r.id}:${Number(r.score).toFixed(4)}`);
    let compared = 0;
    for (let i = 0; i < 16; i++) {
      const name = names[Math.floor(rand() * names.length)];
      const from = Math.floor(rand() * Math.max(1, name.length - 3));
      let text = name.slice(from, from + 3 + Math.floor(rand() * 6));
      // Every third text with one character changed, as a typo.
      if (i % 3 === 2 && text.length > 3) text = `${text.slice(0, 1)}x${text.slice(2)}`;
      for (const raw of [{ q: text, includeNotCleared: 'true' }, { q: text }, { q: text, includeNotCleared: 'true', vzFrom: '3', vzTo: '8' }]) {
        const condition = branchCondition(searchQuerySchema.parse(raw));
        const whole = await index.scoredVendorParts(text, condition);
        if (!whole) continue;
        const all = (await run(whole.sql, whole.params)).sort((a, b) => Number(b.score) - Number(a.score) || a.id - b.id);
        for (const k of [1, 3, 10]) {
          const cut = (await index.scoredVendorParts(text, condition, k))!;
          const kept = await run(cut.sql, cut.params);
          expect({ text, raw, k, ids: key(kept) }).toEqual({ text, raw, k, ids: key(all.slice(0, k)) });
          compared++;
        }
      }
    }
    expect(compared).toBeGreaterThan(30);
  });

  it('moves a renamed part in the index: the old number no longer finds it, the new one does', async () => {
    const id = await createVendorPart(t.http, engineer, { manufacturer: 'Index Invented Semis', mpn: 'IXZ-4242' });
    expect((await get<VendorPartPage>('/api/vendor-parts?q=4242')).items.map((v) => v.id)).toEqual([id]);
    expect((await t.http.patch(`/api/vendor-parts/${id}`).set(auth(engineer)).send({ mpn: 'IXZ-9393' })).status).toBe(200);
    expect((await get<VendorPartPage>('/api/vendor-parts?q=4242')).total).toBe(0);
    expect((await get<VendorPartPage>('/api/vendor-parts?q=9393')).items.map((v) => v.id)).toEqual([id]);
    // the new manufacturer is indexed too
    expect((await get<VendorPartPage>('/api/vendor-parts?q=invented semis')).items.map((v) => v.id)).toEqual([id]);
  });
});
