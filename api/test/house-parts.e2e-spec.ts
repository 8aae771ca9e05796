import { CatalogueEvents, type CatalogueChange } from '../src/catalogue-events/catalogue-events.service';
import { createHousePart, createVendorPart, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('house parts, specs and sources (real MariaDB)', () => {
  let t: TestApp;
  let engineer: string;
  let buyer: string;
  let designer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    t = await createTestApp();
    [engineer, buyer, designer] = await Promise.all([t.tokenFor('engineer'), t.tokenFor('buyer'), t.tokenFor('designer')]);
  });
  afterAll(() => t.close());

  it('creates a house part; the part number is unique; a buyer may read but not write', async () => {
    const res = await t.http.post('/api/house-parts').set(auth(engineer)).send({ partNumber: 'HP-100-001', description: 'Regulator diode 5.1 V' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ partNumber: 'HP-100-001', status: 'draft', specVersion: null, sourceCount: 0, createdBy: { name: expect.any(String) } });

    const dup = await t.http.post('/api/house-parts').set(auth(engineer)).send({ partNumber: 'HP-100-001' });
    expect(dup.status).toBe(409);
    expect(dup.body.errors).toEqual([{ path: 'partNumber', message: 'must be unique' }]);

    const bad = await t.http.post('/api/house-parts').set(auth(engineer)).send({ partNumber: 'has space' });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('partNumber');

    expect((await t.http.post('/api/house-parts').set(auth(buyer)).send({ partNumber: 'HP-X' })).status).toBe(403);
    expect((await t.http.patch(`/api/house-parts/${res.body.id}`).set(auth(buyer)).send({ status: 'active' })).status).toBe(403);
    const read = await t.http.get(`/api/house-parts/${res.body.id}`).set(auth(buyer));
    expect(read.status).toBe(200);
    expect(read.body.partNumber).toBe('HP-100-001');

    const patched = await t.http
      .patch(`/api/house-parts/${res.body.id}`)
      .set(auth(engineer))
      .send({ status: 'active', description: 'Regulator diode 5.1 V, 500 mW' });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ status: 'active', description: 'Regulator diode 5.1 V, 500 mW' });
    expect((await t.http.get('/api/house-parts/999999').set(auth(designer))).status).toBe(404);
  });

  it('pages, sorts and filters the list in SQL', async () => {
    for (let i = 0; i < 12; i++) await createHousePart(t.http, engineer, `HPL-${String(i).padStart(2, '0')}`, i % 2 ? 'odd one' : 'even one', 'active'); // in use: designers are not offered drafts
    await t.http
      .patch(`/api/house-parts/${(await t.http.get('/api/house-parts?q=HPL-03').set(auth(engineer))).body.items[0].id}`)
      .set(auth(engineer))
      .send({ status: 'end-of-life' });

    const page1 = await t.http.get('/api/house-parts?q=HPL-&pageSize=5&pageIndex=0&sort=-partNumber').set(auth(designer));
    expect(page1.status).toBe(200);
    expect(page1.body.total).toBe(12);
    expect(page1.body.items.map((h: { partNumber: string }) => h.partNumber)).toEqual(['HPL-11', 'HPL-10', 'HPL-09', 'HPL-08', 'HPL-07']);
    const page3 = await t.http.get('/api/house-parts?q=HPL-&pageSize=5&pageIndex=2&sort=-partNumber').set(auth(designer));
    expect(page3.body.items.map((h: { partNumber: string }) => h.partNumber)).toEqual(['HPL-01', 'HPL-00']);

    const retired = await t.http.get('/api/house-parts?status=end-of-life').set(auth(designer));
    expect(retired.body.items.map((h: { partNumber: string }) => h.partNumber)).toEqual(['HPL-03']);
    const byWord = await t.http.get('/api/house-parts?q=odd&pageSize=50').set(auth(designer));
    expect(byWord.body.total).toBe(6);

    const badSort = await t.http.get('/api/house-parts?sort=colour').set(auth(designer));
    expect(badSort.status).toBe(400);
    expect(badSort.body.message).toMatch(/cannot sort by "colour"/);
    expect((await t.http.get('/api/house-parts?pageSize=5000').set(auth(designer))).body.errors[0].path).toBe('pageSize');
  });

  it('versions the spec: each PUT a new version, old versions readable, stale base 409, unchanged no new version', async () => {
    const id = await createHousePart(t.http, engineer, 'HP-SPEC-1');
    // No spec yet is a state of a new house part: 200 with the JSON null (no 404 in the browser's console).
    const none = await t.http.get(`/api/house-parts/${id}/spec`).set(auth(engineer));
    expect([none.status, none.type, none.text]).toEqual([200, 'application/json', 'null']);
    expect((await t.http.get(`/api/house-parts/999999/spec`).set(auth(engineer))).status).toBe(404);
    expect((await t.http.get(`/api/house-parts/${id}/spec?version=1`).set(auth(engineer))).status).toBe(404);

    const v1 = await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: demoSpec(), note: 'first issue' });
    expect(v1.status).toBe(200);
    expect(v1.body).toMatchObject({ housePartId: id, version: 1, note: 'first issue', spec: { iRef: 0.005, vz: { nom: 5.1 }, marginalBandPercent: 5 } });

    const same = await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 1, spec: demoSpec(), note: 'first issue' });
    expect(same.body.version).toBe(1);

    const v2 = await t.http
      .put(`/api/house-parts/${id}/spec`)
      .set(auth(engineer))
      .send({ baseVersion: 1, spec: demoSpec({ zdMax: 45 }) });
    expect(v2.body.version).toBe(2);
    expect((await t.http.get(`/api/house-parts/${id}`).set(auth(buyer))).body.specVersion).toBe(2);

    const stale = await t.http
      .put(`/api/house-parts/${id}/spec`)
      .set(auth(engineer))
      .send({ baseVersion: 1, spec: demoSpec({ zdMax: 30 }) });
    expect(stale.status).toBe(409);
    expect(stale.body.message).toMatch(/version 2/);
    expect(stale.body).toMatchObject({ code: 'stale', current: { version: 2 }, errors: [{ path: 'baseVersion', message: 'current version is 2' }] }); // contracts: staleConflictBodySchema

    const old = await t.http.get(`/api/house-parts/${id}/spec?version=1`).set(auth(designer));
    expect(old.body.spec.zdMax).toBe(60);
    const current = await t.http.get(`/api/house-parts/${id}/spec`).set(auth(designer));
    expect(current.body).toMatchObject({ version: 2, spec: { zdMax: 45 } });
    expect((await t.http.get(`/api/house-parts/${id}/spec?version=7`).set(auth(designer))).status).toBe(404);

    const versions = await t.http.get(`/api/house-parts/${id}/spec/versions`).set(auth(designer));
    expect(versions.body.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(await t.select('SELECT version FROM house_part_specs WHERE house_part_id = ? ORDER BY version', [id])).toEqual([{ version: 1 }, { version: 2 }]);

    expect((await t.http.put(`/api/house-parts/${id}/spec`).set(auth(buyer)).send({ baseVersion: 2, spec: demoSpec() })).status).toBe(403);
  });

  it('a save that changes nothing makes no version and tells no subscriber (so no decided case is flagged)', async () => {
    const id = await createHousePart(t.http, engineer, 'HP-SPEC-SAME');
    await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: demoSpec(), note: 'first issue' });
    const events = t.stack.app.get(CatalogueEvents);
    const seen: CatalogueChange[] = [];
    const off = events.subscribe(async (change) => {
      seen.push(change);
    });
    // What an editor sends back unchanged: no note, values through a unit round trip
    // (5 mA typed back reads 0.005000000000000001), packages in another order, defaults spelt out.
    const echoed = demoSpec({ iRef: 0.005000000000000001, packages: ['SOD-323', 'SOD-123'], vz: { min: 4.85, nom: 5.1, max: 5.359999999999999 } });
    const same = await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 1, spec: echoed });
    expect(same.status).toBe(200);
    expect(same.body.version).toBe(1);
    const noteOnly = await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 1, spec: demoSpec(), note: 'just saying' });
    expect(noteOnly.body.version).toBe(1);
    off();
    expect(seen).toEqual([]);
    expect(await t.select('SELECT version FROM house_part_specs WHERE house_part_id = ?', [id])).toEqual([{ version: 1 }]);
  });

  it('names the field of every bad spec value', async () => {
    const id = await createHousePart(t.http, engineer, 'HP-SPEC-BAD');
    const put = (spec: unknown) => t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec });
    const paths = async (spec: unknown) => ((await put(spec)).body.errors as Array<{ path: string }>).map((e) => e.path);

    expect(await paths(demoSpec({ vz: { min: 5.4, nom: 5.1, max: 5.36 } }))).toContain('spec.vz.min');
    expect(await paths(demoSpec({ knee: { iKnee: null, maxRatio: 20, maxSpan: null } }))).toContain('spec.knee.iKnee');
    expect(await paths(demoSpec({ knee: { iKnee: 10e-3, maxRatio: 20, maxSpan: null } }))).toContain('spec.knee.iKnee');
    expect(await paths(demoSpec({ leakage: { irMax: 1e-6, vr: 6 } }))).toContain('spec.leakage.vr');
    expect(await paths(demoSpec({ envelope: { iMin: 30e-3, iMax: 20e-3, taMin: -40, taMax: 85 } }))).toContain('spec.envelope.iMin');
    expect(await paths(demoSpec({ tc: { min: 0.002, max: 0.001 } }))).toContain('spec.tc.min');
    expect(await paths({ ...demoSpec(), iRef: '5 mA' })).toContain('spec.iRef');
    expect((await put(demoSpec({ power: { pdMin: 0.3, deratingFraction: 1.5 } }))).status).toBe(400);
    // nothing was written
    expect(await t.select('SELECT id FROM house_part_specs WHERE house_part_id = ?', [id])).toEqual([]);
  });

  it('tells subscribers of a spec change inside the transaction; a failing subscriber leaves no new version', async () => {
    const id = await createHousePart(t.http, engineer, 'HP-SPEC-EVT');
    const events = t.stack.app.get(CatalogueEvents);
    const seen: CatalogueChange[] = [];
    const off = events.subscribe(async (change, transaction) => {
      seen.push(change);
      // the new version is visible inside the writing transaction
      const [row] = (await t.stack.sequelize.query('SELECT spec_version AS v FROM house_parts WHERE id = ?', {
        replacements: [id],
        type: 'SELECT',
        transaction,
      } as never)) as unknown as Array<{ v: number }>;
      expect(row.v).toBe((change as { version: number }).version);
    });
    await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: demoSpec() });
    off();
    expect(seen).toEqual([{ kind: 'spec-changed', housePartId: id, version: 1, previousVersion: null, userId: expect.any(Number) }]);

    const offFailing = events.subscribe(() => {
      throw new Error('subscriber refused');
    });
    const res = await t.http
      .put(`/api/house-parts/${id}/spec`)
      .set(auth(engineer))
      .send({ baseVersion: 1, spec: demoSpec({ zdMax: 10 }) });
    offFailing();
    expect(res.status).toBe(500);
    expect((await t.http.get(`/api/house-parts/${id}/spec`).set(auth(engineer))).body.version).toBe(1);
  });

  it('links vendor parts as candidates; buyers read them, only engineers change them', async () => {
    const housePartId = await createHousePart(t.http, engineer, 'HP-SRC-1');
    const first = await createVendorPart(t.http, engineer, { manufacturer: 'Aldmoor Semiconductor', mpn: 'AMZ5V1-T', package: 'SOD-123' });
    const alternate = await createVendorPart(t.http, engineer, { manufacturer: 'Brackenford Devices', mpn: 'BRZ-5V1', package: 'SOD-323' });

    const a = await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: first });
    expect(a.status).toBe(201);
    expect(a.body).toMatchObject({
      housePartId,
      vendorPartId: first,
      manufacturer: 'Aldmoor Semiconductor',
      mpn: 'AMZ5V1-T',
      role: 'alternate',
      cardVersion: null,
    });
    await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: alternate, role: 'alternate', note: 'cheaper' });
    const dup = await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: alternate });
    expect(dup.status).toBe(409);
    expect(dup.body.message).toMatch(/already a source/);
    expect((await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: 987654 })).status).toBe(404);
    expect((await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(buyer)).send({ vendorPartId: alternate })).status).toBe(403);

    const list = await t.http.get(`/api/house-parts/${housePartId}/sources`).set(auth(buyer));
    expect(list.status).toBe(200);
    expect(list.body.map((s: { mpn: string; role: string }) => `${s.role} ${s.mpn}`)).toEqual(['alternate AMZ5V1-T', 'alternate BRZ-5V1']);
    expect((await t.http.get(`/api/house-parts/${housePartId}`).set(auth(buyer))).body.sourceCount).toBe(2);

    const patched = await t.http.patch(`/api/house-parts/${housePartId}/sources/${alternate}`).set(auth(engineer)).send({ note: null });
    expect(patched.body).toMatchObject({ role: 'alternate', note: null });
    expect((await t.http.get(`/api/vendor-parts/${alternate}`).set(auth(buyer))).body.sourceOf).toEqual([
      { housePartId, partNumber: 'HP-SRC-1', role: 'alternate' },
    ]);

    expect((await t.http.delete(`/api/house-parts/${housePartId}/sources/${alternate}`).set(auth(buyer))).status).toBe(403);
    expect((await t.http.delete(`/api/house-parts/${housePartId}/sources/${alternate}`).set(auth(engineer))).status).toBe(204);
    expect((await t.http.delete(`/api/house-parts/${housePartId}/sources/${alternate}`).set(auth(engineer))).status).toBe(404);
    expect((await t.http.get(`/api/house-parts/${housePartId}/sources`).set(auth(buyer))).body).toHaveLength(1);
  });

  it('refuses to set a standing through the sources routes, naming the field, and changes nothing a buyer sees', async () => {
    const admin = await t.tokenFor('admin');
    const reviewer = await t.tokenFor('reviewer@demo.test');
    const housePartId = await createHousePart(t.http, engineer, 'HP-SIDE-1');
    const linked = await createVendorPart(t.http, engineer, { manufacturer: 'Aldmoor Semiconductor', mpn: 'AMZ-SIDE-A', package: 'SOD-123' });
    const other = await createVendorPart(t.http, engineer, { manufacturer: 'Aldmoor Semiconductor', mpn: 'AMZ-SIDE-B', package: 'SOD-123' });
    expect((await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: linked })).status).toBe(201);
    const snapshot = async () => ({
      sources: (await t.http.get(`/api/house-parts/${housePartId}/sources`).set(auth(buyer))).body,
      view: (await t.http.get(`/api/qualification-views/sources?housePartId=${housePartId}`).set(auth(buyer))).body,
      cases: await t.select('SELECT id FROM qualifications WHERE house_part_id = ?', [housePartId]),
      mail: (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM outgoing_mail'))[0].n,
    });
    const before = await snapshot();

    for (const token of [engineer, reviewer]) {
      for (const role of ['approved', 'alternate', 'cleared']) {
        const patch = await t.http.patch(`/api/house-parts/${housePartId}/sources/${linked}`).set(auth(token)).send({ role });
        expect(patch.status).toBe(400);
        expect(patch.body.errors).toEqual([
          expect.objectContaining({ path: 'role', message: expect.stringMatching(/only by a second engineer's decision on its qualification case/) }),
        ]);
      }
      const post = await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(token)).send({ vendorPartId: other, role: 'approved' });
      expect(post.status).toBe(400);
      expect(post.body.errors).toEqual([expect.objectContaining({ path: 'role', message: expect.stringMatching(/a source's role is not set here/) })]);
    }
    // an admin may not even try: the catalogue is the engineers'
    expect((await t.http.patch(`/api/house-parts/${housePartId}/sources/${linked}`).set(auth(admin)).send({ role: 'approved' })).status).toBe(403);
    expect((await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(admin)).send({ vendorPartId: other, role: 'approved' })).status).toBe(403);

    const after = await snapshot();
    expect(after).toEqual(before);
    expect(after.view.items[0].sources).toEqual([expect.objectContaining({ role: 'alternate', standing: 'not-qualified', caseId: null })]);
    // and the designers' search does not offer it
    const designer = await t.tokenFor('designer');
    const found = await t.http.get('/api/search?q=AMZ-SIDE').set(auth(designer));
    expect(found.status).toBe(200);
    expect(found.body.items).toEqual([]);
  });
});
