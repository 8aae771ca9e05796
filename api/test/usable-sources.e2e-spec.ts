import type { SearchPage, SourcesView } from '@shuntwise/contracts';
import { UnitOfWork } from '../src/database/unit-of-work';
import { QualificationsRepository } from '../src/qualifications/qualifications.repository';
import { rebuildUsableSources } from '../src/source-standing/usable-sources.repository';
import { UsersRepository } from '../src/users/users.repository';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

/**
 * The usable_sources table the designers' search joins, kept by the case and link writes in
 * their own transaction. Checked against the Sources view, which derives each standing from
 * the cases on every read (contracts' sourceStanding), so the two are independent readings
 * of one rule.
 */
describe('usable sources (real MariaDB, demo seed)', () => {
  let t: TestApp;
  let engineer: string; // Priya Raman, prepares
  let reviewer: string; // Tomas Eklund, decides
  let designer: string;
  let reviewerId: number;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const pairsOfTable = async () =>
    (await t.select<{ h: number; v: number }>('SELECT house_part_id AS h, vendor_part_id AS v FROM usable_sources ORDER BY h, v')).map((r) => `${r.h}:${r.v}`);
  const pairsOfSourcesView = async () => {
    const view = (await t.http.get('/api/qualification-views/sources').set(auth(engineer))).body as SourcesView;
    return view.items
      .flatMap((h) =>
        h.sources
          .filter((s) => ['approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver'].includes(s.standing))
          .map((s) => [h.housePart.id, s.vendorPart.id] as const),
      )
      .sort((a, b) => a[0] - b[0] || a[1] - b[1])
      .map(([h, v]) => `${h}:${v}`);
  };
  const found = async (query: string) => ((await t.http.get(`/api/search?${query}`).set(auth(designer))).body as SearchPage).items.map((i) => i.vendorPart.mpn);
  const act = async (id: number, action: string, body: object, token: string) => {
    const version = (await t.http.get(`/api/qualifications/${id}`).set(auth(engineer))).body.version;
    const res = await t.http
      .post(`/api/qualifications/${id}/${action}`)
      .set(auth(token))
      .send(action === 'recheck' ? body : { version, ...body });
    expect(res.status).toBe(action === 'recheck' ? 201 : 200);
    return res.body as { id: number };
  };

  beforeAll(async () => {
    t = await createTestApp({ seed: 'demo' });
    [engineer, reviewer, designer] = await Promise.all([t.tokenFor('engineer@demo.test'), t.tokenFor('reviewer@demo.test'), t.tokenFor('designer')]);
    reviewerId = (await t.stack.app.get(UsersRepository).findByEmail('reviewer@demo.test'))!.id;
  }, 240_000);
  afterAll(() => t.close());

  it('holds exactly the sources the Sources view stands usable, and a rebuild from the cases (the back-fill) gives the same rows', async () => {
    const kept = await pairsOfTable();
    // The demo seed decides its cases through the workflow: some usable, some ruled out.
    expect(kept.length).toBeGreaterThan(3);
    expect(kept).toEqual(await pairsOfSourcesView());
    await t.exec('DELETE FROM usable_sources');
    await rebuildUsableSources(t.stack.sequelize as never);
    expect(await pairsOfTable()).toEqual(kept);
  });

  it('changes what designers find with the decision itself: cleared, re-check open, re-check rejected', async () => {
    const housePartId = await createHousePart(t.http, engineer, 'HPU-1', 'Usable sources case');
    // A spec window wide enough that the card passes every check with margin (as in qualifications.e2e-spec).
    const spec = demoSpec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } });
    expect((await t.http.put(`/api/house-parts/${housePartId}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec })).status).toBe(200);
    const vendorPartId = await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn: 'FZU-5V1', package: 'SOD-123' });
    const entered = { source: 'entered' as const };
    const fields = demoCardFields({
      vzMin: { value: 4.9, printed: '4.9 V', provenance: entered },
      vzMax: { value: 5.3, printed: '5.3 V', provenance: entered },
    });
    expect((await t.http.put(`/api/vendor-parts/${vendorPartId}/rating-card`).set(auth(engineer)).send({ version: 0, fields })).status).toBe(200);
    const opened = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId, vendorPartId });
    expect(opened.status).toBe(201);
    const caseId = opened.body.id as number;
    await act(caseId, 'submit', { reviewerId }, engineer);
    expect(await found('q=FZU-5V1')).toEqual([]);

    // A decision whose transaction rolls back leaves nothing behind; inside it, the row is there already.
    const cases = t.stack.app.get(QualificationsRepository);
    let seenInside: unknown[] = [];
    await expect(
      t.stack.app.get(UnitOfWork).run(async (transaction) => {
        const row = (await cases.findById(caseId, transaction, true))!;
        await cases.save(row, { state: 'cleared' }, transaction);
        seenInside = await t.stack.sequelize.query('SELECT source_id FROM usable_sources WHERE vendor_part_id = ?', {
          replacements: [vendorPartId],
          type: 'SELECT' as never,
          transaction,
        });
        throw new Error('roll back');
      }),
    ).rejects.toThrow('roll back');
    expect(seenInside).toHaveLength(1);
    expect(await t.select('SELECT source_id FROM usable_sources WHERE vendor_part_id = ?', [vendorPartId])).toEqual([]);
    expect(await found('q=FZU-5V1')).toEqual([]);

    // The second engineer's clearance: found at once, without and with the house part filter.
    await act(caseId, 'clear', {}, reviewer);
    expect(await found('q=FZU-5V1')).toEqual(['FZU-5V1']);
    expect(await found(`housePartId=${housePartId}`)).toEqual(['FZU-5V1']);
    expect(await found('vzFrom=5.05&vzTo=5.15&package=SOD-123')).toContain('FZU-5V1');
    // A re-check opened above the clearance leaves it standing until the re-check is decided.
    const recheck = await act(caseId, 'recheck', { note: 'new lot' }, engineer);
    expect(await found('q=FZU-5V1')).toEqual(['FZU-5V1']);
    await act(recheck.id, 'submit', { reviewerId }, engineer);
    await act(recheck.id, 'reject', { reason: 'the new lot leaks above the limit' }, reviewer);
    expect(await found('q=FZU-5V1')).toEqual([]);
    expect(await found(`housePartId=${housePartId}`)).toEqual([]);
    expect(await pairsOfTable()).toEqual(await pairsOfSourcesView());
  });
});
