import { ROLES, normalizeResponseSchema, regulatorResponseSchema } from '@shuntwise/contracts';
import { createTestApp, type TestApp } from './helpers/test-app';

// An invented 5.1 V, 500 mW part.
const card = {
  vzNom: 5.1,
  vzMin: 4.85,
  vzMax: 5.36,
  izt: 0.02,
  zzt: 17,
  izk: 0.001,
  zzk: 550,
  tc: (0.03 / 100) * 5.1, // 0.03 %/K of 5.1 V, in V/K as the engineering routes take it
  pdMax: 0.5,
  tjMax: 175,
  rthJA: 300,
};
const regulator = {
  card,
  supply: { min: 10.8, nom: 12, max: 13.2 },
  load: { min: 0, max: 0.01 },
  ambient: { min: -20, max: 70 },
  resistor: { series: 'E24', tolerance: 0.05 },
};

describe('engineering routes against the running app', () => {
  let t: TestApp;
  const tokens: Record<string, string> = {};
  beforeAll(async () => {
    t = await createTestApp();
    for (const role of ROLES) tokens[role] = await t.tokenFor(role);
  });
  afterAll(() => t.close());

  it('POST /api/engineering/normalize answers 200 for every role with the published shape', async () => {
    for (const role of ROLES) {
      const res = await t.http
        .post('/api/engineering/normalize')
        .set('Authorization', `Bearer ${tokens[role]}`)
        .send({ card, currents: [0.005, 0.02], temperaturesC: [25, 85] });
      expect(res.status).toBe(200);
      expect(normalizeResponseSchema.parse(res.body)).toEqual(res.body);
    }
    const res = await t.http
      .post('/api/engineering/normalize')
      .set('Authorization', `Bearer ${tokens.designer}`)
      .send({ card, currents: [0.02], selfHeating: false });
    // At izt, 25 °C, no self-heating: the card's own values come back.
    expect(res.body.points[0]).toMatchObject({ current: 0.02, tempC: 25, vzNom: 5.1, vzMin: 4.85, vzMax: 5.36 });
    expect(res.body.points[0].zd).toBeCloseTo(17, 9);
    expect(res.body.spiceModel).toMatch(/^\.model DZ D\(BV=/);
  });

  it('POST /api/engineering/regulator answers 200 with a design', async () => {
    const res = await t.http.post('/api/engineering/regulator').set('Authorization', `Bearer ${tokens.designer}`).send(regulator);
    expect(res.status).toBe(200);
    expect(regulatorResponseSchema.parse(res.body)).toEqual(res.body);
    expect(res.body.verdict).toBe('ok');
    expect(res.body.selected.series).toBe('E24');
  });

  it('answers 400 naming the field for a bad card', async () => {
    const contradiction = await t.http
      .post('/api/engineering/normalize')
      .set('Authorization', `Bearer ${tokens.engineer}`)
      .send({ card: { ...card, vzMin: 5.3 }, currents: [0.01] });
    expect(contradiction.status).toBe(400);
    expect(contradiction.body.errors).toEqual([{ path: 'card.vzMin', message: expect.stringMatching(/VZ min \(.*\) is above VZ nom/) }]);
    expect(contradiction.body.correlationId).toEqual(expect.any(String));

    const wrongType = await t.http
      .post('/api/engineering/regulator')
      .set('Authorization', `Bearer ${tokens.designer}`)
      .send({ ...regulator, card: { ...card, izt: '20 mA' }, resistor: { series: 'E12', tolerance: 0.05 } });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.errors.map((e: { path: string }) => e.path)).toEqual(expect.arrayContaining(['card.izt', 'resistor.series']));
  });

  it('answers 401 without a token', async () => {
    expect((await t.http.post('/api/engineering/normalize').send({ card, currents: [0.01] })).status).toBe(401);
    expect((await t.http.post('/api/engineering/regulator').send(regulator)).status).toBe(401);
  });
});
