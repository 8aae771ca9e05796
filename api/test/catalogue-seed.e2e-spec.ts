import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { QUALIFICATION_SEED_CARD_REVISIONS } from '../src/seed/qualifications-seeder.service';
import { DemoSeedService } from '../src/seed/demo-seed.service';
import { StorageService } from '../src/storage/storage.service';
import { createTestApp, type TestApp } from './helpers/test-app';

const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');

describe('demo catalogue seed (real MariaDB, S3 fake)', () => {
  let t: TestApp;
  let seedSeconds: number;
  const catalogue = fixtures.loadDemoCatalogue();
  const count = async (table: string) => (await t.select<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`))[0].n;
  const counts = async () => ({
    datasheets: await count('datasheets'),
    manufacturers: await count('manufacturers'),
    vendorParts: await count('vendor_parts'),
    cards: await count('rating_cards'),
    cardVersions: await count('rating_card_versions'),
    houseParts: await count('house_parts'),
    specs: await count('house_part_specs'),
    sources: await count('house_part_sources'),
    links: await count('vendor_part_datasheets'),
    measurementSets: await count('measurement_sets'),
  });

  beforeAll(async () => {
    t = await createTestApp({ seed: 'users' });
    const started = performance.now();
    await t.stack.app.get(DemoSeedService).run('demo');
    seedSeconds = (performance.now() - started) / 1000;
  }, 300_000); // the whole demo through the real services: slow on a loaded two-core machine
  afterAll(() => t.close());

  it('loads the whole invented catalogue', async () => {
    console.log(`first demo seed run (8 uploads with extraction, 120 parts and cards, 22 house parts): ${seedSeconds.toFixed(2)} s`);
    expect(await counts()).toEqual({
      datasheets: catalogue.datasheets.length,
      manufacturers: catalogue.vendors.length,
      vendorParts: catalogue.vendorParts.length,
      cards: catalogue.vendorParts.length,
      cardVersions: catalogue.vendorParts.length + QUALIFICATION_SEED_CARD_REVISIONS, // the demo re-check story corrects one card
      houseParts: catalogue.houseParts.length,
      specs: catalogue.houseParts.length,
      sources: catalogue.houseParts.reduce((n, h) => n + h.sources.length, 0),
      links: catalogue.vendorParts.length,
      measurementSets: fixtures.listMeasurementFixtures().length,
    });
    const storage = t.stack.app.get(StorageService);
    const listed = await storage.client.send(new ListObjectsV2Command({ Bucket: storage.bucket }));
    expect(listed.Contents?.length).toBe(catalogue.datasheets.length + fixtures.listMeasurementFixtures().length);
  });

  it('gives every card value its datasheet and page, confirmed by the demo engineer', async () => {
    const engineer = await t.tokenFor('engineer');
    const part = catalogue.vendorParts[0];
    const vendor = catalogue.vendors.find((v) => v.code === part.vendor)!.name;
    const list = await t.http
      .get(`/api/vendor-parts?mpn=${encodeURIComponent(part.mpn)}&manufacturer=${encodeURIComponent(vendor)}`)
      .set('Authorization', `Bearer ${engineer}`);
    const card = (await t.http.get(`/api/vendor-parts/${list.body.items[0].id}/rating-card?include=engineering`).set('Authorization', `Bearer ${engineer}`))
      .body;
    const [sheet] = await t.select<{ id: number }>('SELECT id FROM datasheets WHERE file_name = ?', [part.datasheet.file]);
    for (const [field, value] of Object.entries(part.ratingCard.fields)) {
      expect([field, card.fields[field].value]).toEqual([field, field === 'tc' ? value.valueInUnit : value.value]);
      expect(card.fields[field].provenance).toMatchObject({
        source: 'extracted',
        datasheetId: sheet.id,
        page: value.page,
        confirmedBy: { name: 'Priya Raman' },
      });
    }
    expect(card.engineering.basis).not.toBeNull(); // it is a source of a house part with a spec
    const extraction = await t.http.get(`/api/datasheets/${sheet.id}/extraction`).set('Authorization', `Bearer ${engineer}`);
    expect(extraction.body.variants.length).toBeGreaterThan(0);
  });

  it('adds nothing when run again', async () => {
    const before = await counts();
    const started = performance.now();
    const again = await t.stack.app.get(DemoSeedService).run('demo');
    console.log(`second demo seed run: ${((performance.now() - started) / 1000).toFixed(2)} s`);
    expect(again.created).toBe(0);
    expect(await counts()).toEqual(before);
  });
});
