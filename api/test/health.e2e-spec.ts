import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('health', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seed: 'none' });
  });
  afterAll(() => t.close());

  it('reports every service up without a token', async () => {
    const res = await t.http.get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', services: { database: 'up', objectStore: 'up', mail: 'up' } });
  });

  it('reports the mail server down as degraded, still 200', async () => {
    await t.stack.stopSmtp();
    const res = await t.http.get('/api/health');
    await t.stack.startSmtp();
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'degraded', services: { mail: 'down', database: 'up' } });
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
