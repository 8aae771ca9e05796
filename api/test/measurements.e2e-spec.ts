import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { StorageService } from '../src/storage/storage.service';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

// Points on the SPICE reverse-breakdown law V = v0 + NBV·Vt·ln(I/IBV) + RS·(I − IBV) (ngspice manual,
// diode model, quoted from memory); the fit itself is checked against ngspice in src/engineering.
const VT = 0.025693;
function csvOf(samples: Array<{ id: string; lot: string; v0: number }>, header = 'sample,lot,current (mA),voltage (V),temperature (°C)'): string {
  const lines = [header];
  for (const s of samples)
    for (const mA of [0.2, 0.5, 1, 2, 5, 10, 20])
      lines.push(`${s.id},${s.lot},${mA},${(s.v0 + 2 * VT * Math.log(mA / 5) + 5 * (mA - 5) * 1e-3).toFixed(5)},25`);
  return lines.join('\n');
}

describe('measurement sets (real MariaDB, S3 fake)', () => {
  let t: TestApp;
  let engineer: string;
  let reviewer: string;
  let designer: string;
  let reviewerId: number;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const objects = async () => {
    const storage = t.stack.app.get(StorageService);
    const out = await storage.client.send(new ListObjectsV2Command({ Bucket: storage.bucket, Prefix: 'measurements/' }));
    return (out.Contents ?? []).length;
  };
  const rows = async () => (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM measurement_sets'))[0].n;
  const upload = (vendorPartId: number, csv: string, token = engineer, fields: Record<string, string> = {}) => {
    let req = t.http.post('/api/measurement-sets').set(auth(token)).field('vendorPartId', String(vendorPartId));
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    return req.attach('file', Buffer.from(csv), 'bench.csv');
  };

  beforeAll(async () => {
    t = await createTestApp();
    [engineer, reviewer, designer] = await Promise.all([t.tokenFor('engineer@demo.test'), t.tokenFor('reviewer@demo.test'), t.tokenFor('designer')]);
    reviewerId = (await t.http.get('/api/auth/me').set(auth(reviewer))).body.id;
  });
  afterAll(() => t.close());

  async function partWithCard(mpn: string) {
    const id = await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn, package: 'SOD-123' });
    expect((await t.http.put(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer)).send({ version: 0, fields: demoCardFields() })).status).toBe(200);
    return id;
  }

  it('previews a file with its row errors and stores nothing', async () => {
    const id = await partWithCard('FZ-M1');
    const before = { rows: await rows(), objects: await objects() };
    const res = await t.http
      .post('/api/measurement-sets/preview')
      .set(auth(engineer))
      .attach('file', Buffer.from('sample,current (mA),voltage (V)\nS1,1,5.0\nS1,x,5.1'), 'b.csv');
    expect(res.status).toBe(200);
    expect(res.body.errors).toEqual([{ row: 3, column: 'current (mA)', message: expect.stringMatching(/current \(mA\)/) }]);
    expect(res.body.samples[0].points).toHaveLength(1);
    // the same file is refused for storing, naming the row; nothing is kept
    const stored = await upload(id, 'sample,current (mA),voltage (V)\nS1,1,5.0\nS1,x,5.1');
    expect(stored.status).toBe(422);
    expect(stored.body.errors[0].path).toBe('row 3, current (mA)');
    expect({ rows: await rows(), objects: await objects() }).toEqual(before);
  });

  it('stores the file with its sha256, fits each sample and holds a drifting lot against the datasheet window', async () => {
    const id = await partWithCard('FZ-M2');
    const csv = csvOf([
      { id: 'A1', lot: 'L2340', v0: 5.08 },
      { id: 'A2', lot: 'L2340', v0: 5.12 },
      { id: 'B1', lot: 'L2351', v0: 5.42 },
    ]);
    const res = await upload(id, csv, engineer, { instrument: 'curve tracer 2', measuredOn: '2026-11-30' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ vendorPartId: id, instrument: 'curve tracer 2', measuredOn: '2026-11-30', uploadedBy: { name: 'Priya Raman' } });
    expect(res.body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const a = res.body.analysis;
    expect(a.samples.map((s: { sampleId: string; vzAtIzt: number }) => [s.sampleId, Number(s.vzAtIzt.toFixed(3))])).toEqual([
      ['A1', 5.08],
      ['A2', 5.12],
      ['B1', 5.42],
    ]);
    const vz = a.checks.find((c: { id: string }) => c.id === 'card-vz');
    expect(vz).toMatchObject({ verdict: 'fail', failingSamples: ['B1'], limit: 5.36 });
    expect(a.lots.map((l: { lot: string | null; samples: number }) => [l.lot, l.samples])).toEqual([
      ['L2340', 2],
      ['L2351', 1],
      [null, 3],
    ]);
    expect(a.caution).toMatch(/standards/);

    const file = await t.http.get(`/api/measurement-sets/${res.body.id}/file`).set(auth(engineer));
    expect(file.status).toBe(200);
    expect(file.text).toBe(csv);
    // the same file again for the same part is the same evidence
    expect((await upload(id, csv)).status).toBe(409);
    // against a house part's spec as well
    const hp = await createHousePart(t.http, engineer, 'HPM-1', 'measured');
    expect((await t.http.put(`/api/house-parts/${hp}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: demoSpec() })).status).toBe(200);
    const withSpec = await t.http.get(`/api/vendor-parts/${id}/measurement-sets?housePartId=${hp}`).set(auth(engineer));
    expect(withSpec.status).toBe(200);
    expect(withSpec.body[0].analysis).toMatchObject({ housePartId: hp, specVersion: 1 });
    expect(withSpec.body[0].analysis.checks.map((c: { id: string }) => c.id)).toEqual(expect.arrayContaining(['spec-vz', 'spec-zd']));
  });

  it('refuses designers and a missing file with plain messages', async () => {
    const id = await partWithCard('FZ-M3');
    expect((await upload(id, csvOf([{ id: 'A', lot: 'L', v0: 5.1 }]), designer)).status).toBe(403);
    const none = await t.http.post('/api/measurement-sets').set(auth(engineer)).field('vendorPartId', String(id));
    expect(none.status).toBe(400);
    expect(none.body.message).toMatch(/CSV in the multipart field "file"/);
    expect((await upload(999999, csvOf([{ id: 'A', lot: 'L', v0: 5.1 }]))).status).toBe(400);
  });

  it('flags the part’s decided case for a re-check, as a new datasheet does', async () => {
    const vendorPartId = await partWithCard('FZ-M4');
    const housePartId = await createHousePart(t.http, engineer, 'HPM-2', 'measured case');
    expect(
      (
        await t.http
          .put(`/api/house-parts/${housePartId}/spec`)
          .set(auth(engineer))
          .send({ baseVersion: 0, spec: demoSpec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } }) })
      ).status,
    ).toBe(200);
    const opened = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId, vendorPartId });
    expect(opened.status).toBe(201);
    const submitted = await t.http.post(`/api/qualifications/${opened.body.id}/submit`).set(auth(engineer)).send({ reviewerId, version: opened.body.version });
    expect(submitted.status).toBe(200);
    const decided = await t.http
      .post(`/api/qualifications/${opened.body.id}/clear-with-conditions`)
      .set(auth(reviewer))
      .send({ version: submitted.body.version, conditions: 'bench samples to follow' });
    expect(decided.status).toBe(200);
    expect((await upload(vendorPartId, csvOf([{ id: 'C1', lot: 'L9', v0: 5.1 }]))).status).toBe(201);
    const flagged = (await t.http.get(`/api/qualifications/${opened.body.id}`).set(auth(engineer))).body;
    expect(flagged.needsRecheck).toBe(true);
    expect(flagged.recheckReasons.at(-1)).toMatchObject({ cause: 'measurements-added', detail: expect.stringMatching(/1 sample\)/) });
  });
});
