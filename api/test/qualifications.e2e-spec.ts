import { readFileSync } from 'node:fs';
import { hashPassword } from '../src/auth/passwords';
import { MailService } from '../src/mail/mail.service';
import { UsersRepository } from '../src/users/users.repository';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

/**
 * The qualification workflow against the real MariaDB and the SMTP fake. Hand-computed
 * values use the SPICE reverse-breakdown law Zd(I) = NBV·Vt/I + RS through the card's two
 * impedance points (ngspice manual, diode model; quoted from memory).
 */
describe('qualifications (real MariaDB, SMTP fake)', () => {
  let t: TestApp;
  let engineer: string; // Priya Raman, prepares
  let reviewer: string; // Tomas Eklund, a second engineer
  let third: string; // a third engineer, for the race
  let designer: string;
  let buyer: string;
  let admin: string;
  let buyerId: number;
  let reviewerId: number;
  let n = 0;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const entered = { source: 'entered' as const };
  // A window wide enough that the demo card passes every check with margin.
  const passingSpec = () => demoSpec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } });
  const passingCard = () =>
    demoCardFields({ vzMin: { value: 4.9, printed: '4.9 V', provenance: entered }, vzMax: { value: 5.3, printed: '5.3 V', provenance: entered } });

  /** A house part with a spec and a vendor part (package SOD-123) with a card; returns their ids. */
  async function pair(spec = passingSpec(), fields = passingCard(), pkg = 'SOD-123') {
    n++;
    const housePartId = await createHousePart(t.http, engineer, `HPQ-${n}`, `Regulator diode case ${n}`);
    expect((await t.http.put(`/api/house-parts/${housePartId}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec })).status).toBe(200);
    const vendorPartId = await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn: `FZ-${n}`, package: pkg });
    expect((await t.http.put(`/api/vendor-parts/${vendorPartId}/rating-card`).set(auth(engineer)).send({ version: 0, fields })).status).toBe(200);
    return { housePartId, vendorPartId };
  }
  const open = async (ids: { housePartId: number; vendorPartId: number }, token = engineer) => t.http.post('/api/qualifications').set(auth(token)).send(ids);
  /** An action on the case as it is now: the current version is sent unless the body names one (a re-check takes none). */
  const act = async (id: number, action: string, body: object = {}, token = engineer) => {
    const withVersion =
      action === 'recheck' || 'version' in body ? body : { version: (await t.http.get(`/api/qualifications/${id}`).set(auth(engineer))).body.version, ...body };
    return t.http.post(`/api/qualifications/${id}/${action}`).set(auth(token)).send(withVersion);
  };
  /** A case opened by the engineer and sent for review. */
  async function inReview(ids?: { housePartId: number; vendorPartId: number }) {
    const opened = await open(ids ?? (await pair()));
    expect(opened.status).toBe(201);
    const submitted = await act(opened.body.id, 'submit', { reviewerId });
    expect(submitted.status).toBe(200);
    return submitted.body as { id: number; housePart: { id: number }; vendorPart: { id: number }; version: number };
  }

  beforeAll(async () => {
    t = await createTestApp();
    const users = t.stack.app.get(UsersRepository);
    await users.create({
      email: 'third.engineer@demo.test',
      name: 'Ines Marwick',
      role: 'engineer',
      passwordHash: await hashPassword(t.stack.env.DEMO_PASSWORD),
    });
    [engineer, reviewer, third, designer, buyer, admin] = await Promise.all([
      t.tokenFor('engineer@demo.test'),
      t.tokenFor('reviewer@demo.test'),
      t.tokenFor('third.engineer@demo.test'),
      t.tokenFor('designer'),
      t.tokenFor('buyer'),
      t.tokenFor('admin'),
    ]);
    buyerId = (await users.findByEmail('buyer@demo.test'))!.id;
    reviewerId = (await users.findByEmail('reviewer@demo.test'))!.id;
  });
  afterAll(() => t.close());

  it('opens a case and evaluates it through the route against the current spec and card', async () => {
    const ids = await pair();
    const res = await open(ids);
    expect(res.status).toBe(201);
    const body = res.body;
    expect(body).toMatchObject({
      revision: 1,
      previousId: null,
      state: 'draft',
      specVersion: 1,
      cardVersion: 1,
      sourceRole: 'alternate',
      preparedBy: { name: 'Priya Raman' },
    });
    const check = (id: string) => body.evaluation.checks.find((c: { id: string }) => c.id === id);
    // iRef = izt = 5 mA: the window is the card's 4.9…5.3 V; (4.9 − 4.6)/4.6 = 6.52 % and (5.6 − 5.3)/5.6 = 5.36 %
    expect(check('vz-window').range).toEqual({ low: 4.9, high: 5.3 });
    expect(check('vz-window').margin).toBeCloseTo((0.3 / 5.6) * 100, 9);
    // Zd at izt is the card's zzt, 40 Ω, against 60 Ω
    expect(check('zd').value).toBeCloseTo(40, 9);
    // knee at iKnee = izk: zzk/zzt = 500/40 = 12.5 against 20 → (20 − 12.5)/20 = 37.5 %
    expect(check('knee-ratio').value).toBeCloseTo(12.5, 9);
    expect(check('knee-ratio').margin).toBeCloseTo(37.5, 9);
    // 1 µA at 2 V against 2 µA at 2 V
    expect(check('leakage').margin).toBeCloseTo(50, 9);
    // +0.3 mV/K in −1…+3 mV/K: 1.3 mV/K from the nearer end, in % of 3 mV/K (common practice, no source)
    expect(check('tc').margin).toBeCloseTo((1.3 / 3) * 100, 6);
    expect(check('package')).toMatchObject({ verdict: 'pass', text: { value: 'SOD-123' } });
    expect(body.evaluation.overall).toBe('pass');
    expect(body.overall).toBe('pass');
    expect(body.evaluation.caution).toMatch(/confirm by measurement/);
    expect(body.allowedActions).toEqual(expect.arrayContaining(['evaluate', 'submit', 'withdraw']));
    expect(body.allowedActions).not.toContain('clear');
    // the vendor part became an alternate source of the house part
    const sources = await t.http.get(`/api/house-parts/${ids.housePartId}/sources`).set(auth(engineer));
    expect(sources.body.map((s: { vendorPartId: number; role: string }) => [s.vendorPartId, s.role])).toEqual([[ids.vendorPartId, 'alternate']]);
    // one open case per source at a time
    const again = await open(ids);
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(new RegExp(`Case #${body.id} .* still draft`));
  });

  it('refuses cases it cannot evaluate, naming why', async () => {
    const ids = await pair();
    expect((await open({ ...ids, housePartId: 999999 })).status).toBe(404);
    const noSpec = await createHousePart(t.http, engineer, `HPQ-NOSPEC`);
    const r1 = await open({ housePartId: noSpec, vendorPartId: ids.vendorPartId });
    expect(r1.status).toBe(422);
    expect(r1.body.message).toMatch(/HPQ-NOSPEC has no spec yet/);
    const bare = await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn: 'FZ-BARE' });
    const r2 = await open({ housePartId: ids.housePartId, vendorPartId: bare });
    expect(r2.status).toBe(422);
    expect(r2.body.message).toMatch(/FZ-BARE has no rating card yet/);
    const r3 = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId: 'one' });
    expect(r3.status).toBe(400);
    expect(r3.body.errors.map((e: { path: string }) => e.path)).toEqual(expect.arrayContaining(['housePartId', 'vendorPartId']));
  });

  it('lets no engineer approve a case they prepared; another engineer clears it; the decision keeps who, when and the versions', async () => {
    const c = await inReview();
    const self = await act(c.id, 'clear', {}, engineer);
    expect(self.status).toBe(403);
    expect(self.body.message).toBe(`You prepared case #${c.id}; another engineer must decide it (two-person rule)`);
    const seenByPreparer = await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer));
    expect(seenByPreparer.body.allowedActions).not.toContain('clear');
    const seenByReviewer = await t.http.get(`/api/qualifications/${c.id}`).set(auth(reviewer));
    expect(seenByReviewer.body.allowedActions).toEqual(expect.arrayContaining(['clear', 'clear-with-conditions', 'reject', 'send-back']));
    // Withdrawing is the preparer's (contracts actionBlock): the reviewer is not offered it and is refused.
    expect(seenByReviewer.body.allowedActions).not.toContain('withdraw');
    expect(seenByPreparer.body.allowedActions).toContain('withdraw');
    const reviewerWithdraws = await act(c.id, 'withdraw', {}, reviewer);
    expect(reviewerWithdraws.status).toBe(403);
    expect(reviewerWithdraws.body.message).toMatch(/Only the engineer who prepared case #\d+ can withdraw it/);

    const [{ now: before }] = await t.select<{ now: Date }>('SELECT NOW(3) AS now');
    const cleared = await act(c.id, 'clear', { note: 'equivalent on every check' }, reviewer);
    const [{ now: after }] = await t.select<{ now: Date }>('SELECT NOW(3) AS now');
    expect(cleared.status).toBe(200);
    expect(cleared.body).toMatchObject({
      state: 'cleared',
      decision: { state: 'cleared', by: { name: 'Tomas Eklund' }, specVersion: 1, cardVersion: 1, text: 'equivalent on every check' },
    });
    // "When" is the database's time of the decision: between two readings of that clock taken around it (an order, not a duration).
    const at = Date.parse(cleared.body.decision.at);
    expect(at).toBeGreaterThanOrEqual(new Date(before).getTime() - 1000); // stored to the second
    expect(at).toBeLessThanOrEqual(new Date(after).getTime());
  });

  it('keeps a decided case as it was: edits and further decisions are 409; comments may still be added', async () => {
    const c = await inReview();
    expect((await act(c.id, 'reject', { reason: 'leakage measured above the limit on incoming samples' }, reviewer)).status).toBe(200);
    const current = (await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body;
    const edit = await t.http.patch(`/api/qualifications/${c.id}`).set(auth(engineer)).send({ version: current.version, summary: 'changed my mind' });
    expect(edit.status).toBe(409);
    expect(edit.body.message).toBe(`Case #${c.id} is rejected: a decided case cannot be edited. Open a re-check to revise it.`);
    for (const [action, body] of [
      ['clear', {}],
      ['clear-with-conditions', { conditions: 'x' }],
      ['evaluate', {}],
      ['submit', {}],
      ['withdraw', {}],
      ['send-back', { reason: 'x' }],
    ] as const) {
      const res = await act(c.id, action, body, reviewer);
      expect([action, res.status]).toEqual([action, 409]);
      expect(res.body.message).toMatch(/decided case cannot be/);
    }
    expect((await act(c.id, 'revoke', { reason: 'x' }, reviewer)).status).toBe(409); // only a clearance can be revoked
    const after = (await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body;
    expect(after).toMatchObject({ state: 'rejected', version: current.version, summary: current.summary });
    expect((await t.http.post(`/api/qualifications/${c.id}/comments`).set(auth(engineer)).send({ text: 'vendor promises a new lot' })).status).toBe(201);
  });

  it('clears only a passing case outright; marginal needs written conditions, a failing one can only be rejected', async () => {
    // 4.85…5.36 V spec window and the card's own 4.85…5.36 V: margin 0 %, marginal with the 5 % band
    const marginal = await inReview(await pair(demoSpec(), demoCardFields()));
    const refused = await act(marginal.id, 'clear', {}, reviewer);
    expect(refused.status).toBe(422);
    expect(refused.body.message).toMatch(/evaluates as marginal .*clear it with conditions/);
    const noText = await act(marginal.id, 'clear-with-conditions', { conditions: '  ' }, reviewer);
    expect(noText.status).toBe(400);
    expect(noText.body.errors).toEqual([{ path: 'conditions', message: 'Write the conditions' }]);
    const ok = await act(marginal.id, 'clear-with-conditions', { conditions: 'incoming inspection measures Vz at 5 mA on every lot' }, reviewer);
    expect(ok.status).toBe(200);
    expect(ok.body.decision).toMatchObject({ state: 'cleared-with-conditions', text: 'incoming inspection measures Vz at 5 mA on every lot' });

    const failing = await inReview(await pair(passingSpec(), passingCard(), 'SMA'));
    const r = await act(failing.id, 'clear-with-conditions', { conditions: 'use anyway' }, reviewer);
    expect(r.status).toBe(422);
    expect(r.body.message).toMatch(/fails \(Fails: package\)/);
    expect((await act(failing.id, 'reject', {}, reviewer)).status).toBe(400); // a rejection needs its reason
    expect((await act(failing.id, 'reject', { reason: 'package not allowed' }, reviewer)).status).toBe(200);
  });

  it('enforces roles on every route: designers and buyers cannot decide; buyers read Sources and export them', async () => {
    const ids = await pair();
    expect((await open(ids, designer)).status).toBe(403);
    expect((await open(ids, buyer)).status).toBe(403);
    expect((await open(ids, admin)).status).toBe(403);
    const c = await inReview(ids);
    for (const token of [designer, buyer, admin]) {
      expect((await act(c.id, 'clear', {}, token)).status).toBe(403);
      expect((await act(c.id, 'reject', { reason: 'no' }, token)).status).toBe(403);
    }
    expect((await t.http.get(`/api/qualifications/${c.id}`).set(auth(buyer))).status).toBe(403);
    expect((await t.http.get(`/api/qualifications/${c.id}`).set(auth(admin))).status).toBe(200);
    const designerEarly = await t.http.get(`/api/qualifications/${c.id}`).set(auth(designer));
    expect(designerEarly.status).toBe(403);
    expect(designerEarly.body.message).toMatch(/designers see cleared cases only/);
    expect((await t.http.get('/api/qualification-views/board').set(auth(buyer))).status).toBe(403);

    await act(c.id, 'clear', {}, reviewer);
    const designerCleared = await t.http.get(`/api/qualifications/${c.id}`).set(auth(designer));
    expect(designerCleared.status).toBe(200);
    expect(designerCleared.body.allowedActions).toEqual([]);
    const designerList = await t.http.get('/api/qualifications?pageSize=200').set(auth(designer));
    expect(designerList.body.items.every((i: { state: string }) => i.state === 'cleared' || i.state === 'cleared-with-conditions')).toBe(true);

    const view = await t.http.get(`/api/qualification-views/sources?housePartId=${ids.housePartId}`).set(auth(buyer));
    expect(view.status).toBe(200);
    expect(view.body.items).toHaveLength(1);
    expect(view.body.items[0].sources[0]).toMatchObject({
      vendorPart: { id: ids.vendorPartId, manufacturer: 'Fennick Semiconductor' },
      role: 'alternate',
      standing: 'cleared',
      caseId: c.id,
      decidedBy: { name: 'Tomas Eklund' },
      since: expect.any(String),
    });

    const csv = await t.http.get(`/api/qualification-views/sources.csv?housePartId=${ids.housePartId}`).set(auth(buyer));
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename="sources-\d{4}-\d{2}-\d{2}\.csv"/);
    const lines = csv.text
      .replace(/^\uFEFF/, '')
      .trim()
      .split(/\r?\n/);
    // headers in words, as a person reads them in a spreadsheet
    expect(lines[0]).toBe(
      'House part,Description,House part status,Manufacturer,Manufacturer part number,Package,Role,Standing,Conditions,Since,Decided by,Case,Revision,Open case,Needs re-check',
    );
    expect(lines).toHaveLength(2);
    expect(lines[1]).toMatch(
      new RegExp(`^HPQ-\\d+,Regulator diode case \\d+,draft,Fennick Semiconductor,FZ-\\d+,SOD-123,alternate,Cleared,,\\d{4}-.+Z,Tomas Eklund,${c.id},1,,no$`),
    );
    expect((await t.http.get('/api/qualification-views/sources.csv').set(auth(designer))).status).toBe(200);
    // designers see approved sources and cleared alternates only
    const rejected = await inReview();
    await act(rejected.id, 'reject', { reason: 'no' }, reviewer);
    const forDesigner = await t.http.get(`/api/qualification-views/sources?housePartId=${rejected.housePart.id}`).set(auth(designer));
    expect(forDesigner.body.items[0].sources).toEqual([]);
    const forBuyer = await t.http.get(`/api/qualification-views/sources?housePartId=${rejected.housePart.id}`).set(auth(buyer));
    expect(forBuyer.body.items[0].sources.map((s: { standing: string }) => s.standing)).toEqual(['rejected']);
  });

  it('flags a decided case for re-check when its card changes through the rating-card route; a re-check opens a linked revision', async () => {
    const ids = await pair();
    const c = await inReview(ids);
    await act(c.id, 'clear', {}, reviewer);
    const fresh = await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer));
    expect(fresh.body.needsRecheck).toBe(false);

    const put = await t.http
      .put(`/api/vendor-parts/${ids.vendorPartId}/rating-card`)
      .set(auth(engineer))
      .send({ version: 1, fields: { ...passingCard(), zzt: { value: 45, printed: '45 Ω', provenance: entered } } });
    expect(put.status).toBe(200);
    const flagged = (await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body;
    expect(flagged).toMatchObject({ state: 'cleared', needsRecheck: true, cardVersion: 1, current: { cardVersion: 2, specVersion: 1 } });
    expect(flagged.recheckReasons).toEqual([{ cause: 'card-changed', at: expect.any(String), detail: 'rating card version 2 (changed: zzt)' }]);
    expect(flagged.audit.at(-1)).toMatchObject({ action: 'flagged-for-recheck', by: { name: 'Priya Raman' }, note: 'rating card version 2 (changed: zzt)' });
    expect(flagged.allowedActions).toEqual(expect.arrayContaining(['recheck', 'revoke']));
    // the flag shows on the Board and in the Sources view
    const board = await t.http.get(`/api/qualification-views/board?q=${encodeURIComponent(`HPQ-${n}`)}&needsRecheck=true`).set(auth(engineer));
    expect(board.body.items[0].sources[0]).toMatchObject({ state: 'cleared', latestCase: { id: c.id, needsRecheck: true } });

    const re = await act(c.id, 'recheck', { note: 'zzt corrected by the vendor' }, engineer);
    expect(re.status).toBe(201);
    expect(re.body).toMatchObject({ revision: 2, previousId: c.id, state: 'draft', cardVersion: 2, needsRecheck: false });
    // Zd at izt is now the new zzt
    expect(re.body.evaluation.checks.find((x: { id: string }) => x.id === 'zd').value).toBeCloseTo(45, 9);
    const old = (await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body;
    expect(old).toMatchObject({ state: 'cleared', nextId: re.body.id, decision: { cardVersion: 1 } });
    expect(old.audit.at(-1)).toMatchObject({ action: 'recheck-opened', changes: [{ field: 'nextId', from: null, to: re.body.id }] });
    expect(old.allowedActions).not.toContain('recheck');
    expect((await act(c.id, 'recheck', {}, engineer)).status).toBe(409);
    // buyers still see the clearance, with the re-check under way beside it
    const view = await t.http.get(`/api/qualification-views/sources?housePartId=${ids.housePartId}`).set(auth(buyer));
    expect(view.body.items[0].sources[0]).toMatchObject({
      standing: 'cleared',
      caseId: c.id,
      openCase: { id: re.body.id, state: 'draft' },
      needsRecheck: true,
    });
    // a new case for the pair is refused while the chain's latest is open
    expect((await open(ids)).status).toBe(409);
  });

  it('a spec change flags decided cases too, and an open case must be evaluated again before it goes on', async () => {
    const ids = await pair();
    const decided = await inReview(ids);
    await act(decided.id, 'reject', { reason: 'not needed' }, reviewer);
    const ids2 = {
      housePartId: ids.housePartId,
      vendorPartId: await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn: `FZ-${n}-B`, package: 'SOD-323' }),
    };
    expect(
      (await t.http.put(`/api/vendor-parts/${ids2.vendorPartId}/rating-card`).set(auth(engineer)).send({ version: 0, fields: passingCard() })).status,
    ).toBe(200);
    const draft = (await open(ids2)).body;

    expect(
      (
        await t.http
          .put(`/api/house-parts/${ids.housePartId}/spec`)
          .set(auth(engineer))
          .send({ baseVersion: 1, spec: { ...passingSpec(), zdMax: 59 }, note: 'Zd limit tightened' })
      ).status,
    ).toBe(200);
    const rejected = (await t.http.get(`/api/qualifications/${decided.id}`).set(auth(engineer))).body;
    expect(rejected).toMatchObject({ needsRecheck: true, recheckReasons: [{ cause: 'spec-changed', detail: 'spec version 2' }] });
    const stale = await act(draft.id, 'submit', {}, engineer);
    expect(stale.status).toBe(409);
    expect(stale.body.message).toMatch(/evaluated on spec version 1 .* now at spec 2 .*Evaluate it again/);
    const evaluated = await act(draft.id, 'evaluate', {}, engineer);
    expect(evaluated.status).toBe(200);
    expect(evaluated.body).toMatchObject({ specVersion: 2, needsRecheck: false, recheckReasons: [] });
    expect(evaluated.body.audit.at(-1)).toMatchObject({ action: 'evaluated', changes: expect.arrayContaining([{ field: 'specVersion', from: 1, to: 2 }]) });
    expect((await act(draft.id, 'submit', {}, engineer)).status).toBe(200);
  });

  it('flags a decided case when its vendor part gets a new datasheet revision', async () => {
    const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');
    const sheet = (name: string) => fixtures.listDatasheetFixtures().find((f) => f.name.startsWith(name))!.pdfPath;
    const ids = await pair();
    const upload = (file: string, revision: string) =>
      t.http
        .post('/api/datasheets')
        .set(auth(engineer))
        .field('vendorPartId', String(ids.vendorPartId))
        .field('revision', revision)
        .attach('file', readFileSync(sheet(file)), `${file}.pdf`);
    expect((await upload('quarryhill', 'A')).status).toBe(201); // the first datasheet is no revision of anything
    const c = await inReview(ids);
    await act(c.id, 'clear', {}, reviewer);
    expect((await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body.needsRecheck).toBe(false);
    const second = await upload('ostrander', 'B');
    expect(second.status).toBe(201);
    const flagged = (await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body;
    expect(flagged.needsRecheck).toBe(true);
    expect(flagged.recheckReasons).toEqual([{ cause: 'datasheet-revised', at: expect.any(String), detail: `datasheet revision B (#${second.body.id}) added` }]);
  });

  it('records every state change and edit in the audit trail: who, when, what changed', async () => {
    const ids = await pair();
    const c = (await open(ids)).body;
    const edited = await t.http
      .patch(`/api/qualifications/${c.id}`)
      .set(auth(engineer))
      .send({ version: c.version, summary: 'second source for the 5.1 V rail' });
    expect(edited.status).toBe(200);
    const stale = await t.http.patch(`/api/qualifications/${c.id}`).set(auth(engineer)).send({ version: c.version, summary: 'late edit' });
    expect(stale.status).toBe(409);
    expect(stale.body.message).toMatch(/changed after you loaded it/);
    await t.http.post(`/api/qualifications/${c.id}/comments`).set(auth(reviewer)).send({ text: 'please add the leakage plot' });
    await act(c.id, 'submit', { reviewerId, note: 'ready' });
    await act(c.id, 'send-back', { reason: 'name the lot the samples came from' }, reviewer);
    await act(c.id, 'evaluate');
    await act(c.id, 'submit', {});
    await act(c.id, 'clear', {}, reviewer);
    const revoked = await act(c.id, 'revoke', { reason: 'vendor announced a fab move' }, third);
    expect(revoked.status).toBe(200);
    expect(revoked.body).toMatchObject({
      state: 'revoked',
      revocation: { by: { name: 'Ines Marwick' }, reason: 'vendor announced a fab move' },
      decision: { state: 'cleared' },
    });

    const audit = revoked.body.audit as Array<{
      action: string;
      by: { name: string } | null;
      at: string;
      fromState: string | null;
      toState: string | null;
      changes: unknown[];
      note: string | null;
    }>;
    expect(audit.map((a) => [a.action, a.by?.name, a.fromState, a.toState])).toEqual([
      ['opened', 'Priya Raman', null, 'draft'],
      ['edited', 'Priya Raman', null, null],
      ['commented', 'Tomas Eklund', null, null],
      ['submitted', 'Priya Raman', 'draft', 'in-review'],
      ['sent-back', 'Tomas Eklund', 'in-review', 'draft'],
      ['evaluated', 'Priya Raman', null, null],
      ['submitted', 'Priya Raman', 'draft', 'in-review'],
      ['cleared', 'Tomas Eklund', 'in-review', 'cleared'],
      ['revoked', 'Ines Marwick', 'cleared', 'revoked'],
    ]);
    expect(audit[1].changes).toEqual([{ field: 'summary', from: '', to: 'second source for the 5.1 V rail' }]);
    expect(audit[4].note).toBe('name the lot the samples came from');
    expect(audit[7].changes).toEqual(
      expect.arrayContaining([
        { field: 'state', from: 'in-review', to: 'cleared' },
        { field: 'specVersion', from: null, to: 1 },
        { field: 'cardVersion', from: null, to: 1 },
      ]),
    );
    for (const a of audit) expect(Number.isNaN(Date.parse(a.at))).toBe(false);
    expect(revoked.body.comments).toEqual([
      { id: expect.any(Number), at: expect.any(String), by: { id: reviewerId, name: 'Tomas Eklund' }, text: 'please add the leakage plot' },
    ]);
    // nothing edits the trail: it is only ever appended to
    expect((await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM qualification_events WHERE qualification_id = ?', [c.id]))[0].n).toBe(9);
  });

  it('lets exactly one of two concurrent decisions win; the other gets 409', async () => {
    for (const [first, second] of [
      ['clear', 'clear'],
      ['clear', 'reject'],
    ] as const) {
      const c = await inReview();
      const results = await Promise.all([
        act(c.id, first, first === 'clear' ? { version: c.version } : { version: c.version, reason: 'race' }, reviewer),
        act(c.id, second, second === 'clear' ? { version: c.version } : { version: c.version, reason: 'race' }, third),
      ]);
      expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
      const loser = results.find((r) => r.status === 409)!;
      // Both saw the same version: the loser finds the case decided, or its version gone (either is the honest 409).
      expect(loser.body.message).toMatch(/decided case cannot be decided again|changed after you loaded it/);
      const winner = results.find((r) => r.status === 200)!;
      const decisions = await t.select<{ action: string; user_id: number }>(
        "SELECT action, user_id FROM qualification_events WHERE qualification_id = ? AND action IN ('cleared', 'rejected')",
        [c.id],
      );
      expect(decisions).toHaveLength(1);
      const [row] = await t.select<{ state: string; decided_by_id: number }>('SELECT state, decided_by_id FROM qualifications WHERE id = ?', [c.id]);
      expect(row.state).toBe(winner.body.state);
      expect(row.decided_by_id).toBe(winner.body.decision.by.id);
    }
  });

  it('a card save racing a decision never deadlocks: the decision lands before the save (then flagged) or sees the new card (409)', async () => {
    for (let round = 0; round < 3; round++) {
      const ids = await pair();
      const c = await inReview(ids);
      const [card, decision] = await Promise.all([
        t.http
          .put(`/api/vendor-parts/${ids.vendorPartId}/rating-card`)
          .set(auth(engineer))
          .send({ version: 1, fields: { ...passingCard(), zzt: { value: 42, printed: '42 Ω', provenance: entered } } }),
        act(c.id, 'clear', { version: c.version }, reviewer),
      ]);
      expect(card.status).toBe(200);
      const after = (await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body;
      if (decision.status === 200) expect(after).toMatchObject({ state: 'cleared', cardVersion: 1, needsRecheck: true });
      else {
        expect(decision.status).toBe(409);
        // The save flags the case (a new case version), so the decision meets the new card or the new version.
        expect(decision.body.message).toMatch(/card 2|changed after you loaded it/);
        expect(after).toMatchObject({ state: 'in-review', needsRecheck: true });
      }
    }
  });

  it('mails the reviewer when a case waits and the house part’s buyers when a source is cleared or revoked', async () => {
    const ids = await pair();
    expect((await t.http.post(`/api/house-parts/${ids.housePartId}/buyers`).set(auth(engineer)).send({ userId: buyerId })).status).toBe(201);
    const before = (await t.capturedMail()).length;
    const mail = t.stack.app.get(MailService);

    const c = await inReview(ids); // names the reviewer
    const review = await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).slice(before).find((m) => m.subject.includes(`case #${c.id}`));
    });
    expect(review.recipients).toEqual(['reviewer@demo.test']);
    expect(review.subject).toBe(`Waiting for your review: Fennick Semiconductor FZ-${n} as a source of HPQ-${n} (case #${c.id})`);

    await act(c.id, 'clear', { note: 'all checks pass' }, reviewer);
    const cleared = await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).find((m) => m.subject === `HPQ-${n}: Fennick Semiconductor FZ-${n} cleared`);
    });
    expect(cleared.recipients).toEqual(['buyer@demo.test']);
    expect(cleared.body).toMatch(/Tomas Eklund cleared Fennick Semiconductor FZ-\d+ as a source of HPQ-\d+/);
    // links are absolute (PUBLIC_URL, else the app's own address)
    expect(cleared.body).toContain(`${t.stack.url}/qualifications/${c.id}`);
    expect(cleared.body).not.toMatch(/(^|\s)\/(qualifications|sources)/m);
    // the engineer who prepared the case hears the decision
    const decided = await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).find((m) => m.subject.startsWith(`Case #${c.id} decided`));
    });
    expect(decided.recipients).toEqual(['engineer@demo.test']);
    expect(decided.subject).toBe(`Case #${c.id} decided: Fennick Semiconductor FZ-${n} for HPQ-${n}: Cleared`);
    expect(decided.body).toMatch(/Note: all checks pass/);
    expect(decided.body).toContain(`${t.stack.url}/qualifications/${c.id}`);

    await act(c.id, 'revoke', { reason: 'lot failed incoming inspection' }, reviewer);
    const revoked = await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).find((m) => m.subject === `HPQ-${n}: Fennick Semiconductor FZ-${n} revoked`);
    });
    expect(revoked.recipients).toEqual(['buyer@demo.test']);
    expect(revoked.body).toMatch(/Reason: lot failed incoming inspection/);

    // without a named reviewer every other engineer is asked; the preparer is not
    const other = await open(await pair());
    await act(other.body.id, 'submit', {});
    const everyone = await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).find((m) => m.subject.includes(`case #${other.body.id}`));
    });
    expect(everyone.recipients.sort()).toEqual(['reviewer@demo.test', 'third.engineer@demo.test']);
    // a house part nobody follows: no buyer mail is queued for its clearance
    await act(other.body.id, 'clear', {}, reviewer);
    expect(await t.select("SELECT id FROM outgoing_mail WHERE kind = 'qualification.cleared' AND subject LIKE ?", [`HPQ-${n}:%`])).toEqual([]);
  });

  it('queues the buyers’ mail while the SMTP server is away and delivers it when it returns; the decision does not wait', async () => {
    const ids = await pair();
    await t.http.post(`/api/house-parts/${ids.housePartId}/buyers`).set(auth(buyer)).send({ userId: buyerId }); // a buyer may follow a part
    const c = await inReview(ids);
    const mail = t.stack.app.get(MailService);
    await eventually(async () => {
      await mail.flush();
      return (await t.select<{ n: number }>("SELECT COUNT(*) AS n FROM outgoing_mail WHERE state = 'pending'"))[0].n === 0;
    });
    await t.stack.stopSmtp();
    try {
      // The decision commits while the mail server is away (no elapsed-time check: the pending mail below shows it did not wait for SMTP).
      const res = await act(c.id, 'clear-with-conditions', { conditions: 'only for new builds from lot 24-17 on' }, reviewer);
      expect(res.status).toBe(200);
      const subject = `HPQ-${n}: Fennick Semiconductor FZ-${n} cleared with conditions`;
      await mail.flush();
      const [queued] = await t.select<{ state: string; kind: string }>('SELECT state, kind FROM outgoing_mail WHERE subject = ?', [subject]);
      expect(queued).toMatchObject({ state: 'pending', kind: 'qualification.cleared-with-conditions' });
      expect((await t.capturedMail()).some((m) => m.subject === subject)).toBe(false);

      await t.stack.startSmtp();
      const delivered = await eventually(async () => {
        await mail.flush();
        return (await t.capturedMail()).find((m) => m.subject === subject);
      });
      expect(delivered.recipients).toEqual(['buyer@demo.test']);
      expect(delivered.body).toMatch(/Conditions: only for new builds from lot 24-17 on/);
      const [sent] = await t.select<{ state: string }>('SELECT state FROM outgoing_mail WHERE subject = ?', [subject]);
      expect(sent.state).toBe('sent');
    } finally {
      await t.stack.startSmtp();
    }
  });

  it('manages the buyers of a house part: engineers link anyone, a buyer only themself', async () => {
    const { housePartId } = await pair();
    const users = t.stack.app.get(UsersRepository);
    const other = await users.create({ email: 'second.buyer@demo.test', name: 'Rafe Linden', role: 'buyer', passwordHash: null });
    expect((await t.http.post(`/api/house-parts/${housePartId}/buyers`).set(auth(buyer)).send({ userId: other.id })).status).toBe(403);
    expect((await t.http.post(`/api/house-parts/${housePartId}/buyers`).set(auth(designer)).send({ userId: buyerId })).status).toBe(403);
    const notBuyer = await t.http.post(`/api/house-parts/${housePartId}/buyers`).set(auth(engineer)).send({ userId: reviewerId });
    expect(notBuyer.status).toBe(422);
    expect(notBuyer.body.errors).toEqual([{ path: 'userId', message: 'must be an active buyer' }]);
    const added = await t.http.post(`/api/house-parts/${housePartId}/buyers`).set(auth(engineer)).send({ userId: other.id });
    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({
      housePartId,
      user: { id: other.id, name: 'Rafe Linden', email: 'second.buyer@demo.test' },
      addedBy: { name: 'Priya Raman' },
    });
    expect((await t.http.post(`/api/house-parts/${housePartId}/buyers`).set(auth(engineer)).send({ userId: other.id })).status).toBe(409);
    expect((await t.http.post(`/api/house-parts/${housePartId}/buyers`).set(auth(buyer)).send({ userId: buyerId })).status).toBe(201);
    const list = await t.http.get(`/api/house-parts/${housePartId}/buyers`).set(auth(buyer));
    expect(list.body.map((b: { user: { email: string } }) => b.user.email)).toEqual(['second.buyer@demo.test', 'buyer@demo.test']);
    const mine = await t.http.get('/api/qualification-views/sources?mine=true').set(auth(buyer));
    expect(mine.body.items.map((i: { housePart: { id: number } }) => i.housePart.id)).toContain(housePartId);
    expect((await t.http.delete(`/api/house-parts/${housePartId}/buyers/${other.id}`).set(auth(buyer))).status).toBe(403);
    expect((await t.http.delete(`/api/house-parts/${housePartId}/buyers/${buyerId}`).set(auth(buyer))).status).toBe(204);
    expect((await t.http.delete(`/api/house-parts/${housePartId}/buyers/${buyerId}`).set(auth(buyer))).status).toBe(404);
  });

  it('makes a source the approved source only by the approval of a second engineer, with its audit entry and mail to the buyers; a revocation ends it', async () => {
    const ids = await pair();
    expect((await t.http.post(`/api/house-parts/${ids.housePartId}/buyers`).set(auth(engineer)).send({ userId: buyerId })).status).toBe(201);
    const c = await inReview(ids);
    // the preparer may not approve their own case; nor may an admin, a designer or a buyer
    const self = await act(c.id, 'approve', {}, engineer);
    expect(self.status).toBe(403);
    expect(self.body.message).toMatch(/two-person rule/);
    for (const token of [admin, designer, buyer]) expect((await act(c.id, 'approve', {}, token)).status).toBe(403);
    const view = async () => (await t.http.get(`/api/qualification-views/sources?housePartId=${ids.housePartId}`).set(auth(buyer))).body.items[0].sources[0];
    expect(await view()).toMatchObject({ role: 'alternate', standing: 'in-review' });
    expect((await t.http.get(`/api/qualifications/${c.id}`).set(auth(reviewer))).body.allowedActions).toEqual(expect.arrayContaining(['approve', 'clear']));
    expect((await t.http.get(`/api/qualifications/${c.id}`).set(auth(engineer))).body.allowedActions).not.toContain('approve');

    const approved = await act(c.id, 'approve', { note: 'reference part of the spec' }, reviewer);
    expect(approved.status).toBe(200);
    expect(approved.body).toMatchObject({
      state: 'approved',
      sourceRole: 'approved',
      decision: { state: 'approved', by: { name: 'Tomas Eklund' }, text: 'reference part of the spec' },
    });
    expect(approved.body.preparedBy.name).toBe('Priya Raman');
    expect(approved.body.audit.at(-1)).toMatchObject({ action: 'approved', by: { name: 'Tomas Eklund' }, fromState: 'in-review', toState: 'approved' });
    expect(await view()).toMatchObject({
      role: 'approved',
      standing: 'approved',
      caseId: c.id,
      decidedBy: { name: 'Tomas Eklund' },
      since: expect.any(String),
    });
    expect((await t.http.get(`/api/house-parts/${ids.housePartId}/sources`).set(auth(buyer))).body[0]).toMatchObject({ role: 'approved' });
    const mail = t.stack.app.get(MailService);
    const told = await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).find((m) => m.subject === `HPQ-${n}: Fennick Semiconductor FZ-${n} approved as the approved source`);
    });
    expect(told.recipients).toEqual(['buyer@demo.test']);
    expect(told.body).toMatch(/Tomas Eklund approved Fennick Semiconductor FZ-\d+ as the approved source of HPQ-\d+/);
    // designers find it, approved
    const found = (await t.http.get(`/api/search?q=FZ-${n}&housePartId=${ids.housePartId}`).set(auth(designer))).body.items;
    expect(found.map((i: { vendorPart: { mpn: string } }) => i.vendorPart.mpn)).toContain(`FZ-${n}`);
    // while it stands, unlinking it is refused: only a decision ends it
    const unlink = await t.http.delete(`/api/house-parts/${ids.housePartId}/sources/${ids.vendorPartId}`).set(auth(engineer));
    expect(unlink.status).toBe(409);
    expect(unlink.body.message).toMatch(/revoke it on that case first/);

    expect((await act(c.id, 'revoke', { reason: 'vendor moved the wafer fab' }, engineer)).status).toBe(200);
    expect(await view()).toMatchObject({ role: 'alternate', standing: 'revoked' });
    const after = (await t.http.get(`/api/search?q=FZ-${n}&housePartId=${ids.housePartId}`).set(auth(designer))).body.items;
    expect(after).toEqual([]);
  });

  it('approves only an evaluation short of a fail, and one short of a pass only with a note', async () => {
    // the card's own window as the spec: margin 0 %, marginal (as in the clearing test above)
    const marginal = await inReview(await pair(demoSpec(), demoCardFields()));
    const bare = await act(marginal.id, 'approve', {}, reviewer);
    expect(bare.status).toBe(422);
    expect(bare.body.errors).toEqual([expect.objectContaining({ path: 'note' })]);
    const noted = await act(marginal.id, 'approve', { note: 'spec drawn tight around this part' }, reviewer);
    expect(noted.status).toBe(200);
    expect(noted.body).toMatchObject({ state: 'approved', overall: 'marginal', decision: { text: 'spec drawn tight around this part' } });

    const failing = await inReview(await pair(passingSpec(), passingCard(), 'SMA'));
    const refused = await act(failing.id, 'approve', { note: 'use anyway' }, reviewer);
    expect(refused.status).toBe(422);
    expect(refused.body.message).toMatch(/fails \(Fails: package\).*cannot be approved/);
  });

  it('answers the Board with sources and latest states, filtered by state, engineer and age', async () => {
    const a = await pair();
    const c = await inReview(a);
    const b = {
      housePartId: a.housePartId,
      vendorPartId: await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn: `FZ-${n}-N`, package: 'SOD-123' }),
    };
    await t.http.post(`/api/house-parts/${b.housePartId}/sources`).set(auth(engineer)).send({ vendorPartId: b.vendorPartId });
    const q = encodeURIComponent(`HPQ-${n}`);

    const all = await t.http.get(`/api/qualification-views/board?q=${q}`).set(auth(engineer));
    expect(all.status).toBe(200);
    expect(all.body.items).toHaveLength(1);
    expect(all.body.items[0].housePart).toMatchObject({ id: a.housePartId, specVersion: 1 });
    // a link is a candidate: no role but alternate before a decision
    expect(all.body.items[0].sources.map((s: { role: string; state: string }) => [s.role, s.state])).toEqual([
      ['alternate', 'in-review'],
      ['alternate', 'none'],
    ]);
    expect(all.body.items[0].sources[0].latestCase).toMatchObject({ id: c.id, state: 'in-review', preparedBy: { name: 'Priya Raman' }, ageDays: 0 });
    expect(all.body.counts).toMatchObject({ none: 1, 'in-review': 1, cleared: 0 });

    const none = await t.http.get(`/api/qualification-views/board?q=${q}&state=none`).set(auth(engineer));
    expect(none.body.items[0].sources.map((s: { state: string }) => s.state)).toEqual(['none']);
    // The tallies ignore the state filter (the web needs no second request for them) but keep the others.
    expect(none.body.counts).toMatchObject({ none: 1, 'in-review': 1 });
    expect((await t.http.get(`/api/qualification-views/board?q=${q}&state=none&engineerId=${reviewerId}`).set(auth(engineer))).body.counts).toMatchObject({
      none: 0,
      'in-review': 0,
    });
    // The engineer filter's choices: every engineer, whether or not on this page.
    const names = (all.body.engineers as { id: number; name: string }[]).map((e) => e.name);
    expect(names).toEqual(expect.arrayContaining(['Priya Raman']));
    expect(all.body.engineers).toEqual(expect.arrayContaining([expect.objectContaining({ id: reviewerId })]));
    expect([...names].sort((x, y) => x.localeCompare(y))).toEqual(names);
    const byOther = await t.http.get(`/api/qualification-views/board?q=${q}&engineerId=${reviewerId}`).set(auth(engineer));
    expect(byOther.body.items).toEqual([]);
    expect((await t.http.get(`/api/qualification-views/board?q=${q}&minAgeDays=7`).set(auth(engineer))).body.items).toEqual([]);
    await t.exec('UPDATE qualifications SET updated_at = DATE_SUB(NOW(), INTERVAL 10 DAY) WHERE id = ?', [c.id]);
    const old = await t.http.get(`/api/qualification-views/board?q=${q}&minAgeDays=7`).set(auth(admin));
    expect(old.body.items[0].sources).toHaveLength(1);
    expect(old.body.items[0].sources[0].latestCase.ageDays).toBeGreaterThanOrEqual(9);
    const bad = await t.http.get('/api/qualification-views/board?state=granted').set(auth(engineer));
    expect(bad.status).toBe(400);
    expect(bad.body.message).toMatch(/unknown state in "granted"/);
  });

  it('publishes its routes and schemas at /api/docs', async () => {
    const docs = (await t.http.get('/api/docs-json')).body;
    expect(Object.keys(docs.components.schemas)).toEqual(
      expect.arrayContaining(['QualificationDto', 'BoardPageDto', 'ComparePayloadDto', 'SourcesViewDto', 'ClearWithConditionsDto']),
    );
    for (const path of [
      '/api/qualifications',
      '/api/qualifications/{id}',
      '/api/qualifications/{id}/clear',
      '/api/qualification-views/board',
      '/api/qualification-views/sources.csv',
      '/api/house-parts/{id}/buyers',
    ]) {
      expect([path, docs.paths[path] !== undefined]).toEqual([path, true]);
    }
    expect(docs.components.schemas.ClearWithConditionsDto.required).toEqual(['version', 'conditions']);
  });

  it('answers Compare with each source evaluated now, its curves at 25 °C and the envelope’s ambients, and the spec window', async () => {
    const a = await pair();
    await open(a);
    const res = await t.http.get(`/api/qualification-views/compare/${a.housePartId}`).set(auth(designer));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ specVersion: 1, temperaturesC: [-40, 25, 85], specWindow: { current: 0.005, min: 4.6, max: 5.6 }, outputWindow: null });
    const [source] = res.body.sources;
    expect(source).toMatchObject({ role: 'alternate', cardVersion: 1, latestCase: { state: 'draft', overall: 'pass' }, reason: null });
    expect(source.curves.map((c: { tempC: number }) => c.tempC)).toEqual([-40, 25, 85]);
    expect(source.curves[0].points).toHaveLength(res.body.currents.length);
    expect(source.evaluation.window.vMax).toBeGreaterThan(source.evaluation.window.vMin);
    // 25 °C curve at the test current: self-heating Tj = Ta + RthJA·V·I (250 K/W · 5.1 V · 5 mA ≈ 6.4 K; common practice, no source)
    const p = source.curves[1].points.find((x: { current: number }) => x.current === 0.005);
    expect(p.tjC).toBeCloseTo(25 + 250 * p.vzNom * 0.005, 6);
    // Its own derated dissipation limit at the hottest ambient: 500 mW derated linearly from 25 °C to zero at
    // TJ max 150 °C gives 0.5 × (150 − 85)/(150 − 25) = 0.26 W (hand calculation; common practice, no source),
    // and the dissipation check measures against the same share of it.
    expect(source.powerLimit).toMatchObject({ ambientC: 85, reason: expect.any(String) });
    expect(source.powerLimit.derated).toBeCloseTo(0.26, 9);
    const dissipation = source.evaluation.checks.find((c: { id: string }) => c.id === 'power-dissipation');
    expect(source.powerLimit.allowed).toBeCloseTo(dissipation.limit, 12);
    expect(source.powerLimit.allowed).toBeCloseTo(0.26 * source.powerLimit.policyFraction, 12);
    expect((await t.http.get('/api/qualification-views/compare/999999').set(auth(engineer))).status).toBe(404);
  });
});
