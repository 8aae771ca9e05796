import { loadDemoCatalogue } from '@shuntwise/test-fixtures';
import { DEMO_CASES, QualificationsSeeder } from '../src/seed/qualifications-seeder.service';
import { CatalogueSeeder } from '../src/seed/catalogue-seeder.service';
import { DemoSeedService } from '../src/seed/demo-seed.service';
import { MeasurementsSeeder } from '../src/seed/measurements-seeder.service';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('demo qualifications seed (real MariaDB)', () => {
  let t: TestApp;
  let seconds: number;
  let engineer: string;
  const auth = () => ({ Authorization: `Bearer ${engineer}` });

  beforeAll(async () => {
    t = await createTestApp({ seed: 'users' });
    await t.stack.app.get(CatalogueSeeder).run();
    seconds = (await t.stack.app.get(QualificationsSeeder).run()).seconds;
    await t.stack.app.get(MeasurementsSeeder).run();
    engineer = await t.tokenFor('engineer');
  }, 300_000); // the whole demo through the real services: slow on a loaded two-core machine
  afterAll(() => t.close());

  it('has a case in every state, prepared by the demo engineer and decided by the second engineer', async () => {
    // A figure to read, not a timed assertion.
    console.log(`demo qualifications seed: ${DEMO_CASES.length} cases and the approved sources in ${seconds.toFixed(2)} s`);
    const list = await t.http.get('/api/qualifications?pageSize=100').set(auth());
    expect(list.status).toBe(200);
    const all = list.body.items as Array<{
      id: number;
      state: string;
      overall: string;
      preparedBy: { name: string };
      decision: { by: { name: string } } | null;
      needsRecheck: boolean;
    }>;
    // Every approved source became one by a decision of the second engineer on a case the first prepared.
    const approvedSources = loadDemoCatalogue().houseParts.flatMap((h) => h.sources.filter((s) => s.role === 'approved'));
    const approvals = all.filter((i) => i.state === 'approved');
    expect(approvals).toHaveLength(approvedSources.length);
    for (const a of approvals) expect(a).toMatchObject({ preparedBy: { name: 'Priya Raman' }, decision: { by: { name: 'Tomas Eklund' } } });
    const items = all.filter((i) => i.state !== 'approved');
    expect(items).toHaveLength(DEMO_CASES.length);
    expect([...new Set(items.map((i) => i.state))].sort()).toEqual([
      'cleared',
      'cleared-with-conditions',
      'draft',
      'in-review',
      'rejected',
      'revoked',
      'withdrawn',
    ]);
    for (const i of items) {
      expect(i.preparedBy.name).toBe('Priya Raman');
      if (i.decision) expect(i.decision.by.name).toBe('Tomas Eklund');
    }
    // decisions agree with the evaluations they were made on
    for (const i of items.filter((x) => x.state === 'cleared' || x.state === 'revoked')) expect(i.overall).toBe('pass');
    expect(items.find((i) => i.state === 'cleared-with-conditions')!.overall).toBe('marginal');
    expect(items.find((i) => i.state === 'rejected')!.overall).toBe('fail');

    const recheck = items.filter((i) => i.needsRecheck);
    expect(recheck).toHaveLength(1);
    const flagged = (await t.http.get(`/api/qualifications/${recheck[0].id}`).set(auth())).body;
    expect(flagged).toMatchObject({
      state: 'cleared',
      vendorPart: { mpn: 'BRZ05-12' },
      recheckReasons: [{ cause: 'card-changed', detail: 'rating card version 2 (changed: zzk)' }],
    });
    expect(flagged.audit.map((a: { action: string }) => a.action)).toEqual(['opened', 'submitted', 'cleared', 'flagged-for-recheck']);
  });

  it('gives the cases comments and audit trails, ages for the Board, and links the demo buyer to every house part', async () => {
    const approvedSources = loadDemoCatalogue().houseParts.flatMap((h) => h.sources.filter((s) => s.role === 'approved')).length;
    const withCondition = (await t.http.get('/api/qualifications?state=cleared-with-conditions').set(auth())).body.items[0];
    const detail = (await t.http.get(`/api/qualifications/${withCondition.id}`).set(auth())).body;
    expect(detail.comments.map((c: { by: { name: string } }) => c.by.name)).toEqual(['Tomas Eklund', 'Priya Raman']);
    expect(detail.audit.map((a: { action: string }) => a.action)).toEqual(['opened', 'submitted', 'commented', 'commented', 'cleared-with-conditions']);
    expect(detail.decision.text).toMatch(/five pieces per lot/);

    const stale = await t.http.get('/api/qualification-views/board?state=in-review&minAgeDays=7').set(auth());
    expect(stale.body.items.map((i: { housePart: { partNumber: string } }) => i.housePart.partNumber)).toEqual(['OHI-ZD-1068']);
    const [{ parts }] = await t.select<{ parts: number }>('SELECT COUNT(*) AS parts FROM house_parts');
    const [{ links }] = await t.select<{ links: number }>(
      "SELECT COUNT(*) AS links FROM house_part_buyers b JOIN users u ON u.id = b.user_id WHERE u.email = 'buyer@demo.test'",
    );
    expect(links).toBe(parts);
    // the buyers were told of the clearances and the revocation
    const kinds = await t.select<{ kind: string }>("SELECT kind FROM outgoing_mail WHERE kind LIKE 'qualification.%' ORDER BY id");
    // the preparer hears of every decision another engineer made on their case
    const [{ decisions }] = await t.select<{ decisions: number }>(
      "SELECT COUNT(*) AS decisions FROM qualification_events WHERE action IN ('approved', 'cleared', 'cleared-with-conditions', 'rejected')",
    );
    expect(kinds.filter((k) => k.kind === 'qualification.decided')).toHaveLength(Number(decisions));
    expect(
      kinds
        .map((k) => k.kind)
        .filter((k) => k !== 'qualification.decided')
        .sort(),
    ).toEqual(
      [
        // the approvals were sent for review too; they were made before the buyer followed the parts (no buyer mail)
        ...Array(7 + approvedSources).fill('qualification.review'),
        'qualification.cleared',
        'qualification.cleared',
        'qualification.cleared',
        'qualification.cleared',
        'qualification.cleared-with-conditions',
        'qualification.revoked',
      ].sort(),
    );
  });

  it('seeds the demo bench measurements: the drifting lot of QHZ5V1AF fails its datasheet window', async () => {
    const engineer = await t.tokenFor('engineer');
    const [part] = await t.select<{ id: number }>("SELECT id FROM vendor_parts WHERE mpn = 'QHZ5V1AF'");
    const sets = await t.http.get(`/api/vendor-parts/${part.id}/measurement-sets`).set('Authorization', `Bearer ${engineer}`);
    expect(sets.status).toBe(200);
    const vz = sets.body[0].analysis.checks.find((c: { id: string }) => c.id === 'card-vz');
    expect(vz.verdict).toBe('fail');
    expect(vz.failingSamples.length).toBeGreaterThan(0);
  });

  it('adds nothing when the whole demo seed runs again', async () => {
    const count = async () =>
      (
        await t.select<{ n: number }>(
          'SELECT (SELECT COUNT(*) FROM qualifications) + (SELECT COUNT(*) FROM qualification_events) + (SELECT COUNT(*) FROM house_part_buyers) AS n',
        )
      )[0].n;
    const before = await count();
    expect((await t.stack.app.get(DemoSeedService).run('demo')).created).toBe(0);
    expect(await count()).toBe(before);
  });
});
