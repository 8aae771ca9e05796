import type { Sequelize } from 'sequelize-typescript';
import { RAW_READ_CONNECTIONS, RawRows, utcDate } from './raw-rows';

// A stand-in for Sequelize's pool (common practice, no source): counts borrows and returns,
// and connections that answer, fail while staying usable, or die.
function fakePool() {
  let made = 0;
  const out = new Set<FakeConnection>();
  const returned: FakeConnection[] = [];
  class FakeConnection {
    readonly id = ++made;
    valid = true;
    failNext: Error | null = null;
    execute(sql: { sql: string }, values?: unknown[]): Promise<unknown> {
      if (!this.valid) return Promise.reject(new Error('socket closed'));
      if (this.failNext) {
        const error = this.failNext;
        this.failNext = null;
        return Promise.reject(error);
      }
      return Promise.resolve([{ connection: this.id, sql: sql.sql, values }]);
    }
    query(sql: { sql: string }, values?: unknown[]): Promise<unknown> {
      return this.execute(sql, values);
    }
    isValid() {
      return this.valid;
    }
  }
  let refuse: Error | null = null;
  const pool = {
    getConnection: () => {
      if (refuse) return Promise.reject(refuse);
      const connection = new FakeConnection();
      out.add(connection);
      return Promise.resolve(connection);
    },
    releaseConnection: (connection: FakeConnection) => {
      if (!out.delete(connection)) throw new Error(`connection ${connection.id} given back twice`);
      returned.push(connection);
    },
  };
  const rows = new RawRows({ connectionManager: pool } as unknown as Sequelize);
  return {
    rows,
    out,
    returned,
    refuse: (error: Error | null) => (refuse = error),
    made: () => made,
  };
}

const connectionOf = async (rows: RawRows) => (await rows.select<{ connection: number }>('SELECT 1', []))[0].connection;

describe('RawRows', () => {
  it('shares RAW_READ_CONNECTIONS borrowed connections between reads, round robin', async () => {
    const { rows, made, out } = fakePool();
    const used = await Promise.all(Array.from({ length: 10 }, () => connectionOf(rows)));
    expect(made()).toBe(RAW_READ_CONNECTIONS);
    expect(new Set(used).size).toBe(RAW_READ_CONNECTIONS);
    expect(out.size).toBe(RAW_READ_CONNECTIONS);
  });

  it('keeps a connection whose statement failed but which is still usable', async () => {
    const { rows, out, returned } = fakePool();
    await Promise.all(Array.from({ length: RAW_READ_CONNECTIONS }, () => connectionOf(rows)));
    const [first] = [...out] as Array<{ failNext: Error | null }>;
    first.failNext = new Error('Duplicate entry');
    const results = await Promise.allSettled(Array.from({ length: RAW_READ_CONNECTIONS }, () => connectionOf(rows)));
    expect(results.filter((r) => r.status === 'rejected')).toHaveLength(1);
    expect(returned).toEqual([]);
  });

  it('gives a dead connection back once, even with several reads failing on it, and borrows afresh', async () => {
    const { rows, out, returned, made } = fakePool();
    await Promise.all(Array.from({ length: RAW_READ_CONNECTIONS }, () => connectionOf(rows)));
    const [first] = [...out] as Array<{ id: number; valid: boolean }>;
    first.valid = false;
    const failed = await Promise.allSettled(Array.from({ length: RAW_READ_CONNECTIONS * 3 }, () => connectionOf(rows)));
    expect(failed.filter((r) => r.status === 'rejected')).toHaveLength(3);
    await new Promise((resolve) => setImmediate(resolve));
    expect(returned.map((c) => c.id)).toEqual([first.id]);
    const after = await Promise.all(Array.from({ length: RAW_READ_CONNECTIONS * 2 }, () => connectionOf(rows)));
    expect(after).not.toContain(first.id);
    expect(made()).toBe(RAW_READ_CONNECTIONS + 1);
  });

  it('does not keep a failed borrow: the read fails and the next one borrows again', async () => {
    const { rows, refuse, made } = fakePool();
    refuse(new Error('connect ECONNREFUSED'));
    await expect(Promise.all(Array.from({ length: RAW_READ_CONNECTIONS }, () => connectionOf(rows)))).rejects.toThrow('ECONNREFUSED');
    refuse(null);
    await Promise.all(Array.from({ length: RAW_READ_CONNECTIONS }, () => connectionOf(rows)));
    expect(made()).toBe(RAW_READ_CONNECTIONS);
  });

  it('gives every held connection back when the app closes, and reads no more', async () => {
    const { rows, out } = fakePool();
    await Promise.all(Array.from({ length: RAW_READ_CONNECTIONS }, () => connectionOf(rows)));
    await rows.onModuleDestroy();
    expect(out.size).toBe(0);
    await expect(connectionOf(rows)).rejects.toThrow(/closed/);
  });

  it('runs a longer read on a connection borrowed for it alone and gives it back, answered or failed', async () => {
    const { rows, out, returned, made } = fakePool();
    const read = await rows.query<{ connection: number; sql: string; values: unknown[] }>('SELECT ? AS a', [1]);
    expect(read).toEqual([{ connection: 1, sql: 'SELECT ? AS a', values: [1] }]);
    expect(out.size).toBe(0);
    expect(returned.map((c) => c.id)).toEqual([1]);
    // The held connections of the primary-key reads are not the ones it uses.
    await connectionOf(rows);
    await rows.query('SELECT 2', []);
    expect(made()).toBe(3);
    expect(out.size).toBe(1);
    const failing = fakePool();
    const original = failing.rows as unknown as { pool: { getConnection: () => Promise<{ query: () => Promise<never> }> } };
    const borrow = original.pool.getConnection.bind(original.pool);
    original.pool.getConnection = async () => Object.assign(await borrow(), { query: () => Promise.reject(new Error('Unknown column')) });
    await expect(failing.rows.query('SELECT nope', [])).rejects.toThrow('Unknown column');
    expect(failing.out.size).toBe(0);
    await rows.onModuleDestroy();
    await expect(rows.query('SELECT 1', [])).rejects.toThrow(/closed/);
  });

  it('reads a stored DATETIME as UTC whatever the process time zone', () => {
    // ISO 8601 / ECMA-262 Date Time String Format: a trailing Z is UTC.
    expect(utcDate('2026-12-04 21:38:14').toISOString()).toBe('2026-12-04T21:38:14.000Z');
    expect(utcDate('2026-01-31 23:59:59.250000').toISOString()).toBe('2026-01-31T23:59:59.250Z');
  });
});
