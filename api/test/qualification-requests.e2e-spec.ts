import { hashPassword } from '../src/auth/passwords';
import { MailService } from '../src/mail/mail.service';
import { UsersRepository } from '../src/users/users.repository';
import { createHousePart, createVendorPart, demoCardFields, demoSpec } from './helpers/catalogue-fixtures';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

/**
 * Requests for a qualification against the real MariaDB and the SMTP fake: a designer asks,
 * engineers take the request up with a case (from the request or by any other way) or
 * decline it with a reply; each step mails the right people.
 */
describe('qualification requests (real MariaDB, SMTP fake)', () => {
  let t: TestApp;
  let engineer: string; // Priya Raman
  let reviewer: string; // Tomas Eklund
  let designer: string; // Lena Okafor
  let second: string; // another designer
  let buyer: string;
  let admin: string;
  let reviewerId: number;
  let n = 0;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const entered = { source: 'entered' as const };
  const passingSpec = () => demoSpec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } });
  const passingCard = () =>
    demoCardFields({ vzMin: { value: 4.9, printed: '4.9 V', provenance: entered }, vzMax: { value: 5.3, printed: '5.3 V', provenance: entered } });

  async function housePart(): Promise<number> {
    n++;
    // In use: designers are not offered draft house parts.
    const id = await createHousePart(t.http, engineer, `HPR-${n}`, `Regulator diode for request ${n}`, 'active');
    expect((await t.http.put(`/api/house-parts/${id}/spec`).set(auth(engineer)).send({ baseVersion: 0, spec: passingSpec() })).status).toBe(200);
    return id;
  }
  async function vendorPart(): Promise<number> {
    n++;
    const id = await createVendorPart(t.http, engineer, { manufacturer: 'Fennick Semiconductor', mpn: `FR-${n}`, package: 'SOD-123' });
    expect((await t.http.put(`/api/vendor-parts/${id}/rating-card`).set(auth(engineer)).send({ version: 0, fields: passingCard() })).status).toBe(200);
    return id;
  }
  const ask = (body: object, token = designer) => t.http.post('/api/qualification-requests').set(auth(token)).send(body);
  const list = (query: string, token: string) => t.http.get(`/api/qualification-requests${query}`).set(auth(token));
  const ids = (res: { body: { items: Array<{ id: number }> } }) => res.body.items.map((r) => r.id);
  const mail = () => t.stack.app.get(MailService);
  /** The captured message whose subject matches, once the outbox has sent it. */
  const mailed = (subject: string | RegExp) =>
    eventually(async () => {
      await mail().flush();
      return (await t.capturedMail()).find((m) => (typeof subject === 'string' ? m.subject === subject : subject.test(m.subject)));
    });

  beforeAll(async () => {
    t = await createTestApp();
    const users = t.stack.app.get(UsersRepository);
    await users.create({
      email: 'second.designer@demo.test',
      name: 'Ravi Ostrand',
      role: 'designer',
      passwordHash: await hashPassword(t.stack.env.DEMO_PASSWORD),
    });
    [engineer, reviewer, designer, second, buyer, admin] = await Promise.all([
      t.tokenFor('engineer@demo.test'),
      t.tokenFor('reviewer@demo.test'),
      t.tokenFor('designer@demo.test'),
      t.tokenFor('second.designer@demo.test'),
      t.tokenFor('buyer'),
      t.tokenFor('admin'),
    ]);
    reviewerId = (await users.findByEmail('reviewer@demo.test'))!.id;
  });
  afterAll(() => t.close());

  it('records a request with its note and tells every engineer, not the designer', async () => {
    const vp = await vendorPart();
    const res = await ask({
      vendorPartId: vp,
      note: 'Clamp on the new sensor board, rev B; the approved part is on allocation. Needed for the pilot run.',
      neededBy: '2099-03-31',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      vendorPart: { id: vp, manufacturer: 'Fennick Semiconductor', mpn: expect.stringMatching(/^FR-\d+$/), package: 'SOD-123' },
      housePart: null,
      note: 'Clamp on the new sensor board, rev B; the approved part is on allocation. Needed for the pilot run.',
      neededBy: '2099-03-31',
      state: 'open',
      requestedBy: { name: 'Lena Okafor' },
      closedBy: null,
      reply: null,
      case: null,
    });
    const message = await mailed(`Qualification asked for: Fennick Semiconductor ${res.body.vendorPart.mpn} (request #${res.body.id})`);
    expect(message.recipients.sort()).toEqual(['engineer@demo.test', 'reviewer@demo.test']);
    expect(message.body).toContain('Lena Okafor asks for Fennick Semiconductor FR-');
    expect(message.body).toContain('no house part named: choose one when you open the case');
    expect(message.body).toContain('Needed by: 2099-03-31');
    expect(message.body).toContain('Clamp on the new sensor board, rev B');
    expect(message.body).toContain('/board');
  });

  it('refuses bad input with 400 naming the field, and unknown parts with 404', async () => {
    const bad = await ask({ vendorPartId: 'FR-1', note: '   ' });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toEqual(['vendorPartId', 'note']);
    expect(bad.body.errors[1].message).toBe('Say what it is for: the design, why this part, by when');
    const vp = await vendorPart();
    const date = await ask({ vendorPartId: vp, note: 'x', neededBy: '2027-02-30' });
    expect(date.status).toBe(400);
    expect(date.body.errors).toEqual([{ path: 'neededBy', message: 'not a calendar date' }]);
    const past = await ask({ vendorPartId: vp, note: 'x', neededBy: '2020-01-15' });
    expect(past.status).toBe(400);
    expect(past.body).toMatchObject({
      message: expect.stringMatching(/neededBy \(2020-01-15\) is in the past/),
      errors: [{ path: 'neededBy', message: 'in the past' }],
    });
    const extra = await ask({ vendorPartId: vp, note: 'x', housePart: 'HPR-1' });
    expect(extra.status).toBe(400);
    expect(extra.body.message).toMatch(/housePart/);
    const missing = await ask({ vendorPartId: 999999, note: 'x' });
    expect(missing.status).toBe(404);
    expect(missing.body).toMatchObject({ message: 'No vendor part with id 999999', errors: [{ path: 'vendorPartId' }] });
    const noHouse = await ask({ vendorPartId: vp, housePartId: 999999, note: 'x' });
    expect(noHouse.status).toBe(404);
    expect(noHouse.body.errors).toEqual([{ path: 'housePartId', message: 'no such house part' }]);
    // nothing was recorded by the refused requests
    expect((await list(`?status=all&vendorPartId=${vp}`, engineer)).body.total).toBe(0);
  });

  it('offers designers no draft house part: the picker lists none and a request naming one is refused (422)', async () => {
    const vp = await vendorPart();
    const draft = await createHousePart(t.http, engineer, `HPR-DRAFT-${++n}`, 'Still being specified');
    const active = await housePart();
    const picker = (token: string) => t.http.get('/api/house-parts?q=HPR&pageSize=100').set(auth(token));
    const offered = (await picker(designer)).body.items.map((h: { id: number }) => h.id);
    expect(offered).toContain(active);
    expect(offered).not.toContain(draft);
    expect((await picker(engineer)).body.items.map((h: { id: number }) => h.id)).toContain(draft);
    // Asking for the draft by status gives a designer nothing either.
    expect((await t.http.get('/api/house-parts?status=draft&pageSize=100').set(auth(designer))).body.total).toBe(0);

    const res = await ask({ vendorPartId: vp, housePartId: draft, note: 'For the sensor board' });
    expect(res.status).toBe(422);
    expect(res.body.message).toMatch(/^House part HPR-DRAFT-\d+ is a draft still being specified/);
    expect(res.body.errors).toEqual([{ path: 'housePartId', message: 'a draft house part' }]);
    expect((await list('?vendorPartId=' + vp, engineer)).body.total).toBe(0);
    expect((await ask({ vendorPartId: vp, housePartId: active, note: 'For the sensor board' })).status).toBe(201);
  });

  it('refuses a duplicate open request of the same person for the same part and house part (409); others may ask too', async () => {
    const vp = await vendorPart();
    const hp = await housePart();
    const first = await ask({ vendorPartId: vp, housePartId: hp, note: 'Loop driver reference, new product line' });
    expect(first.status).toBe(201);
    const again = await ask({ vendorPartId: vp, housePartId: hp, note: 'asking again' });
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(
      new RegExp(
        `^You already asked for Fennick Semiconductor FR-\\d+ for HPR-\\d+ in request #${first.body.id} on \\d{4}-\\d{2}-\\d{2}; it is waiting for an engineer$`,
      ),
    );
    // the same part without a house part, or by someone else, is another request
    expect((await ask({ vendorPartId: vp, note: 'any house part will do' })).status).toBe(201);
    expect((await ask({ vendorPartId: vp, note: 'any house part will do' })).status).toBe(409);
    expect((await ask({ vendorPartId: vp, housePartId: hp, note: 'my board needs it too' }, second)).status).toBe(201);
    // three at the same moment, a few times over: the open-request index lets one through, the others are 409 (never a 500)
    for (let race = 0; race < 3; race++) {
      const vp2 = await vendorPart();
      const all = await Promise.all([1, 2, 3].map((k) => ask({ vendorPartId: vp2, note: `race ${race}.${k}` })));
      expect(all.map((r) => r.status).sort()).toEqual([201, 409, 409]);
      expect((await list(`?vendorPartId=${vp2}`, engineer)).body.total).toBe(1);
    }
  });

  it('refuses a request for a house part the part is already cleared for or being qualified for', async () => {
    const vp = await vendorPart();
    const hp = await housePart();
    const opened = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId: hp, vendorPartId: vp });
    expect(opened.status).toBe(201);
    const underWay = await ask({ vendorPartId: vp, housePartId: hp, note: 'x' });
    expect(underWay.status).toBe(409);
    expect(underWay.body.message).toBe(
      `A qualification of Fennick Semiconductor ${opened.body.vendorPart.mpn} for ${opened.body.housePart.partNumber} is already under way (case #${opened.body.id}); Find parts shows it once it is cleared`,
    );
    const submitted = await t.http.post(`/api/qualifications/${opened.body.id}/submit`).set(auth(engineer)).send({ version: opened.body.version, reviewerId });
    expect(submitted.status).toBe(200);
    expect((await t.http.post(`/api/qualifications/${opened.body.id}/clear`).set(auth(reviewer)).send({ version: submitted.body.version })).status).toBe(200);
    const cleared = await ask({ vendorPartId: vp, housePartId: hp, note: 'x' });
    expect(cleared.status).toBe(409);
    expect(cleared.body.message).toMatch(/is already cleared for HPR-\d+ \(case #\d+\): you may design it in/);
    // cleared for one house part, wanted for another: that is a request
    expect((await ask({ vendorPartId: vp, housePartId: await housePart(), note: 'needed on the motor board too' })).status).toBe(201);
  });

  it('lists requests per role: engineers and admins the queue, designers only their own; buyers are refused', async () => {
    const vp = await vendorPart();
    const mine = await ask({ vendorPartId: vp, note: 'mine' });
    const theirs = await ask({ vendorPartId: vp, note: 'theirs' }, second);
    expect([mine.status, theirs.status]).toEqual([201, 201]);

    for (const token of [engineer, admin]) {
      const open = await list('?pageSize=200', token);
      expect(open.status).toBe(200);
      expect(ids(open)).toEqual(expect.arrayContaining([mine.body.id, theirs.body.id]));
      expect(open.body.items.every((r: { state: string }) => r.state === 'open')).toBe(true);
    }
    // open ones oldest first
    const queue = ids(await list('?pageSize=200', engineer));
    expect(queue.indexOf(mine.body.id)).toBeLessThan(queue.indexOf(theirs.body.id));

    const own = await list('?status=all&pageSize=200', designer);
    expect(own.status).toBe(200);
    expect(ids(own)).toContain(mine.body.id);
    expect(ids(own)).not.toContain(theirs.body.id);
    expect(own.body.items.every((r: { requestedBy: { name: string } }) => r.requestedBy.name === 'Lena Okafor')).toBe(true);
    const other = await t.http.get(`/api/qualification-requests/${theirs.body.id}`).set(auth(designer));
    expect(other.status).toBe(403);
    expect(other.body.message).toBe(`Request #${theirs.body.id} is Ravi Ostrand's; designers see their own requests only`);
    expect((await t.http.get(`/api/qualification-requests/${mine.body.id}`).set(auth(designer))).body.note).toBe('mine');
    // an engineer's own requests
    const engineers = await ask({ vendorPartId: vp, note: 'for the reviewer to pick up' }, engineer);
    expect(engineers.status).toBe(201);
    expect(ids(await list('?mine=true&pageSize=200', engineer))).toEqual([engineers.body.id]);
    expect((await list('?status=closed', engineer)).body.errors[0].path).toBe('status');

    expect((await list('', buyer)).status).toBe(403);
    expect((await ask({ vendorPartId: vp, note: 'buyers do not ask' }, buyer)).status).toBe(403);
    expect((await t.http.get(`/api/qualification-requests/${mine.body.id}`).set(auth(buyer))).status).toBe(403);
    expect((await ask({ vendorPartId: vp, note: 'admins do not ask' }, admin)).status).toBe(403);
    expect((await t.http.get('/api/qualification-requests').set(auth('not-a-token'))).status).toBe(401);
  });

  it('an engineer opens a case from a request: the request is taken up, points at the case, and the requester is mailed the link', async () => {
    const vp = await vendorPart();
    const hp = await housePart();
    const req = await ask({ vendorPartId: vp, housePartId: hp, note: 'Reference for the 4-20 mA loop driver on the new transmitter', neededBy: '2099-06-30' });
    const alsoAsked = await ask({ vendorPartId: vp, housePartId: hp, note: 'same board, second channel' }, second);
    const elsewhere = await ask({ vendorPartId: vp, housePartId: await housePart(), note: 'wanted for another house part' }, second);

    // designers and buyers cannot take a request up or decline it
    expect((await t.http.post(`/api/qualification-requests/${req.body.id}/open-case`).set(auth(designer)).send({})).status).toBe(403);
    expect((await t.http.post(`/api/qualification-requests/${req.body.id}/decline`).set(auth(buyer)).send({ reply: 'x' })).status).toBe(403);
    // the request names its house part: another one is refused, naming the field
    const wrong = await t.http
      .post(`/api/qualification-requests/${req.body.id}/open-case`)
      .set(auth(engineer))
      .send({ housePartId: elsewhere.body.housePart.id });
    expect(wrong.status).toBe(400);
    expect(wrong.body.errors).toEqual([{ path: 'housePartId', message: 'differs from the house part the request names' }]);

    const opened = await t.http.post(`/api/qualification-requests/${req.body.id}/open-case`).set(auth(engineer)).send({});
    expect(opened.status).toBe(201);
    expect(opened.body).toMatchObject({
      id: req.body.id,
      state: 'taken-up',
      closedBy: { name: 'Priya Raman' },
      case: { revision: 1, state: 'draft', housePart: { id: hp } },
    });
    const caseId = opened.body.case.id as number;
    // the case was opened by the qualification service itself: evaluated, with the request quoted
    const theCase = (await t.http.get(`/api/qualifications/${caseId}`).set(auth(engineer))).body;
    expect(theCase).toMatchObject({
      state: 'draft',
      housePart: { id: hp },
      vendorPart: { id: vp },
      preparedBy: { name: 'Priya Raman' },
      sourceRole: 'alternate',
      overall: 'pass',
    });
    expect(theCase.summary).toBe(
      `Asked for by Lena Okafor in request #${req.body.id}, needed by 2099-06-30: Reference for the 4-20 mA loop driver on the new transmitter`,
    );
    expect(theCase.audit.map((e: { action: string }) => e.action)).toEqual(['opened']);

    // the other open request for the same pair is taken up by the same case; the one for another house part stays open
    const other = (await t.http.get(`/api/qualification-requests/${alsoAsked.body.id}`).set(auth(engineer))).body;
    expect(other).toMatchObject({ state: 'taken-up', case: { id: caseId } });
    expect((await t.http.get(`/api/qualification-requests/${elsewhere.body.id}`).set(auth(engineer))).body.state).toBe('open');
    expect(ids(await list('?pageSize=200', engineer))).not.toContain(req.body.id);
    // the designer sees it taken up, with the case and its state
    const seen = (await list('?status=all&pageSize=200', designer)).body.items.find((r: { id: number }) => r.id === req.body.id);
    expect(seen).toMatchObject({ state: 'taken-up', case: { id: caseId, state: 'draft' } });

    const pair = `${req.body.vendorPart.mpn} for ${req.body.housePart.partNumber}`;
    const message = await mailed(`Your request #${req.body.id} was taken up: case #${caseId} (${pair})`);
    expect(message.recipients).toEqual(['designer@demo.test']);
    expect(message.body).toContain(`Priya Raman opened case #${caseId} to qualify Fennick Semiconductor FR-`);
    expect(message.body).toMatch(new RegExp(`Case: http://[^/\\s]+/qualifications/${caseId}\\b`)); // links are absolute
    expect(message.body).toContain('Your request: Reference for the 4-20 mA loop driver');
    const secondMail = await mailed(`Your request #${alsoAsked.body.id} was taken up: case #${caseId} (${pair})`);
    expect(secondMail.recipients).toEqual(['second.designer@demo.test']);

    // a closed request cannot be taken up or declined again
    const twice = await t.http.post(`/api/qualification-requests/${req.body.id}/open-case`).set(auth(reviewer)).send({});
    expect(twice.status).toBe(409);
    expect(twice.body.message).toBe(`Request #${req.body.id} was already taken up by Priya Raman (case #${caseId})`);
    expect((await t.http.post(`/api/qualification-requests/${req.body.id}/decline`).set(auth(reviewer)).send({ reply: 'too late' })).status).toBe(409);
  });

  it('a request that named no house part needs one chosen; a case that cannot be opened leaves the request open', async () => {
    const vp = await vendorPart();
    const req = await ask({ vendorPartId: vp, note: 'Any 5.1 V clamp position; engineer to choose' });
    const none = await t.http.post(`/api/qualification-requests/${req.body.id}/open-case`).set(auth(engineer)).send({});
    expect(none.status).toBe(400);
    expect(none.body).toMatchObject({
      message: `Request #${req.body.id} names no house part: choose the house part to qualify the part for`,
      errors: [{ path: 'housePartId' }],
    });
    const bad = await t.http.post(`/api/qualification-requests/${req.body.id}/open-case`).set(auth(engineer)).send({ housePartId: 'HPR-1' });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('housePartId');
    // a house part without a spec: the qualification service refuses, the request stays open
    const noSpec = await createHousePart(t.http, engineer, `HPR-NOSPEC-${n}`);
    const refused = await t.http.post(`/api/qualification-requests/${req.body.id}/open-case`).set(auth(engineer)).send({ housePartId: noSpec });
    expect(refused.status).toBe(422);
    expect(refused.body.message).toMatch(/has no spec yet/);
    expect((await t.http.get(`/api/qualification-requests/${req.body.id}`).set(auth(engineer))).body.state).toBe('open');

    const hp = await housePart();
    const opened = await t.http
      .post(`/api/qualification-requests/${req.body.id}/open-case`)
      .set(auth(reviewer))
      .send({ housePartId: hp, summary: 'Chosen for HPR: same package and window.' });
    expect(opened.status).toBe(201);
    expect(opened.body).toMatchObject({ state: 'taken-up', housePart: null, closedBy: { name: 'Tomas Eklund' }, case: { housePart: { id: hp } } });
    expect((await t.http.get(`/api/qualifications/${opened.body.case.id}`).set(auth(engineer))).body.summary).toBe('Chosen for HPR: same package and window.');
  });

  it('a case opened by any other way takes up the open requests it answers, and a re-check does too', async () => {
    const vp = await vendorPart();
    const hp = await housePart();
    const forPair = await ask({ vendorPartId: vp, housePartId: hp, note: 'for the pair' });
    const forAny = await ask({ vendorPartId: vp, note: 'any house part' }, second);
    const otherHp = await housePart();
    const forOther = await ask({ vendorPartId: vp, housePartId: otherHp, note: 'for another house part' }, second);
    // straight from the Board's "Qualify" (POST /qualifications), not from the request
    const opened = await t.http.post('/api/qualifications').set(auth(reviewer)).send({ housePartId: hp, vendorPartId: vp });
    expect(opened.status).toBe(201);
    const state = async (id: number) => (await t.http.get(`/api/qualification-requests/${id}`).set(auth(engineer))).body;
    expect(await state(forPair.body.id)).toMatchObject({ state: 'taken-up', closedBy: { name: 'Tomas Eklund' }, case: { id: opened.body.id } });
    expect(await state(forAny.body.id)).toMatchObject({ state: 'taken-up', case: { id: opened.body.id, housePart: { id: hp } } });
    expect((await state(forOther.body.id)).state).toBe('open');
    await mailed(
      `Your request #${forAny.body.id} was taken up: case #${opened.body.id} (${forPair.body.vendorPart.mpn} for ${forPair.body.housePart.partNumber})`,
    );

    // rejected for otherHp, asked again, and re-checked: the re-check takes the new request up
    const c = await t.http.post('/api/qualifications').set(auth(engineer)).send({ housePartId: otherHp, vendorPartId: vp });
    expect((await state(forOther.body.id)).state).toBe('taken-up');
    const submitted = await t.http.post(`/api/qualifications/${c.body.id}/submit`).set(auth(engineer)).send({ version: c.body.version, reviewerId });
    expect(
      (
        await t.http
          .post(`/api/qualifications/${c.body.id}/reject`)
          .set(auth(reviewer))
          .send({ version: submitted.body.version, reason: 'leakage above the limit on samples' })
      ).status,
    ).toBe(200);
    const again = await ask({ vendorPartId: vp, housePartId: otherHp, note: 'the vendor says the new lot is better; please look again' });
    expect(again.status).toBe(201);
    // The queue shows the engineer that this pair was rejected, and why; a request for a pair never decided shows nothing.
    const ruledOut = { caseId: c.body.id, state: 'rejected', reason: 'leakage above the limit on samples', at: expect.any(String) };
    expect(again.body.ruledOut).toEqual(ruledOut);
    expect((await list('?status=open', engineer)).body.items.find((r: { id: number }) => r.id === again.body.id).ruledOut).toEqual(ruledOut);
    expect((await state(forPair.body.id)).ruledOut).toBeNull();
    // opening from the request says how to continue a decided pair
    const decided = await t.http.post(`/api/qualification-requests/${again.body.id}/open-case`).set(auth(engineer)).send({});
    expect(decided.status).toBe(409);
    expect(decided.body.message).toMatch(/open a re-check of it/);
    const recheck = await t.http.post(`/api/qualifications/${c.body.id}/recheck`).set(auth(engineer)).send({ note: 'new lot' });
    expect(recheck.status).toBe(201);
    expect(await state(again.body.id)).toMatchObject({ state: 'taken-up', case: { id: recheck.body.id, revision: 2 } });
    const message = await mailed(
      `Your request #${again.body.id} was taken up: case #${recheck.body.id} (${again.body.vendorPart.mpn} for ${again.body.housePart.partNumber})`,
    );
    expect(message.body).toContain(`opened case #${recheck.body.id} (revision 2)`);
  });

  it('an engineer declines a request with a reply, which the requester is mailed and sees', async () => {
    const vp = await vendorPart();
    const req = await ask({ vendorPartId: vp, note: 'Cheaper option for the display board' });
    const noReply = await t.http.post(`/api/qualification-requests/${req.body.id}/decline`).set(auth(engineer)).send({ reply: '  ' });
    expect(noReply.status).toBe(400);
    expect(noReply.body.errors).toEqual([{ path: 'reply', message: 'Write the reply to the requester: why not, or what to use instead' }]);
    expect((await t.http.post('/api/qualification-requests/999999/decline').set(auth(engineer)).send({ reply: 'x' })).status).toBe(404);

    const declined = await t.http
      .post(`/api/qualification-requests/${req.body.id}/decline`)
      .set(auth(engineer))
      .send({ reply: 'The vendor announced end of life for this series; use FR-1 instead, already cleared.' });
    expect(declined.status).toBe(200);
    expect(declined.body).toMatchObject({
      state: 'declined',
      closedBy: { name: 'Priya Raman' },
      reply: 'The vendor announced end of life for this series; use FR-1 instead, already cleared.',
      case: null,
    });
    const seen = (await t.http.get(`/api/qualification-requests/${req.body.id}`).set(auth(designer))).body;
    expect(seen).toMatchObject({ state: 'declined', reply: expect.stringContaining('end of life') });
    const message = await mailed(`Your request #${req.body.id} was declined: Fennick Semiconductor ${req.body.vendorPart.mpn}`);
    expect(message.recipients).toEqual(['designer@demo.test']);
    expect(message.body).toContain('Priya Raman declined your request to qualify Fennick Semiconductor FR-');
    expect(message.body).toContain('Reply: The vendor announced end of life for this series');
    // declined, it is no longer a duplicate: the designer may ask again
    expect((await ask({ vendorPartId: vp, note: 'asking again with more detail' })).status).toBe(201);
    const again = await t.http.post(`/api/qualification-requests/${req.body.id}/decline`).set(auth(reviewer)).send({ reply: 'x' });
    expect(again.status).toBe(409);
    expect(again.body.message).toBe(`Request #${req.body.id} was already declined by Priya Raman`);
  });

  it('publishes its routes and answers at /api/docs', async () => {
    const docs = (await t.http.get('/api/docs-json')).body;
    expect(Object.keys(docs.components.schemas)).toEqual(
      expect.arrayContaining(['QualificationRequestDto', 'QualificationRequestPageDto', 'CreateQualificationRequestDto']),
    );
    expect(Object.keys(docs.paths)).toEqual(
      expect.arrayContaining([
        '/api/qualification-requests',
        '/api/qualification-requests/{id}',
        '/api/qualification-requests/{id}/open-case',
        '/api/qualification-requests/{id}/decline',
      ]),
    );
  });
});
