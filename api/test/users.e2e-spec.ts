import { MailService } from '../src/mail/mail.service';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

describe('invitations through the real SMTP fake', () => {
  let t: TestApp;
  let admin: string;
  let engineer: string;
  beforeAll(async () => {
    t = await createTestApp();
    [admin, engineer] = await Promise.all([t.tokenFor('admin'), t.tokenFor('engineer')]);
  });
  afterAll(() => t.close());

  const linkToken = (body: string) => /\/invitation\/([A-Za-z0-9_-]{20,})/.exec(body)?.[1];

  it('invites by mail; the link sets a password once, then the person can sign in', async () => {
    const res = await t.http
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: 'New.Engineer@demo.test', name: 'Ines Navarro', role: 'engineer' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'new.engineer@demo.test', role: 'engineer', acceptedAt: null });

    const mail = await eventually(async () => (await t.capturedMail()).find((m) => m.recipients.includes('new.engineer@demo.test')));
    expect(mail.subject).toMatch(/invited/i);
    const token = linkToken(mail.body)!;
    expect(token).toBeDefined();
    // the token is not stored in clear
    expect(await t.select('SELECT id FROM invitations WHERE token_hash = ?', [token])).toEqual([]);

    const info = await t.http.get(`/api/auth/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(info.body).toMatchObject({ email: 'new.engineer@demo.test', role: 'engineer' });

    const weak = await t.http.post('/api/auth/invitations/accept').send({ token, name: 'Ines Navarro', password: 'short' });
    expect(weak.status).toBe(400);
    expect(weak.body.errors[0].path).toBe('password');

    const accepted = await t.http.post('/api/auth/invitations/accept').send({ token, name: 'Ines Navarro', password: 'a-long-enough-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user).toMatchObject({ email: 'new.engineer@demo.test', role: 'engineer' });

    const again = await t.http.post('/api/auth/invitations/accept').send({ token, name: 'Someone Else', password: 'another-long-password' });
    expect(again.status).toBe(404);
    expect((await t.http.get(`/api/auth/invitations/${token}`)).status).toBe(404);

    const login = await t.http.post('/api/auth/login').send({ email: 'new.engineer@demo.test', password: 'a-long-enough-password' });
    expect(login.status).toBe(200);
  });

  it('refuses an expired invitation', async () => {
    await t.http.post('/api/users/invitations').set('Authorization', `Bearer ${admin}`).send({ email: 'late@demo.test', name: 'Late Person', role: 'buyer' });
    const mail = await eventually(async () => (await t.capturedMail()).find((m) => m.recipients.includes('late@demo.test')));
    await t.exec("UPDATE invitations SET expires_at = '2000-01-01' WHERE email = 'late@demo.test'");
    const res = await t.http
      .post('/api/auth/invitations/accept')
      .send({ token: linkToken(mail.body), name: 'Late Person', password: 'a-long-enough-password' });
    expect(res.status).toBe(404);
    expect(res.body.message).toMatch(/expired/);
  });

  it('resends an invitation with a new link (the old one stops working) and revokes one; admins only', async () => {
    const auth = { Authorization: `Bearer ${admin}` };
    const invited = await t.http.post('/api/users/invitations').set(auth).send({ email: 'resend.me@demo.test', name: 'Resend Me', role: 'designer' });
    const first = await eventually(async () => (await t.capturedMail()).find((m) => m.recipients.includes('resend.me@demo.test')));
    const oldToken = linkToken(first.body)!;
    // links in mail are absolute: the public URL, then the path
    expect(first.body).toContain(`${t.stack.url}/invitation/${oldToken}`);

    expect((await t.http.post(`/api/users/invitations/${invited.body.id}/resend`).set('Authorization', `Bearer ${engineer}`)).status).toBe(403);
    const resent = await t.http.post(`/api/users/invitations/${invited.body.id}/resend`).set(auth);
    expect(resent.status).toBe(200);
    const second = await eventually(async () => (await t.capturedMail()).filter((m) => m.recipients.includes('resend.me@demo.test'))[1]);
    const newToken = linkToken(second.body)!;
    expect(newToken).not.toBe(oldToken);
    expect((await t.http.get(`/api/auth/invitations/${oldToken}`)).status).toBe(404);
    expect((await t.http.get(`/api/auth/invitations/${newToken}`)).status).toBe(200);

    expect((await t.http.post(`/api/users/invitations/${invited.body.id}/revoke`).set('Authorization', `Bearer ${engineer}`)).status).toBe(403);
    const revoked = await t.http.post(`/api/users/invitations/${invited.body.id}/revoke`).set(auth);
    expect(revoked.status).toBe(200);
    expect(revoked.body.revokedAt).toEqual(expect.any(String));
    expect((await t.http.get(`/api/auth/invitations/${newToken}`)).status).toBe(404);
    const late = await t.http.post('/api/auth/invitations/accept').send({ token: newToken, name: 'Resend Me', password: 'a-long-enough-password' });
    expect(late.status).toBe(404);
    expect((await t.http.post(`/api/users/invitations/${invited.body.id}/resend`).set(auth)).status).toBe(409);
    expect((await t.http.post('/api/users/invitations/999999/revoke').set(auth)).status).toBe(404);
  });

  it('refuses to invite an existing user (409) and a non-admin (403)', async () => {
    const dup = await t.http
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: 'buyer@demo.test', name: 'Dup', role: 'buyer' });
    expect(dup.status).toBe(409);
    const engineer = await t.tokenFor('engineer');
    const forbidden = await t.http
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${engineer}`)
      .send({ email: 'x@demo.test', name: 'X', role: 'buyer' });
    expect(forbidden.status).toBe(403);
  });

  it('keeps mail while the SMTP server is away and delivers it when it returns', async () => {
    await t.stack.stopSmtp();
    const res = await t.http
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: 'queued@demo.test', name: 'Queued Person', role: 'designer' });
    expect(res.status).toBe(201); // the invitation does not wait for mail
    const mail = t.stack.app.get(MailService);
    await mail.flush();
    const [pending] = await t.select<{ state: string; attempts: number }>(
      'SELECT state, attempts FROM outgoing_mail WHERE JSON_CONTAINS(recipients, \'"queued@demo.test"\')',
    );
    expect(pending.state).toBe('pending');
    expect(pending.attempts).toBeGreaterThanOrEqual(1);
    expect((await t.capturedMail()).some((m) => m.recipients.includes('queued@demo.test'))).toBe(false);

    await t.stack.startSmtp();
    await eventually(async () => {
      await mail.flush();
      return (await t.capturedMail()).some((m) => m.recipients.includes('queued@demo.test'));
    });
    const [sent] = await t.select<{ state: string }>('SELECT state FROM outgoing_mail WHERE JSON_CONTAINS(recipients, \'"queued@demo.test"\')');
    expect(sent.state).toBe('sent');
  });

  it('lists captured mail on the Outbox for admins only', async () => {
    const list = await t.http.get('/api/outbox').set('Authorization', `Bearer ${admin}`);
    expect(list.status).toBe(200);
    expect(list.body.length).toBeGreaterThanOrEqual(2);
    expect(list.body[0]).toEqual(expect.objectContaining({ subject: expect.any(String), to: expect.any(Array), receivedAt: expect.any(String) }));
    const buyer = await t.tokenFor('buyer');
    expect((await t.http.get('/api/outbox').set('Authorization', `Bearer ${buyer}`)).status).toBe(403);
  });
});
