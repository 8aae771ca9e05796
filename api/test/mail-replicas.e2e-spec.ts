import { MailService } from '../src/mail/mail.service';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

/** Two API replicas on one database share the outbox: each message goes out once. */
describe('mail outbox with two replicas (real MariaDB)', () => {
  let a: TestApp;
  let b: TestApp;
  beforeAll(async () => {
    a = await createTestApp({ seed: 'none', env: { MAIL_FROM: 'Replica A <a@demo.test>' } });
    b = await createTestApp({ seed: 'none', sameDatabaseAs: a, env: { MAIL_FROM: 'Replica B <b@demo.test>' } });
  }, 120_000);
  afterAll(async () => {
    await b?.close({ keepDatabase: true });
    await a?.close();
  });

  it('sends every message exactly once while both replicas dispatch at the same time', async () => {
    const count = 120;
    // Enqueued while no dispatcher can send (both mail servers stopped), then released at once.
    await Promise.all([a.stack.stopSmtp(), b.stack.stopSmtp()]);
    const mailA = a.stack.app.get(MailService);
    // (the dispatchers keep claiming while the messages go in: a claim must never block or fail an insert)
    for (let i = 0; i < count; i++) await mailA.enqueue({ to: [`replica-${i}@demo.test`], subject: `replica test ${i}`, body: 'test', kind: 'test' });
    await a.exec("UPDATE outgoing_mail SET next_attempt_at = NOW() - INTERVAL 1 SECOND, claimed_by = NULL, attempts = 0 WHERE kind = 'test'");
    await Promise.all([a.stack.startSmtp(), b.stack.startSmtp()]);
    const mailB = b.stack.app.get(MailService);
    await Promise.all([mailA.flush(), mailB.flush(), mailA.flush(), mailB.flush()]);

    await eventually(async () => {
      const [row] = await a.select<{ n: number }>("SELECT COUNT(*) AS n FROM outgoing_mail WHERE kind = 'test' AND state <> 'sent'");
      return Number(row.n) === 0;
    }, 60_000);
    const captured = (await a.capturedMail()).filter((m) => m.subject.startsWith('replica test '));
    const bySubject = new Map<string, number>();
    for (const m of captured) bySubject.set(m.subject, (bySubject.get(m.subject) ?? 0) + 1);
    expect(bySubject.size).toBe(count);
    expect([...bySubject.values()].every((n) => n === 1)).toBe(true);
    const senders = new Set(captured.map((m) => m.sender));
    console.log(`two replicas: ${count} messages, sent by ${[...senders].map((s) => `${s}: ${captured.filter((m) => m.sender === s).length}`).join(', ')}`);
  }, 120_000);
});
