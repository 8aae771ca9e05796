import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { Transaction } from 'sequelize';
import { CatalogueEvents, type CatalogueChange } from '../src/catalogue-events/catalogue-events.service';
import { EXTRACTOR_VERSION } from '../src/extraction';
import { StorageService } from '../src/storage/storage.service';
import { cardDraftFromExtraction, staleConflictBodySchema, type ExtractionResult } from '@shuntwise/contracts';
import { createVendorPart, demoCardFields } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

// Invented datasheets and bad files from @shuntwise/test-fixtures (see its README).
const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');
const sheets = fixtures.listDatasheetFixtures();
const sheet = (name: string) => sheets.find((s) => s.name.startsWith(name))!;

const LIMIT = 100_000;

describe('datasheets: uploads to the object store (real MariaDB, S3 fake)', () => {
  let t: TestApp;
  let engineer: string;
  let buyer: string;
  let designer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const objects = async () => {
    const storage = t.stack.app.get(StorageService);
    const out = await storage.client.send(new ListObjectsV2Command({ Bucket: storage.bucket }));
    return (out.Contents ?? []).map((o) => o.Key!).sort();
  };
  const rows = async () => (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheets'))[0].n;
  const extractionRows = async () => (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheet_extractions'))[0].n;
  const upload = (file: Buffer | string, name = 'datasheet.pdf', token = engineer) =>
    t.http
      .post('/api/datasheets')
      .set(auth(token))
      .attach('file', typeof file === 'string' ? readFileSync(file) : file, name);

  beforeAll(async () => {
    t = await createTestApp({ env: { UPLOAD_MAX_BYTES: String(LIMIT) } });
    [engineer, buyer, designer] = await Promise.all([t.tokenFor('engineer'), t.tokenFor('buyer'), t.tokenFor('designer')]);
  });
  afterAll(() => t.close());

  it('stores a PDF under a key of its own, answers its id, sha256, pages and size, and streams it back byte-identical', async () => {
    const fixture = sheet('brackenford');
    const bytes = readFileSync(fixture.pdfPath);
    const res = await upload(bytes, 'BRZ05 Datenblatt µ.pdf');
    expect(res.status).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(Number),
      sha256: createHash('sha256').update(bytes).digest('hex'),
      pages: fixture.answers.pages,
      sizeBytes: bytes.byteLength,
      fileName: 'BRZ05 Datenblatt µ.pdf',
      createdAt: expect.any(String),
      existing: false,
    });
    const [row] = await t.select<{ storage_key: string }>('SELECT storage_key FROM datasheets WHERE id = ?', [res.body.id]);
    expect(row.storage_key).toMatch(/^datasheets\/[0-9a-f-]{36}\.pdf$/);
    expect(await objects()).toEqual([row.storage_key]);

    const file = await t.http
      .get(`/api/datasheets/${res.body.id}/file`)
      .set(auth(buyer))
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toBe(`inline; filename="BRZ05 Datenblatt _.pdf"; filename*=UTF-8''BRZ05%20Datenblatt%20%C2%B5.pdf`);
    expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);

    const meta = await t.http.get(`/api/datasheets/${res.body.id}`).set(auth(designer));
    expect(meta.body).toMatchObject({ id: res.body.id, revision: null, uploadedBy: { name: 'Priya Raman' }, vendorPartIds: [] });
    const extraction = await t.http.get(`/api/datasheets/${res.body.id}/extraction`).set(auth(engineer));
    expect(extraction.status).toBe(200);
    expect(extraction.body).toMatchObject({ pages: fixture.answers.pages, hasText: true, variants: expect.any(Array), warnings: expect.any(Array) });
    expect((await t.http.get(`/api/datasheets/${res.body.id}/extraction`).set(auth(buyer))).status).toBe(403);
  });

  it('reads a file uploaded again afresh when its stored reading was made by another extractor version, and keeps the reading otherwise', async () => {
    // A copy of a fixture with a comment after its end: a file of its own for this test alone.
    const fixture = sheet('aldmoor');
    const bytes = Buffer.concat([readFileSync(fixture.pdfPath), Buffer.from('\n% read again\n')]);
    const first = await upload(bytes, 'am.pdf');
    expect(first.status).toBe(201);
    const id = first.body.id as number;
    const stored = async () =>
      (
        await t.select<{ reader_version: string | null; variant_count: number }>(
          'SELECT reader_version, variant_count FROM datasheet_extractions WHERE datasheet_id = ?',
          [id],
        )
      )[0];
    const fresh = await stored();
    expect(fresh).toEqual({ reader_version: EXTRACTOR_VERSION, variant_count: fixture.answers.variants.length });
    // An older reader's result: one part with a wrong VZ (as an older version could return).
    const old = { ...(await t.http.get(`/api/datasheets/${id}/extraction`).set(auth(engineer))).body };
    old.variants = [{ ...old.variants[0], fields: { ...old.variants[0].fields, vzNom: { ...old.variants[0].fields.vzNom, value: '99', si: 99 } } }];
    await t.exec('UPDATE datasheet_extractions SET result = ?, variant_count = 1, reader_version = ? WHERE datasheet_id = ?', [
      JSON.stringify(old),
      '2026-01-01.1',
      id,
    ]);
    const same = await upload(bytes, 'am again.pdf');
    expect(same.body).toMatchObject({ id, existing: true });
    expect(await stored()).toEqual(fresh);
    const reading = (await t.http.get(`/api/datasheets/${id}/extraction`).set(auth(engineer))).body as ExtractionResult;
    expect(reading.variants.length).toBe(fixture.answers.variants.length);
    expect(reading.variants.some((v) => v.fields.vzNom?.si === 99)).toBe(false);
    // The current version's reading is kept as it is (not read a third time).
    await t.exec('UPDATE datasheet_extractions SET variant_count = 0 WHERE datasheet_id = ?', [id]);
    await upload(bytes, 'am third.pdf');
    expect((await stored()).variant_count).toBe(0);
  });

  it('says when a stored reading is outdated, and an engineer has the stored file read again (others may not)', async () => {
    const fixture = sheet('aldmoor');
    const bytes = Buffer.concat([readFileSync(fixture.pdfPath), Buffer.from('\n% outdated reading\n')]);
    const id = (await upload(bytes, 'am outdated.pdf')).body.id as number;
    const current = (await t.http.get(`/api/datasheets/${id}/extraction`).set(auth(engineer))).body as ExtractionResult;
    expect(current.outdated).toBe(false);
    // An older reader's result with a wrong VZ, under an earlier version (and under none: rows from before versions were kept).
    for (const version of ['2026-01-01.1', null]) {
      const old = {
        ...current,
        variants: [{ ...current.variants[0], fields: { ...current.variants[0].fields, vzNom: { ...current.variants[0].fields.vzNom!, si: 99 } } }],
      };
      await t.exec('UPDATE datasheet_extractions SET result = ?, variant_count = 1, reader_version = ? WHERE datasheet_id = ?', [
        JSON.stringify(old),
        version,
        id,
      ]);
      const seen = (await t.http.get(`/api/datasheets/${id}/extraction`).set(auth(designer))).body as ExtractionResult;
      expect(seen).toMatchObject({ outdated: true, variants: [{ fields: { vzNom: { si: 99 } } }] });
      // Only an engineer reads a file again; the stored reading is untouched by the refusal.
      expect((await t.http.post(`/api/datasheets/${id}/extraction`).set(auth(designer))).status).toBe(403);
      expect((await t.http.post(`/api/datasheets/${id}/extraction`).set(auth(buyer))).status).toBe(403);
      const again = await t.http.post(`/api/datasheets/${id}/extraction`).set(auth(engineer));
      expect(again.status).toBe(200);
      const reading = again.body as ExtractionResult;
      expect(reading.outdated).toBe(false);
      expect(reading.variants.map((v) => v.mpn).sort()).toEqual(fixture.answers.variants.map((v) => v.mpn).sort());
      expect(reading.variants.some((v) => v.fields.vzNom?.si === 99)).toBe(false);
      expect(
        (
          await t.select<{ reader_version: string; variant_count: number }>(
            'SELECT reader_version, variant_count FROM datasheet_extractions WHERE datasheet_id = ?',
            [id],
          )
        )[0],
      ).toEqual({
        reader_version: EXTRACTOR_VERSION,
        variant_count: fixture.answers.variants.length,
      });
    }
    // A current reading is answered as stored (not read again).
    await t.exec('UPDATE datasheet_extractions SET warning_count = 77 WHERE datasheet_id = ?', [id]);
    expect((await t.http.post(`/api/datasheets/${id}/extraction`).set(auth(engineer))).status).toBe(200);
    expect((await t.select<{ n: number }>('SELECT warning_count AS n FROM datasheet_extractions WHERE datasheet_id = ?', [id]))[0].n).toBe(77);
    const missing = await t.http.post('/api/datasheets/999999/extraction').set(auth(engineer));
    expect(missing.status).toBe(404);
    expect(missing.body.message).toMatch(/No datasheet with id 999999/);
  });

  it('keeps an outdated reading when the stored object cannot be read, and says so', async () => {
    const fixture = sheet('aldmoor');
    const bytes = Buffer.concat([readFileSync(fixture.pdfPath), Buffer.from('\n% object gone\n')]);
    const id = (await upload(bytes, 'am gone.pdf')).body.id as number;
    await t.exec("UPDATE datasheet_extractions SET reader_version = '2026-01-01.1' WHERE datasheet_id = ?", [id]);
    const [{ storage_key: key }] = await t.select<{ storage_key: string }>('SELECT storage_key FROM datasheets WHERE id = ?', [id]);
    await t.stack.app.get(StorageService).delete(key);
    const again = await t.http.post(`/api/datasheets/${id}/extraction`).set(auth(engineer));
    expect(again.status).toBe(503);
    expect(again.body.message).toMatch(/object store did not return the file; the stored reading stays/);
    expect((await t.http.get(`/api/datasheets/${id}/extraction`).set(auth(engineer))).body).toMatchObject({ outdated: true });
  });

  it('returns the stored datasheet for the same file again, adding nothing', async () => {
    const fixture = sheet('lumenvale');
    const first = await upload(fixture.pdfPath, 'lvd1.pdf');
    const before = { rows: await rows(), objects: await objects() };
    const again = await upload(fixture.pdfPath, 'renamed copy.pdf');
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ id: first.body.id, sha256: first.body.sha256, fileName: 'lvd1.pdf', existing: true });
    expect({ rows: await rows(), objects: await objects() }).toEqual(before);

    // twice at the same moment: one row, one object, the same answer
    const fresh = readFileSync(sheet('corriebank').pdfPath);
    const [a, b] = await Promise.all([upload(fresh, 'a.pdf'), upload(fresh, 'b.pdf')]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.id).toBe(b.body.id);
    expect(await rows()).toBe(before.rows + 1);
    expect((await objects()).length).toBe(before.objects.length + 1);
  });

  describe('every bad upload gets its own 4xx with a plain message and leaves no object and no row', () => {
    const cases: Array<[string, () => ReturnType<typeof upload>, number, RegExp]> = [
      [
        'no file at all',
        () => t.http.post('/api/datasheets').set(auth(engineer)).field('revision', 'A'),
        400,
        /No file: send the PDF in the multipart field "file"/,
      ],
      [
        'a file in another field',
        () =>
          t.http
            .post('/api/datasheets')
            .set(auth(engineer))
            .attach('pdf', readFileSync(sheet('aldmoor').pdfPath), 'x.pdf'),
        400,
        /field "file"/,
      ],
      [
        'two files',
        () =>
          t.http
            .post('/api/datasheets')
            .set(auth(engineer))
            .attach('file', readFileSync(sheet('aldmoor').pdfPath), 'x.pdf')
            .attach('file', readFileSync(sheet('ostrander').pdfPath), 'y.pdf'),
        400,
        /one file per upload/,
      ],
      ['an empty file', () => upload(fixtures.badUploads.empty, 'empty.pdf'), 400, /empty/],
      [
        'a file over the limit',
        () => upload(Buffer.concat([readFileSync(sheet('tevorrow').pdfPath), Buffer.alloc(LIMIT)]), 'big.pdf'),
        413,
        /larger than the upload limit of 98 kB/,
      ],
      ['a PNG renamed .pdf', () => upload(fixtures.badUploads.notPdf, 'photo.pdf'), 415, /not a PDF.*PNG image/],
      ['a truncated PDF', () => upload(fixtures.badUploads.truncated, 'cut.pdf'), 422, /truncated/],
      ['a corrupt PDF', () => upload(fixtures.badUploads.corrupt, 'broken.pdf'), 422, /damaged/],
      ['an encrypted PDF', () => upload(fixtures.badUploads.encrypted, 'locked.pdf'), 422, /password/],
      ['a buyer uploading', () => upload(sheet('nettlecombe').pdfPath, 'n.pdf', buyer), 403, /role/],
      ['a designer uploading', () => upload(sheet('nettlecombe').pdfPath, 'n.pdf', designer), 403, /role/],
      [
        'an unknown vendor part',
        () =>
          t.http
            .post('/api/datasheets')
            .set(auth(engineer))
            .field('vendorPartId', '987654')
            .attach('file', readFileSync(sheet('nettlecombe').pdfPath), 'n.pdf'),
        400,
        /No vendor part with id 987654/,
      ],
      [
        'a bad revision label',
        () =>
          t.http
            .post('/api/datasheets')
            .set(auth(engineer))
            .field('revision', 'x'.repeat(41))
            .attach('file', readFileSync(sheet('nettlecombe').pdfPath), 'n.pdf'),
        400,
        /revision/,
      ],
    ];
    it.each(cases)('%s', async (_what, send, status, message) => {
      const before = { rows: await rows(), extractions: await extractionRows(), objects: await objects() };
      const res = await send();
      expect(res.status).toBe(status);
      expect(res.body.message).toMatch(message);
      expect(res.body.correlationId).toEqual(expect.any(String));
      expect({ rows: await rows(), extractions: await extractionRows(), objects: await objects() }).toEqual(before);
    });
  });

  it('keeps a scan as a document, reads its pages by OCR and names each page that gave no ratings', async () => {
    // The fixture's "text" is bars of ink, not letters: OCR has nothing to read on either page.
    const res = await upload(fixtures.badUploads.scanned, 'scan.pdf');
    expect(res.status).toBe(201);
    expect(res.body.pages).toBe(2);
    const extraction = await t.http.get(`/api/datasheets/${res.body.id}/extraction`).set(auth(engineer));
    expect(extraction.body).toMatchObject({ hasText: false, variants: [] });
    expect(extraction.body.warnings).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^page 1: no text layer and OCR found no ratings/),
        expect.stringMatching(/^page 2: no text layer and OCR found no ratings/),
      ]),
    );
  }, 180_000);

  it('leaves no row when the object store refuses the file', async () => {
    const storage = t.stack.app.get(StorageService);
    const put = jest.spyOn(storage, 'put').mockRejectedValueOnce(new Error('connection reset by the store'));
    const before = { rows: await rows(), extractions: await extractionRows(), objects: await objects() };
    const res = await upload(sheet('ostrander').pdfPath, 'odw.pdf');
    put.mockRestore();
    expect(res.status).toBe(503);
    expect(res.body.message).toMatch(/nothing was saved/);
    expect({ rows: await rows(), extractions: await extractionRows(), objects: await objects() }).toEqual(before);
  });

  it('deletes the object again when the commit fails after the put', async () => {
    // Only the upload's own commit fails: background work (the outbox, the waiver lapse pass) commits too.
    const original = Transaction.prototype.commit;
    let failed = false;
    const commit = jest.spyOn(Transaction.prototype, 'commit').mockImplementation(async function (this: Transaction) {
      if (!failed && /DatasheetsService\.upload/.test(new Error().stack ?? '')) {
        failed = true;
        await this.rollback();
        throw new Error('the database went away during commit');
      }
      return original.call(this);
    });
    const before = { rows: await rows(), objects: await objects() };
    const res = await upload(sheet('ostrander').pdfPath, 'odw.pdf');
    commit.mockRestore();
    expect(failed).toBe(true);
    expect(res.status).toBe(500);
    expect({ rows: await rows(), objects: await objects() }).toEqual(before);
  });

  it('links a datasheet to a vendor part; a second datasheet for the part is a revision subscribers hear of', async () => {
    const vendorPartId = await createVendorPart(t.http, engineer, { manufacturer: 'Quarryhill Parts', mpn: 'QHZ-REV-1' });
    const seen: CatalogueChange[] = [];
    const off = t.stack.app.get(CatalogueEvents).subscribe((c) => void seen.push(c));
    const first = await t.http
      .post('/api/datasheets')
      .set(auth(engineer))
      .field('vendorPartId', String(vendorPartId))
      .field('revision', 'A')
      .attach('file', readFileSync(sheet('quarryhill').pdfPath), 'qhz-a.pdf');
    expect(first.status).toBe(201);
    // an existing datasheet can be linked by uploading it again with the vendor part
    const second = await t.http
      .post('/api/datasheets')
      .set(auth(engineer))
      .field('vendorPartId', String(vendorPartId))
      .attach('file', readFileSync(sheet('lumenvale').pdfPath), 'other.pdf');
    expect(second.body.existing).toBe(true);
    off();
    expect(seen).toEqual([
      {
        kind: 'datasheet-revised',
        vendorPartId,
        datasheetId: second.body.id,
        revision: null,
        previousDatasheetIds: [first.body.id],
        userId: expect.any(Number),
      },
    ]);
    const part = await t.http.get(`/api/vendor-parts/${vendorPartId}`).set(auth(buyer));
    expect(part.body.datasheets.map((d: { id: number; revision: string | null }) => [d.id, d.revision])).toEqual(
      expect.arrayContaining([
        [first.body.id, 'A'],
        [second.body.id, null],
      ]),
    );
    expect((await t.http.get(`/api/datasheets/${first.body.id}`).set(auth(buyer))).body.vendorPartIds).toEqual([vendorPartId]);
  });

  describe('a series datasheet becomes several vendor parts with cards at once, after review', () => {
    let datasheetId: number;
    let extraction: ExtractionResult;
    const reviewed = () =>
      extraction.variants.map((v) => ({
        mpn: v.mpn,
        package: v.package?.value ?? null,
        fields: { pdRefC: { value: 25, printed: '25 °C', provenance: { source: 'entered' } }, ...cardDraftFromExtraction(v, datasheetId) },
      }));
    beforeAll(async () => {
      datasheetId = (await upload(sheet('quarryhill').pdfPath, 'qhz.pdf')).body.id;
      extraction = (await t.http.get(`/api/datasheets/${datasheetId}/extraction`).set(auth(engineer))).body;
    });

    it('creates every reviewed variant with its card, each value traceable to its page', async () => {
      const answers = sheet('quarryhill').answers;
      expect(extraction.variants.length).toBe(answers.variants.length);
      const variants = reviewed();
      // the engineer corrects one value before saving: it becomes "entered"
      variants[0].fields.zzt = { value: 33, printed: '33 Ω', provenance: { source: 'entered' } } as never;
      const res = await t.http.post(`/api/datasheets/${datasheetId}/variants`).set(auth(engineer)).send({ manufacturer: 'Quarryhill Parts', variants });
      expect(res.status).toBe(201);
      expect(res.body.vendorParts).toHaveLength(answers.variants.length);
      expect(res.body.vendorParts.every((p: { created: boolean; cardVersion: number }) => p.cardVersion === 1)).toBe(true);

      const first = res.body.vendorParts[0].vendorPartId;
      const card = (await t.http.get(`/api/vendor-parts/${first}/rating-card`).set(auth(engineer))).body;
      const key = answers.variants.find((v) => v.mpn === res.body.vendorParts[0].mpn)!;
      // the answer key of the invented datasheet says where each value is printed
      expect(card.fields.vzNom).toMatchObject({
        value: key.fields.vzNom!.si,
        provenance: { source: 'extracted', datasheetId, page: key.fields.vzNom!.page, text: expect.any(String) },
      });
      expect(card.fields.zzt).toMatchObject({ value: 33, provenance: { source: 'entered', datasheetId: null } });
      const part = (await t.http.get(`/api/vendor-parts/${first}`).set(auth(buyer))).body;
      expect(part).toMatchObject({ manufacturer: 'Quarryhill Parts', package: key.package.value, datasheets: [{ id: datasheetId }] });
    });

    it('writes none when one variant is bad, naming the variant and field', async () => {
      const before = await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM vendor_parts');
      const variants = reviewed().map((v) => ({ ...v, mpn: `${v.mpn}-B` }));
      variants[2].fields.vzMin = { value: 99, provenance: { source: 'entered' } } as never;
      const res = await t.http.post(`/api/datasheets/${datasheetId}/variants`).set(auth(engineer)).send({ manufacturer: 'Quarryhill Parts', variants });
      expect(res.status).toBe(400);
      expect(res.body.errors.map((e: { path: string }) => e.path)).toContain('variants.2.fields.vzMin.value');
      expect(await t.select('SELECT COUNT(*) AS n FROM vendor_parts')).toEqual(before);

      const twice = await t.http
        .post(`/api/datasheets/${datasheetId}/variants`)
        .set(auth(engineer))
        .send({ manufacturer: 'Quarryhill Parts', variants: [reviewed()[0], reviewed()[0]] });
      expect(twice.status).toBe(400);
      expect(twice.body.errors[0].path).toBe('variants.1.mpn');
    });

    it('refuses a variant whose part already has a card (409), writing nothing', async () => {
      const fresh = await createVendorPart(t.http, engineer, { manufacturer: 'Quarryhill Parts', mpn: 'QHZ-NEW-1' });
      const variants = [{ mpn: 'QHZ-NEW-1', fields: demoCardFields() }, ...reviewed()];
      const res = await t.http.post(`/api/datasheets/${datasheetId}/variants`).set(auth(engineer)).send({ manufacturer: 'Quarryhill Parts', variants });
      expect(res.status).toBe(409);
      expect(res.body.errors).toEqual([{ path: 'variants.1.mpn', message: 'already has card version 1' }]);
      // the one stale-conflict body of the API (contracts: staleConflictBodySchema)
      expect(staleConflictBodySchema.parse(res.body)).toMatchObject({ code: 'stale', current: { version: 1 }, correlationId: expect.any(String) });
      // the first variant's card was rolled back with the rest
      expect((await t.http.get(`/api/vendor-parts/${fresh}/rating-card`).set(auth(engineer))).body.version).toBe(0);
      expect((await t.http.post(`/api/datasheets/${datasheetId}/variants`).set(auth(buyer)).send({ manufacturer: 'Q', variants })).status).toBe(403);
      expect(
        (
          await t.http
            .post('/api/datasheets/987654/variants')
            .set(auth(engineer))
            .send({ manufacturer: 'Q', variants: [variants[0]] })
        ).status,
      ).toBe(404);
    });
  });

  it('answers 404 for an unknown datasheet and 503 while the object store is down (last: it stops the store)', async () => {
    expect((await t.http.get('/api/datasheets/987654/file').set(auth(buyer))).status).toBe(404);
    expect((await t.http.get('/api/datasheets/987654').set(auth(buyer))).status).toBe(404);
    const id = (await upload(sheet('aldmoor').pdfPath, 'am.pdf')).body.id;
    await t.stack.s3.stop();
    const before = await rows();
    const res = await upload(sheet('nettlecombe').pdfPath, 'n.pdf');
    expect(res.status).toBe(503);
    expect(await rows()).toBe(before);
    expect((await t.http.get(`/api/datasheets/${id}/file`).set(auth(buyer))).status).toBe(503);
  });
});
