import { parse } from 'csv-parse/sync';
import { demoCardFields } from './helpers/catalogue-fixtures';
import { createHousePart, createVendorPart } from './helpers/catalogue-fixtures';
import { staleConflictBodySchema } from '@shuntwise/contracts';
import { CatalogueCsvService } from '../src/catalogue-csv/catalogue-csv.service';
import { createTestApp, type TestApp } from './helpers/test-app';

/** An invented vendor series as a vendor might send it: units in the header, and µ/Ω spelled both ways. */
const SERIES = [
  'mpn,package,vzMin (V),vzNom (V),vzMax (V),izt (mA),zzt (Ω),izk (mA),zzk (ohm),irMax (µA),vr (V),tc (mV/°C),pdMax (mW),tjMax (°C),rthJA (K/W),izm (mA)',
  'ODW-4V7,SOD-123,4.44,4.7,4.94,5,80,0.25,500,3,2,-1.4,500,150,250,98',
  'ODW-5V1,SOD-123,4.84,5.1,5.36,5,60,0.25,480,2,2,0.3,500,150,250,90',
  'ODW-6V2,SOD-323,5.89,6.2,6.51,5,10,0.25,200,1,4,2.3,500,150,250,74',
].join('\n');

describe('CSV import and export (real MariaDB)', () => {
  let t: TestApp;
  let engineer: string;
  let buyer: string;
  let designer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const preview = (body: object, token = engineer) => t.http.post('/api/imports/vendor-series/preview').set(auth(token)).send(body);
  const confirm = (body: object, token = engineer) => t.http.post('/api/imports/vendor-series').set(auth(token)).send(body);
  const partCount = async () => (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM vendor_parts'))[0].n;

  beforeAll(async () => {
    t = await createTestApp();
    [engineer, buyer, designer] = await Promise.all([t.tokenFor('engineer'), t.tokenFor('buyer'), t.tokenFor('designer')]);
  });
  afterAll(() => t.close());

  it('previews a series without writing, then writes every row on confirm', async () => {
    const before = await partCount();
    const res = await preview({ csv: SERIES, manufacturer: 'Ostrander Components' });
    expect(res.status).toBe(200);
    expect(res.body.errors).toEqual([]);
    expect(res.body.summary).toEqual({ rows: 3, withErrors: 0, create: 3, addCard: 0, unchanged: 0, conflict: 0 });
    expect(res.body.columns.find((c: { header: string }) => c.header === 'izt (mA)')).toEqual({ header: 'izt (mA)', field: 'izt', unit: 'mA' });
    const first = res.body.rows[0];
    expect(first).toMatchObject({ row: 2, manufacturer: 'Ostrander Components', mpn: 'ODW-4V7', action: 'create', vendorPartId: null });
    // units from the header: 5 mA → 0.005 A, 3 µA → 3e-6 A, -1.4 mV/°C kept as −1.4 mV/K
    expect(first.values.izt).toEqual({ value: 0.005, printed: '5 mA' });
    expect(first.values.irMax.value).toBeCloseTo(3e-6, 15);
    expect(first.values.tc).toEqual({ value: -1.4, printed: '-1.4 mV/°C', unit: 'mV/K' });
    expect(await partCount()).toBe(before);

    const done = await confirm({ csv: SERIES, manufacturer: 'Ostrander Components' });
    expect(done.status).toBe(201);
    expect(done.body).toMatchObject({ created: 3, cardsAdded: 0, unchanged: 0, conflicts: [] });
    expect(await partCount()).toBe(before + 3);
    const card = await t.http.get(`/api/vendor-parts/${done.body.vendorPartIds[1]}/rating-card`).set(auth(engineer));
    expect(card.body.fields.zzk).toMatchObject({ value: 480, printed: '480 ohm', provenance: { source: 'imported', confirmedBy: { name: 'Priya Raman' } } });
    expect(card.body.fields.pdMax.value).toBeCloseTo(0.5, 12);

    // the same file again changes nothing
    const again = await preview({ csv: SERIES, manufacturer: 'Ostrander Components' });
    expect(again.body.summary).toMatchObject({ unchanged: 3, create: 0 });
  });

  it('reports every problem with its row and column, and writes nothing on confirm', async () => {
    const csv = [
      'manufacturer;mpn;vzNom;izt;zzt;tc;pdMax',
      'Lumenvale Devices;LVX-1;5.1 V;5 mA;40 ohm;0.03 %/K;500 mW', // good
      'Lumenvale Devices;LVX-2;5.1;5 mA;40 ohm;;', // vzNom without a unit
      'Lumenvale Devices;LVX-3;5.1 V;5 furlongs;40 ohm;;', // a unit that is no current
      'Lumenvale Devices;LVX-4;5.1 V;;;;', // no izt
      'Lumenvale Devices;LVX-5;5.1 V;5 mA;2 kΩ;;', // zzt × izt above vzNom
      'Lumenvale Devices;LVX-1;5.1 V;5 mA;40 ohm;;', // twice in the file
      ';LVX-7;5.1 V;5 mA;;;', // no manufacturer
    ].join('\r\n');
    const before = await partCount();
    const res = await preview({ csv });
    expect(res.status).toBe(200);
    const errors = res.body.errors as Array<{ row: number; column: string; message: string }>;
    expect(errors.map((e) => `${e.row} ${e.column}`)).toEqual(['3 vzNom', '4 izt', '5 izt', '6 zzt', '7 mpn', '8 manufacturer']);
    expect(errors[0].message).toMatch(/cannot read "5.1" as a voltage.*no unit/);
    expect(errors[1].message).toMatch(/cannot read "5 furlongs" as a current/);
    expect(errors[2].message).toMatch(/no izt/);
    expect(errors[3].message).toMatch(/zzt/i);
    expect(errors[4].message).toMatch(/already on row 2/);
    expect(res.body.rows[0]).toMatchObject({ row: 2, action: 'create', errors: [] });
    expect(res.body.rows[0].values.tc).toEqual({ value: 0.03, printed: '0.03 %/K', unit: '%/K' });
    expect(res.body.summary).toMatchObject({ rows: 7, withErrors: 6, create: 1 });

    const refused = await confirm({ csv });
    expect(refused.status).toBe(400);
    expect(refused.body.message).toMatch(/Nothing imported: 6 problems/);
    expect(refused.body.errors[0]).toEqual({ path: 'row 3, vzNom', message: expect.any(String) });
    expect(await partCount()).toBe(before);
  });

  it('refuses a file it cannot read at all, naming why', async () => {
    expect((await preview({ csv: 'vzNom,izt\n5.1 V,5 mA' })).body.message).toMatch(/needs an mpn column/);
    expect((await preview({ csv: 'mpn,vzNom\nX,5.1 V' })).body.message).toMatch(/Name the manufacturer/);
    expect((await preview({ csv: 'mpn,izt (V)\nX,5', manufacturer: 'M' })).body.message).toMatch(/unit "V" does not fit izt/);
    expect((await preview({ csv: 'mpn,vzNom,Vz nom\nX,5.1 V,5.1 V', manufacturer: 'M' })).body.message).toMatch(/both give vzNom/);
    expect((await preview({ csv: 'mpn,vzNom\n"X,5.1 V', manufacturer: 'M' })).body.message).toMatch(/cannot be read near line/);
    expect((await preview({ csv: '' })).body.errors[0].path).toBe('csv');
    expect((await preview({ csv: SERIES, manufacturer: 'M', datasheetId: 4242 })).body.message).toMatch(/No datasheet with id 4242/);
  });

  it('never overwrites a different card: the row is a conflict, left alone and reported', async () => {
    const id = await createVendorPart(t.http, engineer, { manufacturer: 'Aldmoor Semiconductor', mpn: 'AMZR-5V1' });
    await t.http.put(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer)).send({ version: 0, fields: demoCardFields() });
    const bare = await createVendorPart(t.http, engineer, { manufacturer: 'Aldmoor Semiconductor', mpn: 'AMZR-5V6' });
    const csv = 'mpn,vzNom (V),izt (mA),zzt (ohm)\nAMZR-5V1,5.1,5,25\nAMZR-5V6,5.6,5,20\n';
    const res = await preview({ csv, manufacturer: 'Aldmoor Semiconductor' });
    expect(res.body.rows.map((r: { action: string; vendorPartId: number }) => [r.action, r.vendorPartId])).toEqual([
      ['conflict', id],
      ['add-card', bare],
    ]);
    const done = await confirm({ csv, manufacturer: 'Aldmoor Semiconductor' });
    expect(done.body).toMatchObject({ created: 0, cardsAdded: 1, conflicts: [{ row: 2, mpn: 'AMZR-5V1', vendorPartId: id }] });
    expect((await t.http.get(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer))).body).toMatchObject({ version: 1, fields: { zzt: { value: 40 } } });
    expect((await t.http.get(`/api/vendor-parts/${bare}/rating-card`).set(auth(engineer))).body).toMatchObject({ version: 1, fields: { zzt: { value: 20 } } });
  });

  it('answers a card added between its reading and its writing with the one stale-conflict body, importing nothing', async () => {
    const bare = await createVendorPart(t.http, engineer, { manufacturer: 'Aldmoor Semiconductor', mpn: 'AMZR-6V2' });
    const csv = 'mpn,vzNom (V),izt (mA),zzt (ohm)\nAMZR-NEW-9,9.1,5,10\nAMZR-6V2,6.2,5,10\n';
    // Someone saves a card on the part after the import planned it as "add card" and before it writes:
    // the plan is taken as the service made it, then the card is saved, then the write runs.
    const service = t.stack.app.get(CatalogueCsvService) as unknown as { plan: (request: object) => Promise<unknown> };
    const plan = service.plan.bind(service);
    const spy = jest.spyOn(service, 'plan').mockImplementationOnce(async (request: object) => {
      const planned = await plan(request);
      expect((await t.http.put(`/api/vendor-parts/${bare}/rating-card`).set(auth(engineer)).send({ version: 0, fields: demoCardFields() })).status).toBe(200);
      return planned;
    });
    const before = await partCount();
    const res = await confirm({ csv, manufacturer: 'Aldmoor Semiconductor' });
    spy.mockRestore();
    expect(res.status).toBe(409);
    // contracts: staleConflictBodySchema, the same body a stale card save and stale datasheet variants answer
    expect(staleConflictBodySchema.parse(res.body)).toMatchObject({
      code: 'stale',
      current: { version: 1, vendorPartId: bare },
      errors: [{ path: 'row 3', message: 'card is now at version 1' }],
      correlationId: expect.any(String),
    });
    expect(res.body.message).toMatch(/preview again/);
    expect(await partCount()).toBe(before); // the new part of row 2, written first, was rolled back with the rest
  });

  it('only engineers and admins import', async () => {
    expect((await preview({ csv: SERIES, manufacturer: 'X' }, buyer)).status).toBe(403);
    expect((await confirm({ csv: SERIES, manufacturer: 'X' }, designer)).status).toBe(403);
  });

  it('exports cards as text/csv that the import reads back unchanged', async () => {
    const res = await t.http.get('/api/exports/rating-cards?manufacturer=Ostrander%20Components').set(auth(designer));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="shuntwise-rating-cards-\d{4}-\d{2}-\d{2}\.csv"$/);
    expect(res.text.charCodeAt(0)).toBe(0xfeff);
    const records = parse(res.text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(records.map((r) => r['Manufacturer part number'])).toEqual(['ODW-4V7', 'ODW-5V1', 'ODW-6V2']);
    // headers in words with their units; SI values
    expect(records[0]).toMatchObject({
      Manufacturer: 'Ostrander Components',
      'Zener voltage nominal (V)': '4.7',
      'Test current (A)': '0.005',
      'Dynamic impedance at knee current (ohm)': '500',
      'Temperature coefficient': '-1.4 mV/K',
      'Temperature coefficient converted (V/K)': '-0.0014',
      'Card version': '1',
    });
    expect(Object.keys(records[0])).not.toContain('vzNom (V)');

    const back = await preview({ csv: res.text });
    expect(back.body.warnings).toEqual([]);
    expect(back.body.summary).toEqual({ rows: 3, withErrors: 0, create: 0, addCard: 0, unchanged: 3, conflict: 0 });
    expect((await t.http.get('/api/exports/rating-cards').set(auth(buyer))).status).toBe(403);
  });

  it('exports values to the figures their datasheet text states, without binary noise, and reads them back unchanged', async () => {
    // 0.07 mA × 10⁻³ is 0.00007000000000000001 in IEEE 754 doubles (common practice, no source);
    // 0.05 %/K of 5.1 V is 2.55 mV/K by definition of the relative coefficient.
    const csv = 'mpn,vzNom (V),izt (mA),izk (mA),irMax (µA),tc\nODW-NZ1,5.1,5,0.07,0.11,0.05 %/K\n';
    await confirm({ csv, manufacturer: 'Noisefree Devices' });
    const text = (await t.http.get('/api/exports/rating-cards?manufacturer=Noisefree%20Devices').set(auth(designer))).text;
    expect(text).not.toMatch(/\d{10}/);
    const [row] = parse(text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(row).toMatchObject({
      'Knee current (A)': '0.00007',
      'Reverse leakage max (A)': '1.1e-7',
      'Temperature coefficient': '0.05 %/K',
      'Temperature coefficient converted (V/K)': '0.00255',
    });
    const back = await preview({ csv: text });
    expect(back.body.warnings).toEqual([]);
    expect(back.body.summary).toMatchObject({ rows: 1, withErrors: 0, unchanged: 1 });
  });

  it('still imports a card export written with the short headers of earlier versions', async () => {
    const old = [
      'manufacturer,mpn,package,lifecycleNote,cardVersion,vzMin (V),vzNom (V),vzMax (V),izt (A),zzt (ohm),izk (A),zzk (ohm),irMax (A),vr (V),tc,pdMax (W),pdRefC (°C),tjMax (°C),rthJA (K/W),izm (A),tcVoltsPerKelvin (V/K),unconfirmedFields',
      'Ostrander Components,ODW-4V7,SOD-123,,1,4.44,4.7,4.94,0.005,80,0.00025,500,0.000003,2,-1.4 mV/K,0.5,,150,250,0.098,-0.0014,',
    ].join('\n');
    const res = await preview({ csv: old });
    expect(res.body.warnings).toEqual([]);
    expect(res.body.summary).toMatchObject({ rows: 1, withErrors: 0, unchanged: 1 });
  });

  it('exports house parts with their sources for buyers', async () => {
    const hp = await createHousePart(t.http, engineer, 'OHI-ZD-EXP', 'Regulator diode 5.1 V, export test');
    const vp = (await t.http.get('/api/vendor-parts?mpn=ODW-5V1').set(auth(engineer))).body.items[0].id;
    // A link is a candidate: the export says alternate until a decision approves it.
    await t.http.post(`/api/house-parts/${hp}/sources`).set(auth(engineer)).send({ vendorPartId: vp, note: 'reference' });
    await createHousePart(t.http, engineer, 'OHI-ZD-NOSRC');
    const res = await t.http.get('/api/exports/house-parts').set(auth(buyer));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/filename="shuntwise-house-parts-and-sources-\d{4}-\d{2}-\d{2}\.csv"/);
    const records = parse(res.text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(records.find((r) => r['House part'] === 'OHI-ZD-EXP')).toMatchObject({
      'Source role': 'alternate',
      Manufacturer: 'Ostrander Components',
      'Manufacturer part number': 'ODW-5V1',
      'Card version': '1',
      'Source note': 'reference',
    });
    expect(records.find((r) => r['House part'] === 'OHI-ZD-NOSRC')).toMatchObject({ 'Source role': '', 'Manufacturer part number': '' });
  });

  it('neutralises text cells a spreadsheet would run as formulas, and keeps negative numbers numbers', async () => {
    // Formula starts and the apostrophe remedy: OWASP "CSV Injection" guidance (common practice).
    const hp = await createHousePart(t.http, engineer, 'OHI-ZD-CSVX', '=HYPERLINK("http://x.invalid","open")');
    const vp = (await t.http.get('/api/vendor-parts?mpn=ODW-4V7').set(auth(engineer))).body.items[0].id;
    await t.http.post(`/api/house-parts/${hp}/sources`).set(auth(engineer)).send({ vendorPartId: vp, role: 'alternate', note: '@SUM(A1:A9)' });
    const parts = parse((await t.http.get('/api/exports/house-parts').set(auth(buyer))).text, { bom: true, columns: true }) as Array<Record<string, string>>;
    expect(parts.find((r) => r['House part'] === 'OHI-ZD-CSVX')).toMatchObject({
      Description: `'=HYPERLINK("http://x.invalid","open")`,
      'Source note': "'@SUM(A1:A9)",
    });
    const cards = parse((await t.http.get('/api/exports/rating-cards?manufacturer=Ostrander%20Components').set(auth(designer))).text, {
      bom: true,
      columns: true,
    }) as Array<Record<string, string>>;
    expect(cards[0]['Temperature coefficient converted (V/K)']).toBe('-0.0014');
  });
});
