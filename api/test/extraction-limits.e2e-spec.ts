import type { ExtractionResult } from '@shuntwise/contracts';
import { DatasheetReader } from '../src/datasheets/datasheet-reader';
import { zeroBombPdf } from './helpers/hostile-pdf';
import { createTestApp, type TestApp } from './helpers/test-app';

// Invented datasheets from @shuntwise/test-fixtures (see its README).
const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');

/**
 * A hostile upload is read in a child process with a memory and time limit per file: it is
 * refused with a 422 naming the limit, the API keeps answering meanwhile, and the next
 * upload is read by a fresh child.
 */
describe('datasheets: bounded reading, and OCR of scans (real MariaDB, S3 fake)', () => {
  let t: TestApp;
  let engineer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    // The default memory limit (reading the two-page Corriebank scan peaked at 0.98–1.01 GB on
    // 2026-12-05, three readings a page); generous time, as OCR on a loaded test machine is slow
    // and the memory limit is the one under test.
    t = await createTestApp({ env: { EXTRACTION_MEMORY_LIMIT_MB: '1536', EXTRACTION_TIME_LIMIT_SECONDS: '60', EXTRACTION_OCR_SECONDS_PER_PAGE: '120' } });
    engineer = await t.tokenFor('engineer');
  });
  afterAll(() => t.close());

  it('refuses a PDF whose content stream inflates to gigabytes with a 422, while /api/health keeps answering', async () => {
    // 2.5 GB of zeros behind about 2.4 MB of Flate data: read on the main thread this took
    // minutes and gigabytes while every other request waited.
    const bomb = zeroBombPdf(2.5e9);
    expect(bomb.length).toBeLessThan(4 * 1024 * 1024);
    const before = (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheets'))[0].n;

    let uploading = true;
    const upload = Promise.resolve(t.http.post('/api/datasheets').set(auth(engineer)).attach('file', bomb, 'bomb.pdf')).finally(() => {
      uploading = false;
    });
    const health: number[] = [];
    const poll = (async () => {
      while (uploading) {
        const res = await t.http.get('/api/health');
        if (uploading) health.push(res.status);
        await new Promise((r) => setTimeout(r, 100));
      }
    })();
    const res = await upload;
    await poll;

    expect(res.status).toBe(422);
    expect(res.body.message).toMatch(/allowed for reading one file/);
    expect(res.body.message).toMatch(/Nothing was saved/);
    // Health was asked repeatedly while the file was being read, and answered every time.
    expect(health.length).toBeGreaterThanOrEqual(3);
    expect(health.every((s) => s === 200)).toBe(true);
    expect((await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheets'))[0].n).toBe(before);
    expect(t.stack.app.get(DatasheetReader).pool.kills).toBe(1);

    // The reader was restarted: an ordinary datasheet is read as before.
    const sheet = fixtures.listDatasheetFixtures().find((f) => f.name.startsWith('ostrander'))!;
    const ok = await t.http.post('/api/datasheets').set(auth(engineer)).attach('file', sheet.pdfPath, 'odw.pdf');
    expect(ok.status).toBe(201);
    const extraction = await t.http.get(`/api/datasheets/${ok.body.id}/extraction`).set(auth(engineer));
    expect(extraction.body.variants.length).toBeGreaterThan(0);
  }, 180_000);

  it('reads an uploaded scan by OCR: its values carry ocr, page and box, and match the printed ones', async () => {
    const scan = fixtures.listScannedFixtures().find((f) => f.name.startsWith('corriebank'))!;
    const res = await t.http.post('/api/datasheets').set(auth(engineer)).attach('file', scan.pdfPath, 'scan.pdf');
    expect({ status: res.status, message: res.body.message }).toEqual({ status: 201, message: undefined });
    const extraction = await t.http.get(`/api/datasheets/${res.body.id}/extraction`).set(auth(engineer));
    expect(extraction.body.hasText).toBe(false);
    const values = (extraction.body as ExtractionResult).variants.flatMap((v) => Object.entries(v.fields).map(([field, x]) => ({ mpn: v.mpn, field, ...x })));
    expect(values.length).toBeGreaterThan(50);
    for (const v of values) expect(v).toMatchObject({ ocr: true, page: expect.any(Number), box: expect.any(Object) });
    // Against the answer key the generator wrote for the original (the values it printed).
    const key = new Map(scan.original.answers.variants.flatMap((v) => Object.entries(v.fields).map(([f, a]) => [`${v.mpn} ${f}`, a!.si] as const)));
    const right = values.filter((v) => key.has(`${v.mpn} ${v.field}`) && Math.abs(key.get(`${v.mpn} ${v.field}`)! - v.si) <= 1e-9 + 1e-6 * Math.abs(v.si));
    expect(right.length / values.length).toBeGreaterThanOrEqual(0.98);
  }, 600_000);
});
