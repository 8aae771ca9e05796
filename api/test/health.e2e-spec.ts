import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { MailService } from '../src/mail/mail.service';
import { StorageService } from '../src/storage/storage.service';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

describe('health', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seed: 'none', env: { HEALTH_PROBE_SECONDS: '0.1' } });
  });
  afterAll(() => t.close());

  it('reports every service up without a token, on /api/health and /api/health/ready', async () => {
    for (const path of ['/api/health', '/api/health/ready']) {
      const res = await t.http.get(path);
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ status: 'ok', services: { database: 'up', objectStore: 'up', mail: 'up' } });
    }
  });

  it('answers liveness from memory, even when the database does not answer', async () => {
    const sequelize = t.stack.app.get<Sequelize>(getConnectionToken());
    const spy = jest.spyOn(sequelize, 'query').mockRejectedValue(new Error('connection refused'));
    const [live, ready] = await Promise.all([t.http.get('/api/health/live'), t.http.get('/api/health/ready')]);
    spy.mockRestore();
    expect(ready.status).toBe(503);
    expect(live.status).toBe(200);
    expect(live.body).toMatchObject({ status: 'up', uptimeSeconds: expect.any(Number) });
  });

  it('reports the mail server down as degraded (from its next background probe), still 200', async () => {
    await t.stack.stopSmtp();
    try {
      const res = await eventually(async () => {
        const r = await t.http.get('/api/health');
        return r.body.services?.mail === 'down' && r.body.services?.database === 'up' && r;
      }, 15_000);
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ status: 'degraded', services: { mail: 'down', database: 'up' } });
    } finally {
      await t.stack.startSmtp();
    }
    await eventually(async () => (await t.http.get('/api/health')).body.status === 'ok');
  });

  it('answers 503 when the database does not answer', async () => {
    const sequelize = t.stack.app.get<Sequelize>(getConnectionToken());
    const spy = jest.spyOn(sequelize, 'query').mockRejectedValue(new Error('connection refused'));
    const res = await t.http.get('/api/health');
    spy.mockRestore();
    expect(res.status).toBe(503);
    expect(res.body.services.database).toBe('down');
  });

  it('answers unknown API paths with the error body', async () => {
    const res = await t.http.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ message: expect.any(String), correlationId: expect.any(String) });
  });
});

describe('health under polling', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seed: 'none', env: { HEALTH_PROBE_SECONDS: '300' } });
  });
  afterAll(() => t.close());

  it('probes the mail server and the object store once per probe window, not once per poll', async () => {
    const mail = jest.spyOn(t.stack.app.get(MailService), 'isUp');
    const storage = jest.spyOn(t.stack.app.get(StorageService), 'isUp');
    for (let i = 0; i < 10; i++) expect((await t.http.get('/api/health')).status).toBe(200);
    await Promise.all(Array.from({ length: 10 }, () => t.http.get('/api/health/ready').expect(200)));
    expect(mail).toHaveBeenCalledTimes(1);
    expect(storage).toHaveBeenCalledTimes(1);
    mail.mockRestore();
    storage.mockRestore();
  });
});
