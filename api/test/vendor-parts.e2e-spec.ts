import { demoCardFields } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('vendor parts (real MariaDB)', () => {
  let t: TestApp;
  let engineer: string;
  let buyer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const mpns = (body: { items: Array<{ mpn: string }> }) => body.items.map((i) => i.mpn);

  beforeAll(async () => {
    t = await createTestApp();
    [engineer, buyer] = await Promise.all([t.tokenFor('engineer'), t.tokenFor('buyer')]);
  });
  afterAll(() => t.close());

  it('creates a vendor part; the mpn is unique per manufacturer (case-insensitive), not across them', async () => {
    const res = await t.http
      .post('/api/vendor-parts')
      .set(auth(engineer))
      .send({ manufacturer: 'Corriebank Electronics', mpn: 'CBX3-4V7', package: 'SOD-123', lifecycleNote: 'active' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      manufacturer: 'Corriebank Electronics',
      mpn: 'CBX3-4V7',
      package: 'SOD-123',
      lifecycleNote: 'active',
      card: null,
      datasheets: [],
      sourceOf: [],
    });

    const dup = await t.http.post('/api/vendor-parts').set(auth(engineer)).send({ manufacturer: 'Corriebank Electronics', mpn: 'cbx3-4v7' });
    expect(dup.status).toBe(409);
    expect(dup.body.errors[0].path).toBe('mpn');
    const other = await t.http.post('/api/vendor-parts').set(auth(engineer)).send({ manufacturer: 'Lumenvale Micro', mpn: 'CBX3-4V7' });
    expect(other.status).toBe(201);

    const missing = await t.http.post('/api/vendor-parts').set(auth(engineer)).send({ mpn: 'X1' });
    expect(missing.status).toBe(400);
    expect(missing.body.errors[0].path).toBe('manufacturer');
    expect((await t.http.post('/api/vendor-parts').set(auth(buyer)).send({ manufacturer: 'A', mpn: 'B' })).status).toBe(403);

    const patched = await t.http
      .patch(`/api/vendor-parts/${res.body.id}`)
      .set(auth(engineer))
      .send({ lifecycleNote: 'last-time buy announced', package: 'SOD-323' });
    expect(patched.body).toMatchObject({ lifecycleNote: 'last-time buy announced', package: 'SOD-323' });
    const clash = await t.http.patch(`/api/vendor-parts/${other.body.id}`).set(auth(engineer)).send({ manufacturer: 'Corriebank Electronics' });
    expect(clash.status).toBe(409);
    expect((await t.http.patch(`/api/vendor-parts/${res.body.id}`).set(auth(buyer)).send({ package: 'X' })).status).toBe(403);
    expect((await t.http.get(`/api/vendor-parts/${res.body.id}`).set(auth(buyer))).status).toBe(200);

    const manufacturers = await t.http.get('/api/manufacturers').set(auth(buyer));
    expect(manufacturers.body).toEqual(
      expect.arrayContaining([
        { id: expect.any(Number), name: 'Corriebank Electronics', vendorPartCount: 1 },
        { id: expect.any(Number), name: 'Lumenvale Micro', vendorPartCount: 1 },
      ]),
    );
  });

  it('publishes the catalogue schemas at /api/docs (request and answer bodies, list parameters)', async () => {
    const docs = (await t.http.get('/api/docs-json')).body;
    expect(Object.keys(docs.components.schemas)).toEqual(
      expect.arrayContaining([
        'VendorPartPageDto',
        'PutRatingCardDto',
        'RatingCardViewDto',
        'RatingCardConflictDto',
        'PutSpecDto',
        'SpecVersionDto',
        'SourceDto',
        'UploadDatasheetResponseDto',
        'CsvImportPreviewDto',
      ]),
    );
    expect(docs.paths['/api/vendor-parts'].get.parameters.map((p: { name: string }) => p.name)).toEqual(
      expect.arrayContaining(['pageIndex', 'pageSize', 'sort', 'mpn', 'manufacturer', 'package', 'vzNomMin', 'vzNomMax', 'hasCard']),
    );
    expect(docs.paths['/api/datasheets'].post.requestBody.content['multipart/form-data'].schema.properties.file).toEqual({ type: 'string', format: 'binary' });
  });

  describe('lists: pagination, sorting and filtering in SQL', () => {
    const voltages = [2.4, 3.3, 4.7, 5.1, 6.2, 8.2, 10, 12, 15, 24];
    beforeAll(async () => {
      // Two invented vendors, ten parts each; every second part of the second vendor has no card.
      for (const [v, vendor] of ['Quarryhill Parts', 'Tevorrow Semicon'].entries()) {
        for (const [i, vz] of voltages.entries()) {
          const mpn = `${v ? 'TPZ' : 'QHZ'}${String(vz).replace('.', 'V')}-L`;
          const id = (
            await t.http
              .post('/api/vendor-parts')
              .set(auth(engineer))
              .send({ manufacturer: vendor, mpn, package: i % 3 ? 'SOD-123' : 'DO-35' })
          ).body.id;
          if (v === 1 && i % 2) continue;
          const fields = demoCardFields({
            vzMin: { value: vz * 0.95, provenance: { source: 'entered' } },
            vzNom: { value: vz, provenance: { source: 'entered' } },
            vzMax: { value: vz * 1.05, provenance: { source: 'entered' } },
            vr: { value: vz * 0.5, provenance: { source: 'entered' } },
            tc: { value: vz < 5 ? -1 : 2, unit: 'mV/K', provenance: { source: 'entered' } },
          });
          const put = await t.http.put(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer)).send({ version: 0, fields });
          if (put.status !== 200) throw new Error(JSON.stringify(put.body));
        }
      }
    });

    it('pages with a total, in a stable order', async () => {
      const p0 = await t.http.get('/api/vendor-parts?mpn=QHZ&pageSize=4&pageIndex=0').set(auth(buyer));
      const p2 = await t.http.get('/api/vendor-parts?mpn=QHZ&pageSize=4&pageIndex=2').set(auth(buyer));
      expect(p0.body.total).toBe(10);
      expect(p0.body.items).toHaveLength(4);
      expect(p2.body.items).toHaveLength(2);
      const all = await t.http.get('/api/vendor-parts?mpn=QHZ&pageSize=10').set(auth(buyer));
      expect([
        ...mpns(p0.body),
        ...mpns((await t.http.get('/api/vendor-parts?mpn=QHZ&pageSize=4&pageIndex=1').set(auth(buyer))).body),
        ...mpns(p2.body),
      ]).toEqual(mpns(all.body));
      expect(mpns(all.body)).toEqual([...mpns(all.body)].sort((a, b) => a.localeCompare(b, 'en', { sensitivity: 'base' })));
    });

    it('sorts by card values and by manufacturer, either direction', async () => {
      const byVz = await t.http.get('/api/vendor-parts?manufacturer=Quarryhill%20Parts&sort=-vzNom&pageSize=3').set(auth(buyer));
      expect(byVz.body.items.map((i: { card: { vzNom: number } }) => i.card.vzNom)).toEqual([24, 15, 12]);
      const byMaker = await t.http.get('/api/vendor-parts?mpn=&sort=-manufacturer,mpn&pageSize=1').set(auth(buyer));
      expect(byMaker.status).toBe(400); // an empty mpn filter is refused, not read as "everything"
      const desc = await t.http.get('/api/vendor-parts?sort=-manufacturer,mpn&pageSize=1').set(auth(buyer));
      expect(desc.body.items[0]).toMatchObject({ manufacturer: 'Tevorrow Semicon', mpn: 'TPZ10-L' });
    });

    it('filters by manufacturer, package, Zener-voltage range and card presence', async () => {
      const range = await t.http.get('/api/vendor-parts?vzNomMin=4.5&vzNomMax=10&sort=vzNom,manufacturer&pageSize=50').set(auth(buyer));
      expect(range.body.items.map((i: { card: { vzNom: number } }) => i.card.vzNom)).toEqual([4.7, 4.7, 5.1, 6.2, 6.2, 8.2, 10, 10]);
      expect(range.body.total).toBe(8);

      const noCard = await t.http.get('/api/vendor-parts?hasCard=false&manufacturer=Tevorrow%20Semicon').set(auth(buyer));
      expect(noCard.body.total).toBe(5);
      expect(noCard.body.items.every((i: { card: unknown }) => i.card === null)).toBe(true);

      const pkg = await t.http.get('/api/vendor-parts?package=DO-35&manufacturer=Quarryhill%20Parts,Tevorrow%20Semicon&pageSize=50').set(auth(buyer));
      expect(pkg.body.total).toBe(8);
      const global = await t.http.get('/api/vendor-parts?q=tevorrow&pageSize=50').set(auth(buyer));
      expect(global.body.total).toBe(10);
      expect((await t.http.get('/api/vendor-parts?q=QHZ1&pageSize=50').set(auth(buyer))).body.items.map((i: { mpn: string }) => i.mpn)).toEqual([
        'QHZ10-L',
        'QHZ12-L',
        'QHZ15-L',
      ]);
      const wildcard = await t.http.get('/api/vendor-parts?mpn=%25').set(auth(buyer));
      expect(wildcard.body.total).toBe(0); // a typed % matches itself, not everything

      const bad = await t.http.get('/api/vendor-parts?vzNomMin=12&vzNomMax=5').set(auth(buyer));
      expect(bad.status).toBe(400);
      expect(bad.body.errors[0].path).toBe('vzNomMin');
      expect((await t.http.get('/api/vendor-parts?sort=price').set(auth(buyer))).status).toBe(400);
    });
  });
});
