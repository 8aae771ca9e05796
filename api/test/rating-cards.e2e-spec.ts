import { normalizeBasis, normalizeRequestFor, ratingCardConflictSchema, staleConflictBodySchema, toEngineeringCard, type Spec } from '@shuntwise/contracts';
import { CatalogueEvents, type CatalogueChange } from '../src/catalogue-events/catalogue-events.service';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('rating cards (real MariaDB)', () => {
  let t: TestApp;
  let engineer: string;
  let reviewer: string;
  let designer: string;
  let buyer: string;
  let maker = 0;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const newPart = () => createVendorPart(t.http, engineer, { manufacturer: 'Nettlecombe Devices', mpn: `NMZ-${++maker}` });
  const put = (id: number, version: number, fields: unknown, token = engineer) =>
    t.http.put(`/api/vendor-parts/${id}/rating-card?include=engineering`).set(auth(token)).send({ version, fields });
  const errorPaths = (body: { errors?: Array<{ path: string }> }) => (body.errors ?? []).map((e) => e.path);

  beforeAll(async () => {
    t = await createTestApp();
    [engineer, reviewer, designer, buyer] = await Promise.all([
      t.tokenFor('engineer'),
      t.tokenFor('reviewer@demo.test'),
      t.tokenFor('designer'),
      t.tokenFor('buyer'),
    ]);
  });
  afterAll(() => t.close());

  it('starts empty, saves a whole card with provenance and who confirmed it, and shows the engineering reading', async () => {
    const id = await newPart();
    const empty = await t.http.get(`/api/vendor-parts/${id}/rating-card?include=engineering`).set(auth(engineer));
    expect(empty.status).toBe(200);
    expect(empty.body).toMatchObject({
      vendorPartId: id,
      version: 0,
      fields: {},
      issues: [],
      engineering: { result: null, reason: expect.stringMatching(/vzNom and izt/) },
    });

    const res = await put(id, 0, demoCardFields());
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(1);
    expect(res.body.fields.izt).toEqual({
      value: 0.005,
      printed: '5 mA',
      provenance: {
        source: 'entered',
        datasheetId: null,
        page: null,
        text: null,
        confirmedBy: { id: expect.any(Number), name: 'Priya Raman' },
        confirmedAt: expect.any(String),
      },
    });
    // tc keeps the unit as given and adds V/K
    expect(res.body.fields.tc).toMatchObject({ value: 0.3, unit: 'mV/K', voltsPerKelvin: 0.0003 });
    const { result } = res.body.engineering;
    // 5.1 V lies between the tunnelling (< 5 V) and avalanche (> 6 V) ranges: "mixed" (common practice, no source)
    expect(result.mechanism).toBe('mixed');
    expect(result.model.basis).toBe('two-point');
    // With no spec linked, the card is read at its own test currents at 25 °C ambient. At izt
    // the junction self-heats, Tj = Ta + RthJA·Vz·I = 25 + 250·5.1·0.005 ≈ 31.4 °C, and
    // Vz(Tj) = Vz(25 °C) + αVz·(Tj − 25 °C) (DESIGN.md's temperature law; common practice, no source).
    const atIzt = result.points.find((p: { current: number; tempC: number }) => p.current === 0.005 && p.tempC === 25);
    expect(atIzt.tjC).toBeCloseTo(25 + 250 * atIzt.vzNom * 0.005, 6);
    expect(atIzt.vzNom).toBeCloseTo(5.1 + 0.0003 * (atIzt.tjC - 25), 6);
    expect(result.spiceModel).toMatch(/^\.model /);
    expect(await t.select('SELECT card_version AS version, vz_nom AS vzNom, izt FROM vendor_parts WHERE id = ?', [id])).toEqual([
      { version: 1, vzNom: 5.1, izt: 0.005 },
    ]);
  });

  it('converts a %/K coefficient to V/K with the card’s vzNom', async () => {
    const id = await newPart();
    const fields = demoCardFields({
      vzMin: { value: 11.4, provenance: { source: 'entered' } },
      vzNom: { value: 12, provenance: { source: 'entered' } },
      vzMax: { value: 12.6, provenance: { source: 'entered' } },
      vr: { value: 8, provenance: { source: 'entered' } },
      izm: { value: 38e-3, provenance: { source: 'entered' } },
      tc: { value: 0.06, unit: '%/K', printed: '0.06 %/K', provenance: { source: 'entered' } },
    });
    const res = await put(id, 0, fields);
    expect(res.status).toBe(200);
    // 0.06 %/K of 12 V = 7.2 mV/K (definition of a relative coefficient, common practice, no source)
    expect(res.body.fields.tc.voltsPerKelvin).toBeCloseTo(7.2e-3, 12);
    expect(res.body.engineering.result.mechanism).toBe('avalanche');
  });

  it('answers a stale save with 409 carrying the current card; nothing is overwritten', async () => {
    const id = await newPart();
    await put(id, 0, demoCardFields());
    // engineer and reviewer both loaded version 1; the reviewer saves first
    const first = await put(id, 1, demoCardFields({ zzt: { value: 35, printed: '35 Ω', provenance: { source: 'entered' } } }), reviewer);
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(2);

    const late = await put(id, 1, demoCardFields({ zzt: { value: 45, printed: '45 Ω', provenance: { source: 'entered' } } }));
    expect(late.status).toBe(409);
    expect(late.body.message).toMatch(/version 2/);
    expect(late.body.correlationId).toEqual(expect.any(String));
    expect(late.body.current).toMatchObject({ vendorPartId: id, version: 2, fields: { zzt: { value: 35 } }, updatedBy: { name: 'Tomas Eklund' } });
    expect(late.body.current.engineering.result).not.toBeNull();
    // the one stale-conflict body of the API, with the card view as `current` (contracts: staleConflictBodySchema, ratingCardConflictSchema)
    expect(late.body.code).toBe('stale');
    expect(staleConflictBodySchema.safeParse(late.body).success).toBe(true);
    expect(ratingCardConflictSchema.safeParse(late.body).success).toBe(true);
    expect(late.body.errors).toEqual([{ path: 'version', message: 'current version is 2' }]);

    const stored = await t.http.get(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer));
    expect(stored.body.fields.zzt.value).toBe(35);
    expect(await t.select('SELECT version FROM rating_card_versions WHERE vendor_part_id = ? ORDER BY version', [id])).toEqual([
      { version: 1 },
      { version: 2 },
    ]);
  });

  it('lets exactly one of two simultaneous saves on the same version win', async () => {
    const id = await newPart();
    await put(id, 0, demoCardFields());
    const [a, b] = await Promise.all([
      put(id, 1, demoCardFields({ zzk: { value: 450, provenance: { source: 'entered' } } })),
      put(id, 1, demoCardFields({ zzk: { value: 550, provenance: { source: 'entered' } } }), reviewer),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? 450 : 550;
    expect((await t.http.get(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer))).body).toMatchObject({
      version: 2,
      fields: { zzk: { value: winner } },
    });

    // two first saves (version 0) race too
    const fresh = await newPart();
    const [c, d] = await Promise.all([put(fresh, 0, demoCardFields()), put(fresh, 0, demoCardFields(), reviewer)]);
    expect([c.status, d.status].sort()).toEqual([200, 409]);
  });

  it('names the field of every bad value and writes nothing', async () => {
    const id = await newPart();
    const entered = { source: 'entered' };
    expect(errorPaths((await put(id, 0, demoCardFields({ vzMin: { value: 5.3, provenance: entered } }))).body)).toContain('fields.vzMin.value');
    expect(errorPaths((await put(id, 0, demoCardFields({ izk: { value: 6e-3, provenance: entered } }))).body)).toContain('fields.izk.value');
    expect(errorPaths((await put(id, 0, demoCardFields({ vr: { value: 6, provenance: entered } }))).body)).toContain('fields.vr.value');
    expect(errorPaths((await put(id, 0, demoCardFields({ zzt: { value: -3, provenance: entered } }))).body)).toContain('fields.zzt.value');
    expect(errorPaths((await put(id, 0, demoCardFields({ izt: undefined }))).body)).toContain('fields.izt');
    expect(errorPaths((await put(id, 0, demoCardFields({ tc: { value: -2, unit: 'mV/°C', provenance: entered } }))).body)).toContain('fields.tc.unit');
    expect(errorPaths((await put(id, 0, demoCardFields({ zzt: { value: 40, provenance: { source: 'extracted' } } }))).body)).toEqual(
      expect.arrayContaining(['fields.zzt.provenance.datasheetId', 'fields.zzt.provenance.page']),
    );
    const unknownSheet = await put(id, 0, demoCardFields({ zzt: { value: 40, provenance: { source: 'extracted', datasheetId: 424242, page: 1 } } }));
    expect(unknownSheet.status).toBe(400);
    expect(errorPaths(unknownSheet.body)).toEqual(['fields.zzt.provenance.datasheetId']);
    const unknownField = await put(id, 0, { ...demoCardFields(), colour: { value: 1, provenance: entered } });
    expect(unknownField.status).toBe(400);
    expect(await t.select('SELECT vendor_part_id FROM rating_cards WHERE vendor_part_id = ?', [id])).toEqual([]);
    expect(await t.select('SELECT id FROM rating_card_versions WHERE vendor_part_id = ?', [id])).toEqual([]);
  });

  it('keeps who confirmed an unchanged value; a changed value is confirmed by whoever saved it; a no-op save makes no version', async () => {
    const id = await newPart();
    await put(id, 0, demoCardFields());
    const v2 = await put(
      id,
      1,
      demoCardFields({ zzt: { value: 38, provenance: { source: 'entered' } }, irMax: { value: 2e-6, provenance: { source: 'entered' }, confirmed: false } }),
      reviewer,
    );
    expect(v2.body.fields.vzNom.provenance.confirmedBy.name).toBe('Priya Raman');
    expect(v2.body.fields.zzt.provenance.confirmedBy.name).toBe('Tomas Eklund');
    expect(v2.body.fields.irMax.provenance).toMatchObject({ confirmedBy: null, confirmedAt: null });

    const again = await put(
      id,
      2,
      demoCardFields({ zzt: { value: 38, provenance: { source: 'entered' } }, irMax: { value: 2e-6, provenance: { source: 'entered' }, confirmed: false } }),
      reviewer,
    );
    expect(again.body.version).toBe(2);

    const versions = await t.http.get(`/api/vendor-parts/${id}/rating-card/versions`).set(auth(designer));
    expect(versions.body.map((v: { version: number; changedFields: string[] }) => [v.version, v.changedFields])).toEqual([
      [2, ['zzt', 'irMax']],
      [1, ['vzMin', 'vzNom', 'vzMax', 'izt', 'zzt', 'izk', 'zzk', 'irMax', 'vr', 'tc', 'pdMax', 'pdRefC', 'tjMax', 'rthJA', 'izm']],
    ]);
    // the history says old → new for each changed field (SI; tc in its own unit)
    expect(versions.body[0].changes).toEqual([
      { field: 'zzt', from: { value: 40 }, to: { value: 38 } },
      { field: 'irMax', from: { value: 1e-6 }, to: { value: 2e-6 } },
    ]);
    expect(versions.body[1].changes.find((c: { field: string }) => c.field === 'tc')).toEqual({ field: 'tc', from: null, to: { value: 0.3, unit: 'mV/K' } });
    const old = await t.http.get(`/api/vendor-parts/${id}/rating-card?version=1`).set(auth(designer));
    expect(old.body).toMatchObject({ version: 1, fields: { zzt: { value: 40 } }, updatedBy: { name: 'Priya Raman' } });
    expect((await t.http.get(`/api/vendor-parts/${id}/rating-card?version=9`).set(auth(designer))).status).toBe(404);
  });

  it('normalises at the spec of the house part the vendor part is a source of', async () => {
    const id = await newPart();
    await put(id, 0, demoCardFields());
    const housePartId = await createHousePart(t.http, engineer, 'HP-CARD-1');
    await t.http
      .put(`/api/house-parts/${housePartId}/spec`)
      .set(auth(engineer))
      .send({ baseVersion: 0, spec: demoSpec({ iRef: 2e-3 }) });
    await t.http.post(`/api/house-parts/${housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: id });

    const view = await t.http.get(`/api/vendor-parts/${id}/rating-card?include=engineering`).set(auth(designer));
    expect(view.body.engineering.basis).toEqual({ housePartId, partNumber: 'HP-CARD-1', specVersion: 1 });
    const points = view.body.engineering.result.points as Array<{ current: number; tempC: number }>;
    expect([...new Set(points.map((p) => p.current))]).toEqual([0.25e-3, 1e-3, 2e-3, 20e-3]);
    expect([...new Set(points.map((p) => p.tempC))]).toEqual([-40, 25, 85]);
    const explicit = await t.http.get(`/api/vendor-parts/${id}/rating-card?include=engineering&housePartId=${housePartId}`).set(auth(designer));
    expect(explicit.body.engineering.basis.housePartId).toBe(housePartId);

    // The card editor asks POST /engineering/normalize with the request contracts' normalizeBasis builds from the
    // spec (as the web does); the read and the editor must show the same numbers, from the one function.
    const spec = (await t.http.get(`/api/house-parts/${housePartId}/spec`).set(auth(designer))).body as { spec: Spec; version: number };
    const card = toEngineeringCard(view.body.fields)!;
    const editorRequest = normalizeRequestFor(card, normalizeBasis(card, { spec: spec.spec, partNumber: 'HP-CARD-1', version: spec.version }));
    const editor = await t.http.post('/api/engineering/normalize').set(auth(engineer)).send(editorRequest);
    expect(editor.status).toBe(200);
    expect(editor.body).toEqual(view.body.engineering.result);
    // With no spec the editor's stated defaults (the card's test points and 1, 5, 10, 20 mA at 25 °C) are the read's too.
    const lone = await newPart();
    const own = await put(lone, 0, demoCardFields());
    const ownCard = toEngineeringCard(own.body.fields)!;
    const editorOwn = await t.http
      .post('/api/engineering/normalize')
      .set(auth(engineer))
      .send(normalizeRequestFor(ownCard, normalizeBasis(ownCard, null)));
    expect(editorOwn.body).toEqual(own.body.engineering.result);
    expect([...new Set((own.body.engineering.result.points as Array<{ current: number }>).map((p) => p.current))]).toEqual([0.25e-3, 1e-3, 5e-3, 10e-3, 20e-3]);
  });

  it('reads the card without computing its engineering summary unless asked', async () => {
    const id = await newPart();
    await put(id, 0, demoCardFields());
    const plain = await t.http.get(`/api/vendor-parts/${id}/rating-card`).set(auth(designer));
    expect(plain.status).toBe(200);
    expect(plain.body).toMatchObject({ vendorPartId: id, version: 1, issues: expect.any(Array) });
    expect(plain.body).not.toHaveProperty('engineering');
    const asked = await t.http.get(`/api/vendor-parts/${id}/rating-card?include=engineering`).set(auth(designer));
    expect(asked.body.engineering.result.model.basis).toBe('two-point');
    expect((await t.http.get(`/api/vendor-parts/${id}/rating-card?include=everything`).set(auth(designer))).status).toBe(400);
  });

  it('tells subscribers of a new card version inside the transaction', async () => {
    const id = await newPart();
    const seen: CatalogueChange[] = [];
    const off = t.stack.app.get(CatalogueEvents).subscribe((change) => void seen.push(change));
    await put(id, 0, demoCardFields());
    await put(id, 1, demoCardFields({ zzt: { value: 30, provenance: { source: 'entered' } } }));
    await put(id, 2, demoCardFields({ zzt: { value: 30, provenance: { source: 'entered' } } })); // no change, no event
    off();
    expect(seen.map((c) => c.kind === 'card-changed' && [c.vendorPartId, c.version, c.previousVersion, c.changedFields.length])).toEqual([
      [id, 1, null, 15],
      [id, 2, 1, 1],
    ]);
  });

  it('exports the card as SPICE .model lines for the nominal part and both tolerance ends', async () => {
    const id = await newPart();
    expect((await t.http.get(`/api/vendor-parts/${id}/model`).set(auth(designer))).status).toBe(404);
    await put(id, 0, demoCardFields());
    const res = await t.http.get(`/api/vendor-parts/${id}/model`).set(auth(designer));
    expect(res.status).toBe(200);
    const name = `NMZ_${maker}`;
    expect(res.body).toMatchObject({ vendorPartId: id, cardVersion: 1, name, caution: expect.stringMatching(/confirm by measurement/) });
    expect(res.body.lines.nom).toMatch(new RegExp(`^\\.model ${name} D\\(BV=[\\d.]+ IBV=0\\.005 NBV=[\\d.]+ RS=[\\d.]+ `));
    expect(res.body.lines.min).toMatch(new RegExp(`^\\.model ${name}_MIN D\\(`));
    expect(res.body.lines.max).toMatch(new RegExp(`^\\.model ${name}_MAX D\\(`));
    // Zd(I) = NBV·Vt/I + RS through (5 mA, 40 Ω) and (0.25 mA, 500 Ω), solved by hand:
    // NBV·Vt = 460/(4000 − 200) V ≈ 0.12105 V, RS = 40 − 200·0.12105 ≈ 15.789 Ω
    // (the SPICE diode's reverse branch as DESIGN.md states it; common practice, no source).
    expect(res.body.model.basis).toBe('two-point');
    expect(res.body.model.nbvVt).toBeCloseTo(460 / 3800, 9);
    expect(res.body.model.rs).toBeCloseTo(40 - 200 * (460 / 3800), 9);
    expect((await t.http.get(`/api/vendor-parts/${id}/model`).set(auth(buyer))).status).toBe(403);
  });

  it('lets designers read cards; buyers neither read nor write them; designers do not write', async () => {
    const id = await newPart();
    expect((await t.http.get(`/api/vendor-parts/${id}/rating-card`).set(auth(designer))).status).toBe(200);
    expect((await t.http.get(`/api/vendor-parts/${id}/rating-card`).set(auth(buyer))).status).toBe(403);
    expect((await put(id, 0, demoCardFields(), buyer)).status).toBe(403);
    expect((await put(id, 0, demoCardFields(), designer)).status).toBe(403);
    expect((await put(987654, 0, demoCardFields())).status).toBe(404);
  });
});
