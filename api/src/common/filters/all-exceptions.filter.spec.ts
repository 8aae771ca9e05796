import { Logger, type ArgumentsHost } from '@nestjs/common';
import { ConnectionAcquireTimeoutError, ConnectionRefusedError, DatabaseError, UniqueConstraintError } from 'sequelize';
import { AllExceptionsFilter } from './all-exceptions.filter';

/** Errors shaped as the mariadb driver reports them (SqlError: code, errno, fatal). */
function sqlError(code: string, errno: number, fatal: boolean): Error {
  return Object.assign(new Error(`(conn:1, no: ${errno}) ${code}`), { name: 'SqlError', code, errno, fatal, sql: 'SELECT 1' });
}

function answer(exception: unknown) {
  const sent: { status?: number; body?: Record<string, unknown>; headers: Record<string, string> } = { headers: {} };
  const res = {
    headersSent: false,
    setHeader: (k: string, v: string) => (sent.headers[k.toLowerCase()] = v),
    status(code: number) {
      sent.status = code;
      return this;
    },
    json: (body: Record<string, unknown>) => (sent.body = body),
  };
  const host = {
    switchToHttp: () => ({ getRequest: () => ({ method: 'POST', originalUrl: '/api/x', correlationId: 'c' }), getResponse: () => res }),
  } as unknown as ArgumentsHost;
  new AllExceptionsFilter().catch(exception, host);
  return sent;
}

describe('AllExceptionsFilter and database faults', () => {
  beforeAll(() => Logger.overrideLogger(false)); // the filter logs each one; quiet here

  it.each([
    ['refused at connect', new ConnectionRefusedError(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3306'), { code: 'ECONNREFUSED' }))],
    ['no pooled connection in time', new ConnectionAcquireTimeoutError(new Error('Operation timeout'))],
    ['socket closed mid-query', new DatabaseError(sqlError('ER_SOCKET_UNEXPECTED_CLOSE', 45007, true) as never)],
    ['server shutting down', new DatabaseError(sqlError('ER_SERVER_SHUTDOWN', 1053, true) as never)],
    ['Galera node without quorum', new DatabaseError(sqlError('ER_UNKNOWN_COM_ERROR', 1047, false) as never)],
  ])('answers 503 with Retry-After when the database is away: %s', (_, error) => {
    const sent = answer(error);
    expect(sent.status).toBe(503);
    expect(sent.headers['retry-after']).toBe('5');
    expect(sent.body?.message).toMatch(/database is unavailable/);
  });

  it('answers 503 (nothing saved, try again) to a deadlock or a Galera certification failure', () => {
    const sent = answer(new DatabaseError(sqlError('ER_LOCK_DEADLOCK', 1213, false) as never));
    expect(sent.status).toBe(503);
    expect(sent.headers['retry-after']).toBe('5');
    expect(sent.body?.message).toMatch(/nothing was saved/);
  });

  it('keeps statement errors and other services’ refusals out of it', () => {
    expect(answer(new DatabaseError(sqlError('ER_PARSE_ERROR', 1064, false) as never)).status).toBe(500);
    expect(answer(new UniqueConstraintError({})).status).toBe(409);
    // an object store or mail server refusing a connection is not the database
    expect(answer(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:4569'), { code: 'ECONNREFUSED' })).status).toBe(500);
  });
});
