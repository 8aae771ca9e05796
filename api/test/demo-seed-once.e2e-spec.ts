import { QueryTypes } from 'sequelize';
import { createTestApp, type TestApp } from './helpers/test-app';

/** Row count of every table but the ones that change by themselves (mail the SMTP fake captures, the migration log). */
async function tableCounts(t: TestApp): Promise<Record<string, number>> {
  const tables = await t.select<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    if (name === 'captured_mail' || name === 'migrations') continue;
    const [row] = await t.stack.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${name}\``, { type: QueryTypes.SELECT });
    counts[name] = Number(row.n);
  }
  return counts;
}

describe('demo seed across restarts (real MariaDB)', () => {
  let first: TestApp | undefined;
  let second: TestApp | undefined;
  afterAll(async () => {
    await first?.close({ keepDatabase: true }).catch(() => undefined);
    await second?.close();
  });

  it('loads the demo once: a restart adds no rows and does not make the buyer follow a part again', async () => {
    first = await createTestApp({ seed: 'demo' });
    const buyerToken = await first.tokenFor('buyer');
    const [buyer] = await first.select<{ id: number }>("SELECT id FROM users WHERE email = 'buyer@demo.test'");
    const [followed] = await first.select<{ housePartId: number }>(
      'SELECT house_part_id AS housePartId FROM house_part_buyers WHERE user_id = ? ORDER BY house_part_id LIMIT 1',
      [buyer.id],
    );
    const stop = await first.http.delete(`/api/house-parts/${followed.housePartId}/buyers/${buyer.id}`).set({ Authorization: `Bearer ${buyerToken}` });
    expect(stop.status).toBeLessThan(300);
    const before = await tableCounts(first);
    expect(before.house_parts).toBeGreaterThan(0);
    expect(before.qualifications).toBeGreaterThan(0);
    const earlier = first;
    await first.close({ keepDatabase: true });
    first = undefined;

    // The same database started again, as `npm start` does after a stop.
    second = await createTestApp({ seed: 'demo', sameDatabaseAs: earlier });
    expect(await tableCounts(second)).toEqual(before);
    const again = await second.select('SELECT 1 FROM house_part_buyers WHERE user_id = ? AND house_part_id = ?', [buyer.id, followed.housePartId]);
    expect(again).toHaveLength(0);
    const steps = await second.select<{ name: string }>('SELECT name FROM demo_seed_steps ORDER BY name');
    // every step of the demo is recorded as done (other steps may follow these three)
    expect(steps.map((r) => r.name)).toEqual(expect.arrayContaining(['catalogue', 'qualifications', 'users']));
  }, 240_000);
});
