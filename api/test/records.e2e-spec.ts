import { createHash } from 'node:crypto';
import { CHECK_LABELS, QUALIFICATION_VERDICT_LABELS } from '@shuntwise/contracts';
import { readPdf } from '../src/extraction/pdf-text';
import { DecisionRecordsService } from '../src/qualifications/records/decision-records.service';
import { canonicalJson, type RecordInputs } from '../src/qualifications/records/record-inputs';
import { StorageService } from '../src/storage/storage.service';
import { UsersRepository } from '../src/users/users.repository';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

/**
 * The decision record: a PDF made once per decided case, stored with its sha256, never
 * made again. Text is read back with pdfjs-dist (an independent PDF reader).
 */
describe('decision records (real MariaDB, S3 fake)', () => {
  let t: TestApp;
  let engineer: string; // Priya Raman prepares
  let reviewer: string; // Tomas Eklund decides
  let buyer: string;
  let designer: string;
  let admin: string;
  let reviewerId: number;
  let buyerId: number;
  let n = 0;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');
  const entered = { source: 'entered' as const };

  async function decided(action: 'clear' | 'reject' | 'clear-with-conditions', body: Record<string, unknown> = {}, measured = false) {
    n++;
    const housePartId = await createHousePart(t.http, engineer, `HPR-${n}`, `Record case ${n}`);
    expect(
      (
        await t.http
          .put(`/api/house-parts/${housePartId}/spec`)
          .set(auth(engineer))
          .send({ baseVersion: 0, spec: demoSpec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } }) })
      ).status,
    ).toBe(200);
    const vendorPartId = await createVendorPart(t.http, engineer, { manufacturer: 'Orrin Devices', mpn: `OR-${n}`, package: 'SOD-123' });
    const fields = demoCardFields({
      vzMin: { value: 4.9, printed: '4.9 V', provenance: entered },
      vzMax: { value: 5.3, printed: '5.3 V', provenance: entered },
    });
    expect((await t.http.put(`/api/vendor-parts/${vendorPartId}/rating-card`).set(auth(engineer)).send({ version: 0, fields })).status).toBe(200);
    await t.http
      .post('/api/house-parts/' + housePartId + '/buyers')
      .set(auth(buyer))
      .send({ userId: buyerId });
    if (measured) {
      // Two invented samples on the card's own law, Zd = 2·Vt/I + 5 Ω around 5.1 V at 5 mA (SPICE reverse branch; common practice, no source).
      const VT = 0.025693;
      const lines = ['sample,lot,current (mA),voltage (V),temperature (°C)'];
      for (const [id, v0] of [
        ['S1', 5.08],
        ['S2', 5.12],
      ] as const)
        for (const mA of [0.5, 1, 2, 5, 10, 20]) lines.push(`${id},L7,${mA},${(v0 + 2 * VT * Math.log(mA / 5) + 5 * (mA - 5) * 1e-3).toFixed(5)},25`);
      const up = await t.http
        .post('/api/measurement-sets')
        .set(auth(engineer))
        .field('vendorPartId', String(vendorPartId))
        .attach('file', Buffer.from(lines.join('\n')), 'bench-or.csv');
      expect(up.status).toBe(201);
    }
    const opened = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId, vendorPartId });
    expect(opened.status).toBe(201);
    const id = opened.body.id as number;
    expect(
      (
        await t.http
          .post(`/api/qualifications/${id}/comments`)
          .set(auth(engineer))
          .send({ text: `Bench notes for case ${n}: leakage looks low.` })
      ).status,
    ).toBe(201);
    const version = (await t.http.get(`/api/qualifications/${id}`).set(auth(engineer))).body.version;
    const submitted = await t.http.post(`/api/qualifications/${id}/submit`).set(auth(engineer)).send({ version, reviewerId });
    expect(submitted.status).toBe(200);
    const res = await t.http
      .post(`/api/qualifications/${id}/${action}`)
      .set(auth(reviewer))
      .send({ version: submitted.body.version, ...body });
    expect(res.status).toBe(200);
    return res.body as {
      id: number;
      state: string;
      version: number;
      evaluation: { checks: Array<{ id: keyof typeof CHECK_LABELS; label: string; verdict: keyof typeof QUALIFICATION_VERDICT_LABELS }> };
    };
  }

  const recordRow = async (id: number) =>
    (
      await t.select<{ state: string; storage_key: string; sha256: string | null; inputs_sha256: string; inputs: string; size: number | null }>(
        `SELECT * FROM decision_records WHERE qualification_id = ?`,
        [id],
      )
    )[0];

  async function pdfText(bytes: Uint8Array): Promise<string> {
    const pdf = await readPdf(bytes);
    return pdf.pages.flatMap((p) => p.items.map((i) => i.str)).join(' ');
  }
  const squash = (s: string) => s.replace(/\s+/g, '');

  beforeAll(async () => {
    t = await createTestApp();
    [engineer, reviewer, buyer, designer, admin] = await Promise.all([
      t.tokenFor('engineer@demo.test'),
      t.tokenFor('reviewer@demo.test'),
      t.tokenFor('buyer'),
      t.tokenFor('designer'),
      t.tokenFor('admin'),
    ]);
    const users = t.stack.app.get(UsersRepository);
    reviewerId = (await users.findByEmail('reviewer@demo.test'))!.id;
    buyerId = (await users.findByEmail('buyer@demo.test'))!.id;
  });
  afterAll(() => t.close());

  it('stores one PDF per decision whose bytes match the recorded sha256 and whose text names the decision, the checks, both engineers and the inputs hash', async () => {
    const c = await decided('clear', { note: 'Second source for the 5.1 V rail.' }, true);
    const row = await recordRow(c.id);
    expect(row).toMatchObject({ state: 'stored', storage_key: expect.stringMatching(/^records\/[0-9a-f-]{36}\.pdf$/) });
    const stored = await t.stack.app.get(StorageService).getBytes(row.storage_key);
    expect(sha(stored)).toBe(row.sha256);
    expect(stored.byteLength).toBe(row.size);
    expect(createHash('sha256').update(row.inputs).digest('hex')).toBe(row.inputs_sha256);

    const res = await t.http
      .get(`/api/qualifications/${c.id}/record`)
      .set(auth(buyer))
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (d: Buffer) => chunks.push(d));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe(`attachment; filename="decision-record-case-${c.id}.pdf"`);
    expect(res.headers['x-record-sha256']).toBe(row.sha256);
    const bytes = res.body as Buffer;
    expect(sha(bytes)).toBe(row.sha256);

    const text = squash(await pdfText(bytes));
    expect(text).toContain(squash('Decision: Cleared by Tomas Eklund'));
    expect(text).toContain(squash('Note: Second source for the 5.1 V rail.'));
    expect(text).toContain(squash('Prepared by Priya Raman'));
    for (const check of c.evaluation.checks) {
      expect(text).toContain(squash(check.label));
      expect(text).toContain(squash(QUALIFICATION_VERDICT_LABELS[check.verdict]));
    }
    expect(text).toContain(row.inputs_sha256);
    expect(text).toContain(squash('Bench notes for case'));
    expect(text).toContain(squash('I–V curve of the card at 25 °C'));
    expect(text).toContain(squash('Estimates from datasheet values'));
    // the measurement set with its file, hash and measured checks
    const [set] = await t.select<{ sha256: string }>(
      `SELECT m.sha256 FROM measurement_sets m JOIN qualifications q ON q.vendor_part_id = m.vendor_part_id WHERE q.id = ?`,
      [c.id],
    );
    expect(text).toContain(squash('bench-or.csv, 2 sample(s), 12 point(s)'));
    expect(text).toContain(set.sha256);
    expect(text).toContain(squash('Zener voltage at the card’s test current'));
    // the card with its provenance and the spec version
    expect(text).toContain(squash('rating card version 1'));
    expect(text).toContain(squash('spec version 1'));

    const meta = await t.http.get(`/api/qualifications/${c.id}/record/meta`).set(auth(admin));
    expect(meta.status).toBe(200);
    expect(meta.body).toMatchObject({
      qualificationId: c.id,
      state: 'stored',
      sha256: row.sha256,
      inputsSha256: row.inputs_sha256,
      size: row.size,
      path: `/api/qualifications/${c.id}/record`,
    });

    // the buyers' mail links the record
    const mail = await eventually(async () => (await t.capturedMail()).find((m) => m.body.includes(`/api/qualifications/${c.id}/record`)));
    expect(mail.recipients).toContain('buyer@demo.test');
    // a designer reads the record of a cleared case
    expect((await t.http.get(`/api/qualifications/${c.id}/record/meta`).set(auth(designer))).status).toBe(200);
  });

  it('never makes a record again: a second decision is refused and leaves the bytes; a re-render equals them; changed inputs are refused', async () => {
    const c = await decided('reject', { reason: 'Knee too soft for the sensor rail.' });
    const before = await recordRow(c.id);
    expect(before.state).toBe('stored');
    const again = await t.http.post(`/api/qualifications/${c.id}/clear`).set(auth(reviewer)).send({ version: c.version });
    expect(again.status).toBe(409);
    const after = await recordRow(c.id);
    expect(after).toEqual(before);
    expect(sha(await t.stack.app.get(StorageService).getBytes(after.storage_key))).toBe(before.sha256);

    const records = t.stack.app.get(DecisionRecordsService);
    const redrawn = await records.rerender(c.id);
    expect(sha(redrawn)).toBe(before.sha256); // the same inputs give the same bytes
    const inputs = JSON.parse(before.inputs) as RecordInputs;
    const changed: RecordInputs = { ...inputs, comments: [...inputs.comments, { at: inputs.madeAt, by: 'Someone Else', text: 'added later' }] };
    await expect(records.rerender(c.id, changed)).rejects.toThrow(/Refused: these inputs/);
    // the snapshot of the case as it is now is what was frozen
    expect(canonicalJson(await records.snapshot(c.id, undefined, new Date(inputs.madeAt)))).toBe(before.inputs);
    // a designer does not see the record of a rejected case
    expect((await t.http.get(`/api/qualifications/${c.id}/record`).set(auth(designer))).status).toBe(403);
  });

  it('keeps the decision when the object store refuses, and makes the record on the next read', async () => {
    const storage = t.stack.app.get(StorageService);
    const put = jest.spyOn(storage, 'put').mockRejectedValueOnce(new Error('object store down'));
    let c: Awaited<ReturnType<typeof decided>>;
    try {
      c = await decided('clear-with-conditions', { conditions: 'Only on boards with the 1 % resistor.' });
    } finally {
      put.mockRestore();
    }
    expect(c.state).toBe('cleared-with-conditions');
    const pending = await recordRow(c.id);
    expect(pending).toMatchObject({ state: 'pending', sha256: null });
    const res = await t.http.get(`/api/qualifications/${c.id}/record/meta`).set(auth(engineer));
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('stored');
    const stored = await recordRow(c.id);
    expect(stored.inputs_sha256).toBe(pending.inputs_sha256);
    expect(sha(await storage.getBytes(stored.storage_key))).toBe(stored.sha256);
    expect(stored.storage_key).toBe(pending.storage_key);
  });

  it('refuses a record of an open case and of a missing one, naming why', async () => {
    const housePartId = await createHousePart(t.http, engineer, 'HPR-OPEN');
    await t.http.put(`/api/house-parts/${housePartId}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: demoSpec() });
    const vendorPartId = await createVendorPart(t.http, engineer, { manufacturer: 'Orrin Devices', mpn: 'OR-OPEN' });
    await t.http.put(`/api/vendor-parts/${vendorPartId}/rating-card`).set(auth(engineer)).send({ version: 0, fields: demoCardFields() });
    const opened = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId, vendorPartId });
    const open = await t.http.get(`/api/qualifications/${opened.body.id}/record`).set(auth(engineer));
    expect(open.status).toBe(404);
    expect(open.body.message).toMatch(/is draft: a record is made when it is decided/);
    expect((await t.http.get('/api/qualifications/999999/record').set(auth(buyer))).status).toBe(404);
  });
});
