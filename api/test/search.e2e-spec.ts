import type { SearchItem, SearchPage, SourcesView } from '@shuntwise/contracts';
import { createTestApp, type TestApp } from './helpers/test-app';

/**
 * GET /api/search on the demo catalogue and its qualification cases (real MariaDB). What
 * "usable" means is checked against the Sources view's own read model: the approved sources
 * and the alternates whose latest decision cleared them.
 */
describe('search (real MariaDB, demo seed)', () => {
  let t: TestApp;
  let designer: string;
  let engineer: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const search = async (query: string, token = designer) => {
    const res = await t.http.get(`/api/search${query ? `?${query}` : ''}`).set(auth(token));
    expect(res.status).toBe(200);
    return res.body as SearchPage;
  };
  /** Every page of a query, by walking pageIndex. */
  const allPages = async (query: string, pageSize = 7) => {
    const items: SearchItem[] = [];
    let total = 0;
    for (let pageIndex = 0; pageIndex < 50; pageIndex++) {
      const page = await search(`${query}${query ? '&' : ''}pageSize=${pageSize}&pageIndex=${pageIndex}`);
      total = page.total;
      items.push(...page.items);
      if (page.items.length < pageSize) break;
    }
    return { items, total };
  };
  const mpns = (items: SearchItem[]) => items.map((i) => i.vendorPart.mpn);

  let usableFromSources: Set<string>;

  // The demo seed now approves every approved source through its case: give it time on a busy machine.
  beforeAll(async () => {
    t = await createTestApp({ seed: 'demo' });
    [designer, engineer] = await Promise.all([t.tokenFor('designer'), t.tokenFor('engineer@demo.test')]);
    // The engineers' Sources view, independently of the search's SQL: sources standing
    // approved (by a decision) or cleared.
    const view = (await t.http.get('/api/qualification-views/sources').set(auth(engineer))).body as SourcesView;
    usableFromSources = new Set(
      view.items.flatMap((h) =>
        h.sources.filter((s) => s.standing === 'approved' || s.standing === 'cleared' || s.standing === 'cleared-with-conditions').map((s) => s.vendorPart.mpn),
      ),
    );
  }, 240_000);
  afterAll(() => t.close());

  it('lists only usable parts by default, exactly those the Sources view stands cleared or approved', async () => {
    const { items, total } = await allPages('');
    expect(total).toBe(usableFromSources.size);
    expect(new Set(mpns(items))).toEqual(usableFromSources);
    for (const item of items) {
      expect(item.cleared).toBe(true);
      expect(item.clearances.length).toBeGreaterThan(0);
    }
    // The demo's cases that do not clear: revoked, rejected, in review, draft, withdrawn.
    for (const mpn of ['QHZ24AF', 'TPZ15-8V2', 'QHZ6V8A', 'QHZ8V2AF', 'NMZ-05V1']) expect(mpns(items)).not.toContain(mpn);
    // Alternates without any case stay out too.
    expect(mpns(items)).not.toContain('CBX3-5.1');
    expect(mpns(items)).toEqual(expect.arrayContaining(['QHZ4V7A', 'QHZ5V6A', 'TPZ15-11', 'BRZ05-12', 'BRZ05-5V1']));
  });

  it('tells the designer which house part a part was ruled out for, why, by whom and when (demo: one rejected, one revoked)', async () => {
    const rejected = (await search('q=TPZ15-8V2&includeNotCleared=true')).items.find((i) => i.vendorPart.mpn === 'TPZ15-8V2')!;
    expect(rejected.cleared).toBe(false);
    expect(rejected.ruledOut).toEqual([
      {
        housePart: expect.objectContaining({ partNumber: 'OHI-ZD-2082' }),
        state: 'rejected',
        caseId: expect.any(Number),
        reason: 'Reverse leakage is 25 % above the spec limit at 5.7 V.',
        at: expect.any(String),
        by: { id: expect.any(Number), name: 'Tomas Eklund' },
      },
    ]);
    const revoked = (await search('q=QHZ24AF&includeNotCleared=true')).items.find((i) => i.vendorPart.mpn === 'QHZ24AF')!;
    expect(revoked.ruledOut).toEqual([
      expect.objectContaining({
        housePart: expect.objectContaining({ partNumber: 'OHI-ZD-1240' }),
        state: 'revoked',
        reason: expect.stringMatching(/move of assembly/),
      }),
    ]);
    // A cleared part carries no ruling out.
    expect((await search('q=TPZ15-11')).items.find((i) => i.vendorPart.mpn === 'TPZ15-11')!.ruledOut).toEqual([]);
  });

  it('says for which house part, on what conditions and since when a part is cleared', async () => {
    const { items } = await search('q=TPZ15-11');
    const part = items.find((i) => i.vendorPart.mpn === 'TPZ15-11')!;
    expect(part.clearances).toEqual([
      expect.objectContaining({
        housePart: expect.objectContaining({ partNumber: 'OHI-ZD-2110', status: 'active' }),
        standing: 'cleared-with-conditions',
        conditions: expect.stringMatching(/five pieces per lot/),
        decidedBy: { id: expect.any(Number), name: 'Tomas Eklund' },
        needsRecheck: false,
      }),
    ]);
    // decided 26 days ago in the demo seed
    const days = (Date.now() - Date.parse(part.clearances[0].since!)) / 86_400_000;
    expect(days).toBeGreaterThan(25);
    expect(days).toBeLessThan(27.1);

    const flagged = (await search('q=BRZ05-12')).items.find((i) => i.vendorPart.mpn === 'BRZ05-12')!;
    expect(flagged.clearances).toEqual([
      expect.objectContaining({ standing: 'cleared', needsRecheck: true, housePart: expect.objectContaining({ partNumber: 'OHI-ZD-1120' }) }),
    ]);

    const approved = (await search('q=BRZ05-4V7')).items.find((i) => i.vendorPart.mpn === 'BRZ05-4V7')!;
    // approved by a decision: the case, who and since when
    expect(approved.clearances).toEqual([
      expect.objectContaining({
        standing: 'approved',
        caseId: expect.any(Number),
        decidedBy: expect.objectContaining({ name: 'Tomas Eklund' }),
        housePart: expect.objectContaining({ partNumber: 'OHI-ZD-1047' }),
      }),
    ]);
    expect(approved.clearances[0].since).toEqual(expect.any(String));
  });

  it('carries the card figures a designer chooses by, equal to the rating card', async () => {
    const item = (await search('q=QHZ5V6A')).items[0];
    expect(item.vendorPart.mpn).toBe('QHZ5V6A');
    const card = (await t.http.get(`/api/vendor-parts/${item.vendorPart.id}/rating-card`).set(auth(designer))).body as {
      version: number;
      fields: Record<string, { value: number; unit?: string; voltsPerKelvin?: number }>;
    };
    const f = card.fields;
    expect(item.card).toMatchObject({
      version: card.version,
      vzMin: f.vzMin.value,
      vzNom: f.vzNom.value,
      vzMax: f.vzMax.value,
      izt: f.izt.value,
      zzt: f.zzt.value,
      pdMax: f.pdMax.value,
      tc: f.tc.voltsPerKelvin,
    });
    // Tolerance as the half-width of the Vz window over nominal (common practice, no source), the
    // printed ends taken back by at most half their last digit (they are rounded when printed).
    const raw = Math.max(f.vzNom.value - f.vzMin.value, f.vzMax.value - f.vzNom.value) / f.vzNom.value;
    expect(item.card!.tolerance).toBeLessThanOrEqual(raw + 1e-9);
    expect(item.card!.tolerance).toBeGreaterThanOrEqual(raw - 0.005 / f.vzNom.value - 1e-6);
    expect(item.vendorPart.package).toEqual(expect.any(String));
    expect(item.datasheetId).toEqual(expect.any(Number));
    expect((await t.http.get(`/api/datasheets/${item.datasheetId}/file`).set(auth(designer))).status).toBe(200);
  });

  it('narrows by Zener voltage (nominal, or the whole tolerance window), package, power, tolerance, manufacturer and house part', async () => {
    const everything = (await allPages('')).items;
    const check = async (query: string, keep: (i: SearchItem) => boolean) => {
      const { items, total } = await allPages(query);
      const expected = everything.filter(keep);
      expect(expected.length).toBeGreaterThan(0);
      expect(expected.length).toBeLessThan(everything.length);
      expect(total).toBe(expected.length);
      expect(new Set(mpns(items))).toEqual(new Set(mpns(expected)));
    };
    await check('vzFrom=4.5&vzTo=6', (i) => i.card !== null && i.card.vzNom >= 4.5 && i.card.vzNom <= 6);
    await check('vzFrom=4.4&vzTo=5.2&vzWindow=true', (i) => i.card?.vzMin != null && i.card.vzMax != null && i.card.vzMin >= 4.4 && i.card.vzMax <= 5.2);
    // BRZ05-5V1 (5.1 V nominal, up to 5.36 V) is inside by nominal, outside by window
    expect(mpns((await allPages('vzFrom=4.4&vzTo=5.2')).items)).toContain('BRZ05-5V1');
    expect(mpns((await allPages('vzFrom=4.4&vzTo=5.2&vzWindow=true')).items)).not.toContain('BRZ05-5V1');
    await check('package=SOD-123', (i) => i.vendorPart.package === 'SOD-123');
    const twoPackages = [...new Set(everything.map((i) => i.vendorPart.package).filter((p): p is string => p !== null))].slice(0, 2);
    await check(`package=${encodeURIComponent(twoPackages.join(','))}`, (i) => twoPackages.includes(i.vendorPart.package ?? ''));
    await check('pdMin=1', (i) => (i.card?.pdMax ?? 0) >= 1);
    await check('toleranceMax=0.025', (i) => i.card?.tolerance != null && i.card.tolerance <= 0.025 + 1e-9);
    // A ±5 % 5.1 V part spans 4.845…5.355 V and is printed 4.85 / 5.1 / 5.36 V, which read back
    // as ±5.1 % (arithmetic; printing to the nearest digit is common practice, no source):
    // "±5 % or better" must still find it.
    const [brz] = await t.select<{ fields: string | Record<string, { value: number }> }>(
      "SELECT rc.fields FROM rating_cards rc JOIN vendor_parts vp ON vp.id = rc.vendor_part_id WHERE vp.mpn = 'BRZ05-5V1'",
    );
    const brzFields = (typeof brz.fields === 'string' ? JSON.parse(brz.fields) : brz.fields) as Record<string, { value: number }>;
    expect([brzFields.vzMin.value, brzFields.vzNom.value, brzFields.vzMax.value]).toEqual([4.85, 5.1, 5.36]);
    expect((5.36 - 5.1) / 5.1).toBeGreaterThan(0.05);
    expect(mpns((await allPages('toleranceMax=0.05&includeNotCleared=true', 50)).items)).toContain('BRZ05-5V1');
    expect(mpns((await allPages('toleranceMax=0.049&includeNotCleared=true', 50)).items)).not.toContain('BRZ05-5V1');
    await check(`manufacturer=${encodeURIComponent('Quarryhill Semitech')}`, (i) => i.vendorPart.manufacturer === 'Quarryhill Semitech');

    const facets = (await t.http.get('/api/search/facets').set(auth(designer))).body as {
      houseParts: Array<{ id: number; partNumber: string; cleared: number }>;
    };
    const hp1047 = facets.houseParts.find((h) => h.partNumber === 'OHI-ZD-1047')!;
    expect(hp1047.cleared).toBe(2);
    const forHousePart = await allPages(`housePartId=${hp1047.id}`);
    expect(mpns(forHousePart.items).sort()).toEqual(['BRZ05-4V7', 'QHZ4V7A']);
    // the revoked alternate of OHI-ZD-1240 leaves its approved part alone
    const hp1240 = facets.houseParts.find((h) => h.partNumber === 'OHI-ZD-1240')!;
    expect(mpns((await allPages(`housePartId=${hp1240.id}`)).items)).toEqual(['BRZ05-24']);
  });

  it('finds parts by text: part numbers with typos, house part numbers, descriptions, manufacturers', async () => {
    expect((await search('q=QHZ5V6A')).items[0].vendorPart.mpn).toBe('QHZ5V6A');
    // one transposed pair of letters
    expect(mpns((await search('q=QZH5V6A')).items).slice(0, 2)).toContain('QHZ5V6A');
    // separators left out
    expect((await search('q=brz0512')).items[0].vendorPart.mpn).toBe('BRZ05-12');
    const byHousePart = await search('q=OHI-ZD-1056');
    expect(mpns(byHousePart.items).slice(0, 2).sort()).toEqual(['BRZ05-5V6', 'QHZ5V6A']);
    expect(byHousePart.text).toMatchObject({ mode: 'fuzzy', truncated: false });
    const byDescription = await search('q=loop driver');
    expect(mpns(byDescription.items).slice(0, 2).sort()).toEqual(['BRZ05-5V6', 'QHZ5V6A']);
    const byMaker = await search('q=Tevorrow');
    expect(byMaker.items.length).toBeGreaterThan(0);
    for (const i of byMaker.items) expect(i.vendorPart.manufacturer).toBe('Tevorrow Power Devices');
    expect(byMaker.items[0].score).toEqual(expect.any(Number));
    // text and filters together
    const filtered = await search('q=QHZ&vzFrom=5&vzTo=6');
    expect(mpns(filtered.items)).toEqual(['QHZ5V6A']);
    expect((await search('q=zzzzqqqq')).total).toBe(0);
  });

  it('pages on the server, with and without text, and sorts', async () => {
    const full = await search('pageSize=100');
    const paged = await allPages('', 4);
    expect(paged.total).toBe(full.total);
    expect(mpns(paged.items)).toEqual(mpns(full.items));
    // default order without text: by Zener voltage
    const vz = full.items.map((i) => i.card!.vzNom);
    expect(vz).toEqual([...vz].sort((a, b) => a - b));
    const byPower = (await search('sort=-pdMax&pageSize=100')).items.map((i) => i.card!.pdMax ?? 0);
    expect(byPower).toEqual([...byPower].sort((a, b) => b - a));

    const text = await search('q=BRZ05&pageSize=100');
    expect(text.total).toBeGreaterThan(4);
    const textPaged = await allPages('q=BRZ05', 4);
    expect(textPaged.total).toBe(text.total);
    expect(mpns(textPaged.items)).toEqual(mpns(text.items));
    const sorted = (await search('q=BRZ05&sort=mpn&pageSize=100')).items.map((i) => i.vendorPart.mpn);
    expect(sorted).toEqual([...sorted].sort((a, b) => a.localeCompare(b, 'en', { numeric: true })));
    const last = await search(`pageSize=4&pageIndex=${Math.ceil(full.total / 4)}`);
    expect(last.items).toEqual([]);
    expect(last.total).toBe(full.total);
  });

  it('includes parts that are not cleared on request, clearly marked', async () => {
    const [{ n }] = await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM vendor_parts');
    const { items, total } = await allPages('includeNotCleared=true', 40);
    expect(total).toBe(Number(n));
    const byMpn = new Map(items.map((i) => [i.vendorPart.mpn, i]));
    for (const item of items) expect(item.cleared).toBe(usableFromSources.has(item.vendorPart.mpn));
    expect(byMpn.get('QHZ24AF')).toMatchObject({ cleared: false, clearances: [], qualificationOpen: false });
    expect(byMpn.get('QHZ6V8A')).toMatchObject({ cleared: false, clearances: [], qualificationOpen: true });
    expect(byMpn.get('QHZ5V6A')).toMatchObject({ cleared: true });
    const text = await search('q=QHZ24AF&includeNotCleared=true');
    expect(text.items[0]).toMatchObject({ vendorPart: { mpn: 'QHZ24AF' }, cleared: false });
  });

  it('refuses bad filters with a message naming them, and nothing but designers, engineers and admins', async () => {
    const bad = async (query: string, path: string, pattern: RegExp) => {
      const res = await t.http.get(`/api/search?${query}`).set(auth(designer));
      expect(res.status).toBe(400);
      expect(res.body.correlationId).toEqual(expect.any(String));
      expect(res.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ path, message: expect.stringMatching(pattern) })]));
    };
    await bad('vzFrom=6&vzTo=5', 'vzFrom', /above VZ to/);
    await bad('sort=zzt', 'sort', /cannot sort by "zzt"/);
    await bad('vzWindow=true', 'vzWindow', /needs vzFrom or vzTo/);
    await bad('housePartId=3&includeNotCleared=true', 'includeNotCleared', /cannot be combined/);
    await bad('pageSize=500', 'pageSize', /.+/);
    await bad('toleranceMax=abc', 'toleranceMax', /.+/);

    expect((await t.http.get('/api/search').set(auth(await t.tokenFor('buyer')))).status).toBe(403);
    expect((await t.http.get('/api/search/facets').set(auth(await t.tokenFor('buyer')))).status).toBe(403);
    expect((await t.http.get('/api/search')).status).toBe(401);
    expect((await t.http.get('/api/search').set(auth(engineer))).status).toBe(200);
    expect((await t.http.get('/api/search').set(auth(await t.tokenFor('admin')))).status).toBe(200);
  });

  it('publishes its parameters and answers at /api/docs', async () => {
    const docs = (await t.http.get('/api/docs-json')).body;
    expect(Object.keys(docs.components.schemas)).toEqual(expect.arrayContaining(['SearchPageDto', 'SearchFacetsDto']));
    expect(docs.paths['/api/search'].get.parameters.map((p: { name: string }) => p.name)).toEqual(
      expect.arrayContaining([
        'q',
        'vzFrom',
        'vzTo',
        'vzWindow',
        'package',
        'pdMin',
        'toleranceMax',
        'manufacturer',
        'housePartId',
        'includeNotCleared',
        'sort',
        'pageIndex',
        'pageSize',
      ]),
    );
  });

  it('offers no draft house part in the house-part facet (contracts DESIGNER_HOUSE_PART_STATUSES)', async () => {
    const created = await t.http.post('/api/house-parts').set(auth(engineer)).send({ partNumber: 'OHI-ZD-DRAFT-1', description: 'Being specified' });
    expect(created.body.status).toBe('draft');
    const facets = (await t.http.get('/api/search/facets').set(auth(designer))).body as { houseParts: Array<{ partNumber: string; status: string }> };
    expect(facets.houseParts.length).toBeGreaterThan(0);
    expect(facets.houseParts.map((h) => h.partNumber)).not.toContain('OHI-ZD-DRAFT-1');
    expect(facets.houseParts.filter((h) => h.status === 'draft')).toEqual([]);
  });

  it('offers facets with usable and catalogue counts', async () => {
    const facets = (await t.http.get('/api/search/facets').set(auth(designer))).body as {
      packages: Array<{ value: string; cleared: number; total: number }>;
      manufacturers: Array<{ value: string; cleared: number; total: number }>;
      clearedParts: number;
      catalogueParts: number;
    };
    expect(facets.clearedParts).toBe(usableFromSources.size);
    const [{ n }] = await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM vendor_parts');
    expect(facets.catalogueParts).toBe(Number(n));
    const sod123 = facets.packages.find((p) => p.value === 'SOD-123')!;
    expect(sod123.cleared).toBe((await search('package=SOD-123&pageSize=1')).total);
    expect(sod123.total).toBe((await search('package=SOD-123&includeNotCleared=true&pageSize=1')).total);
    expect(facets.manufacturers.reduce((s, m) => s + m.cleared, 0)).toBe(usableFromSources.size);
  });

  it("hands the engineering core a card it accepts: the designer's circuit check on a found part", async () => {
    const item = (await search('q=QHZ5V6A')).items[0];
    const { version: _v, tolerance: _t, ...card } = item.card!;
    const res = await t.http
      .post('/api/engineering/regulator')
      .set(auth(designer))
      .send({
        card,
        supply: { min: 10.8, nom: 12, max: 13.2 },
        load: { min: 0, max: 0.02 },
        ambient: { min: -20, max: 70 },
        resistor: { series: 'E24', tolerance: 0.05 },
      });
    expect(res.status).toBe(200);
    // R = (Vs − Vz)/(Iz + IL,max) at the nominal supply (common practice, no source).
    expect(res.body.simple.resistance).toBeCloseTo((12 - card.vzNom) / (card.izt + 0.02), 6);
  });
});
