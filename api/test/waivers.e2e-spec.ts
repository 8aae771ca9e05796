import { hashPassword } from '../src/auth/passwords';
import { Clock } from '../src/common/clock';
import { WaiversService } from '../src/qualifications/waivers.service';
import { UsersRepository } from '../src/users/users.repository';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, type TestApp } from './helpers/test-app';

/**
 * Waivers against the real MariaDB: the two-person rule, clearing with waiver only when
 * every failing check is covered, the standing on Sources and search, and the lapse at
 * expiry under a controlled clock (run twice, as two replicas would).
 * The card's Zd at izt is its zzt, 40 Ω, and its leakage 1 µA at 2 V (demo card); a spec
 * of Zd ≤ 30 Ω and Ir ≤ 0.5 µA makes both checks fail (plain comparison).
 */
describe('waivers (real MariaDB)', () => {
  let t: TestApp;
  let engineer: string; // Priya Raman, prepares the case and the waivers
  let reviewer: string; // Tomas Eklund, a second engineer
  let third: string;
  let designer: string;
  let buyer: string;
  let admin: string;
  let buyerId: number;
  let clock: Clock;
  let n = 0;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const entered = { source: 'entered' as const };
  const card = () =>
    demoCardFields({ vzMin: { value: 4.9, printed: '4.9 V', provenance: entered }, vzMax: { value: 5.3, printed: '5.3 V', provenance: entered } });
  const failingSpec = () => demoSpec({ vz: { min: 4.6, nom: 5.1, max: 5.6 }, zdMax: 30, leakage: { irMax: 0.5e-6, vr: 2 } });
  const day = (d: string) => new Date(`${d}T12:00:00Z`);

  async function failingCaseInReview() {
    n++;
    const housePartId = await createHousePart(t.http, engineer, `HPW-${n}`, `Waived regulator ${n}`);
    expect((await t.http.put(`/api/house-parts/${housePartId}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: failingSpec() })).status).toBe(200);
    const vendorPartId = await createVendorPart(t.http, engineer, { manufacturer: 'Orrin Devices', mpn: `OW-${n}`, package: 'SOD-123' });
    expect((await t.http.put(`/api/vendor-parts/${vendorPartId}/rating-card`).set(auth(engineer)).send({ version: 0, fields: card() })).status).toBe(200);
    const opened = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId, vendorPartId });
    expect(opened.status).toBe(201);
    const failing = opened.body.evaluation.checks.filter((c: { verdict: string }) => c.verdict === 'fail').map((c: { id: string }) => c.id);
    expect(failing.sort()).toEqual(['leakage', 'zd']);
    const submitted = await t.http.post(`/api/qualifications/${opened.body.id}/submit`).set(auth(engineer)).send({ version: opened.body.version });
    expect(submitted.status).toBe(200);
    return { id: opened.body.id as number, housePartId, vendorPartId };
  }
  const caseNow = async (id: number) => (await t.http.get(`/api/qualifications/${id}`).set(auth(engineer))).body;
  const act = async (id: number, action: string, body: object, token: string) =>
    t.http
      .post(`/api/qualifications/${id}/${action}`)
      .set(auth(token))
      .send({ version: (await caseNow(id)).version, ...body });
  const prepare = (id: number, body: object, token = engineer) => t.http.post(`/api/qualifications/${id}/waivers`).set(auth(token)).send(body);
  const zdWaiver = { checkId: 'zd', acceptedLimit: 45, reason: 'the regulator tolerates 45 Ω; bench data on three lots', expiresOn: '2027-06-30' };
  const leakageWaiver = { checkId: 'leakage', acceptedLimit: 1.5e-6, reason: 'the divider draws 1 mA; 1.5 µA is negligible', expiresOn: '2027-03-31' };

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
    clock = t.stack.app.get(Clock);
    jest.spyOn(clock, 'now').mockReturnValue(day('2027-01-15'));
  });
  afterAll(async () => {
    jest.restoreAllMocks();
    await t.close();
  });

  it('takes a waiver only of a failing or marginal check, with a limit that covers the value and an expiry after today', async () => {
    const c = await failingCaseInReview();
    const passing = await prepare(c.id, { ...zdWaiver, checkId: 'tc', acceptedLimit: 5e-3 });
    expect(passing.status).toBe(422);
    expect(passing.body.message).toMatch(/not failing or marginal/);
    // 40 Ω found: a 35 Ω limit does not cover it
    const short = await prepare(c.id, { ...zdWaiver, acceptedLimit: 35 });
    expect(short.status).toBe(422);
    expect(short.body.errors[0].path).toBe('acceptedLimit');
    const past = await prepare(c.id, { ...zdWaiver, expiresOn: '2027-01-15' });
    expect(past.status).toBe(422);
    expect(past.body.message).toMatch(/expire after today \(2027-01-15\)/);
    const badDate = await prepare(c.id, { ...zdWaiver, expiresOn: '2027-02-30' });
    expect(badDate.status).toBe(400);
    expect((await prepare(c.id, zdWaiver, designer)).status).toBe(403);
    const ok = await prepare(c.id, zdWaiver);
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({
      checkId: 'zd',
      quantity: 'resistance',
      limitKind: 'max',
      specLimit: 30,
      acceptedLimit: 45,
      value: 40,
      state: 'proposed',
      expiresOn: '2027-06-30',
      preparedBy: { name: 'Priya Raman' },
    });
    const twice = await prepare(c.id, zdWaiver);
    expect(twice.status).toBe(409);
  });

  it('keeps the two-person rule: the preparer cannot approve or refuse their own waiver; another engineer can', async () => {
    const c = await failingCaseInReview();
    const w = (await prepare(c.id, zdWaiver)).body;
    const own = await t.http.post(`/api/qualifications/${c.id}/waivers/${w.id}/approve`).set(auth(engineer)).send({});
    expect(own.status).toBe(403);
    expect(own.body.message).toMatch(/You prepared waiver #\d+; another engineer must approve or refuse it \(two-person rule\)/);
    const ownRefuse = await t.http.post(`/api/qualifications/${c.id}/waivers/${w.id}/refuse`).set(auth(engineer)).send({ reason: 'no' });
    expect(ownRefuse.status).toBe(403);
    const approved = await t.http.post(`/api/qualifications/${c.id}/waivers/${w.id}/approve`).set(auth(reviewer)).send({ note: 'bench data seen' });
    expect(approved.status).toBe(200);
    expect(approved.body).toMatchObject({ state: 'approved', decidedBy: { name: 'Tomas Eklund' }, decisionNote: 'bench data seen' });
    const again = await t.http.post(`/api/qualifications/${c.id}/waivers/${w.id}/refuse`).set(auth(third)).send({ reason: 'late' });
    expect(again.status).toBe(409);
    const listed = await t.http.get(`/api/qualifications/${c.id}/waivers`).set(auth(admin));
    expect(listed.status).toBe(200);
    expect(listed.body.items.map((x: { id: number; state: string }) => [x.id, x.state])).toEqual([[w.id, 'approved']]);
    expect((await t.http.get(`/api/qualifications/${c.id}/waivers`).set(auth(designer))).status).toBe(403);
    const audit = (await caseNow(c.id)).audit.map((e: { action: string }) => e.action);
    expect(audit).toEqual(expect.arrayContaining(['waiver-prepared', 'waiver-approved']));
  });

  it('clears with waiver only when every failing check is waived; the standing shows on Sources and search; at expiry it lapses once', async () => {
    const c = await failingCaseInReview();
    expect((await t.http.post(`/api/house-parts/${c.housePartId}/buyers`).set(auth(engineer)).send({ userId: buyerId })).status).toBe(201);
    const zd = (await prepare(c.id, zdWaiver)).body;
    expect((await t.http.post(`/api/qualifications/${c.id}/waivers/${zd.id}/approve`).set(auth(reviewer)).send({})).status).toBe(200);
    // leakage still fails and is not waived
    const early = await act(c.id, 'clear-with-waiver', {}, reviewer);
    expect(early.status).toBe(422);
    expect(early.body.message).toMatch(/"Reverse leakage" is not a pass and not covered by an approved, unexpired waiver/);
    expect((await caseNow(c.id)).allowedActions).not.toContain('clear-with-waiver');
    // a refused waiver covers nothing
    const refused = (await prepare(c.id, leakageWaiver)).body;
    expect((await t.http.post(`/api/qualifications/${c.id}/waivers/${refused.id}/refuse`).set(auth(reviewer)).send({ reason: 'no bench data' })).status).toBe(
      200,
    );
    expect((await act(c.id, 'clear-with-waiver', {}, reviewer)).status).toBe(422);
    const leak = (await prepare(c.id, leakageWaiver)).body;
    expect((await t.http.post(`/api/qualifications/${c.id}/waivers/${leak.id}/approve`).set(auth(third)).send({})).status).toBe(200);
    // the preparer of the case still may not decide it
    expect((await act(c.id, 'clear-with-waiver', {}, engineer)).status).toBe(403);
    const reviewerView = await t.http.get(`/api/qualifications/${c.id}`).set(auth(reviewer));
    expect(reviewerView.body.allowedActions).toContain('clear-with-waiver');
    const cleared = await act(c.id, 'clear-with-waiver', { note: 'both gaps waived' }, reviewer);
    expect(cleared.status).toBe(200);
    expect(cleared.body).toMatchObject({ state: 'cleared-with-waiver', decision: { state: 'cleared-with-waiver', by: { name: 'Tomas Eklund' } } });
    // waivers cannot be added once decided
    expect((await prepare(c.id, { ...zdWaiver, checkId: 'leakage' })).status).toBe(409);

    // Sources (a buyer) and search (a designer) show the standing with the waivers and their expiry
    const sources = await t.http.get(`/api/qualification-views/sources?housePartId=${c.housePartId}`).set(auth(buyer));
    expect(sources.status).toBe(200);
    const row = sources.body.items[0].sources.find((s: { vendorPart: { id: number } }) => s.vendorPart.id === c.vendorPartId);
    expect(row.standing).toBe('cleared-with-waiver');
    expect(row.waivers.map((w: { checkId: string; expiresOn: string; state: string }) => [w.checkId, w.expiresOn, w.state])).toEqual([
      ['zd', '2027-06-30', 'approved'],
      ['leakage', '2027-03-31', 'approved'],
    ]);
    const found = await t.http.get(`/api/search?housePartId=${c.housePartId}`).set(auth(designer));
    expect(found.status).toBe(200);
    const clearance = found.body.items.find((i: { vendorPart: { id: number } }) => i.vendorPart.id === c.vendorPartId).clearances[0];
    expect(clearance).toMatchObject({ standing: 'cleared-with-waiver', caseId: c.id });
    expect(clearance.waivers.map((w: { checkId: string; acceptedLimit: number }) => [w.checkId, w.acceptedLimit])).toEqual([
      ['zd', 45],
      ['leakage', 1.5e-6],
    ]);

    // the last day of the leakage waiver: still in force
    const waivers = t.stack.app.get(WaiversService);
    jest.spyOn(clock, 'now').mockReturnValue(day('2027-03-31'));
    expect(await waivers.lapseDue()).toBe(0);
    expect((await caseNow(c.id)).state).toBe('cleared-with-waiver');

    // the day after: the leakage waiver lapses, the standing with it; run twice (two replicas, or the interval and a read)
    jest.spyOn(clock, 'now').mockReturnValue(day('2027-04-01'));
    const outboxBefore = await t.select<{ n: number }>(`SELECT COUNT(*) AS n FROM outgoing_mail WHERE kind = 'qualification.waiver-lapsed'`);
    const [first, second] = await Promise.all([waivers.lapseDue(), waivers.lapseDue()]);
    expect(first + second).toBe(1);
    expect(await waivers.lapseDue()).toBe(0);
    const lapsed = await caseNow(c.id);
    expect(lapsed.state).toBe('waiver-lapsed');
    expect(lapsed.needsRecheck).toBe(true);
    expect(lapsed.recheckReasons.map((r: { cause: string }) => r.cause)).toEqual(['waiver-expired']);
    expect(lapsed.audit.filter((e: { action: string }) => e.action === 'waiver-lapsed')).toHaveLength(1);
    expect(lapsed.allowedActions).toContain('recheck');
    const mails = await t.select<{ recipients: string | string[]; subject: string; body: string }>(
      `SELECT recipients, subject, body FROM outgoing_mail WHERE kind = 'qualification.waiver-lapsed' ORDER BY id`,
    );
    expect(mails.length - Number(outboxBefore[0].n)).toBe(1);
    const mail = mails.at(-1)!;
    const to = typeof mail.recipients === 'string' ? JSON.parse(mail.recipients) : mail.recipients;
    expect([...to].sort()).toEqual(['buyer@demo.test', 'engineer@demo.test']);
    expect(mail.subject).toBe(`HPW-${n}: Orrin Devices OW-${n} no longer usable, a waiver expired (case #${c.id})`);
    expect(mail.body).toMatch(/Reverse leakage waiver #\d+ expired on 2027-03-31/);
    expect(mail.body).toMatch(new RegExp(`https?://[^\\s]+/qualifications/${c.id}`));

    // no longer usable: Sources shows the lapse, search no longer lists it for designers
    const after = await t.http.get(`/api/qualification-views/sources?housePartId=${c.housePartId}`).set(auth(buyer));
    expect(after.body.items[0].sources.find((s: { vendorPart: { id: number } }) => s.vendorPart.id === c.vendorPartId).standing).toBe('waiver-lapsed');
    const designerSources = await t.http.get(`/api/qualification-views/sources?housePartId=${c.housePartId}`).set(auth(designer));
    expect(designerSources.body.items[0].sources.find((s: { vendorPart: { id: number } }) => s.vendorPart.id === c.vendorPartId)).toBeUndefined();
    const foundAfter = await t.http.get(`/api/search?housePartId=${c.housePartId}`).set(auth(designer));
    expect(foundAfter.body.items.find((i: { vendorPart: { id: number } }) => i.vendorPart.id === c.vendorPartId)).toBeUndefined();

    // the zd waiver lapses later without a second state change or a buyers' mail
    jest.spyOn(clock, 'now').mockReturnValue(day('2027-07-01'));
    expect(await waivers.lapseDue()).toBeGreaterThanOrEqual(1); // the earlier tests' approved waivers lapse with it
    expect((await t.http.get(`/api/qualifications/${c.id}/waivers`).set(auth(engineer))).body.items.map((w: { state: string }) => w.state)).toEqual([
      'lapsed',
      'refused',
      'lapsed',
    ]);
    const later = await caseNow(c.id);
    expect(later.state).toBe('waiver-lapsed');
    expect(later.recheckReasons).toHaveLength(1);
    const lastMail = (
      await t.select<{ recipients: string | string[] }>(
        `SELECT recipients FROM outgoing_mail WHERE kind = 'qualification.waiver-lapsed' AND subject LIKE ? ORDER BY id DESC LIMIT 1`,
        [`%waiver expired (case #${c.id})`],
      )
    )[0];
    expect(typeof lastMail.recipients === 'string' ? JSON.parse(lastMail.recipients) : lastMail.recipients).toEqual(['engineer@demo.test']);
    jest.spyOn(clock, 'now').mockReturnValue(day('2027-01-15'));
  });
});
