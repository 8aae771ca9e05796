import fc from 'fast-check';
import { normalizeRequestSchema, normalizeResponseSchema, type EngineeringCard } from '@shuntwise/contracts';
import { normalize } from './normalize';
import { cardArbitrary, logUniform } from './testing/card-arbitraries';

describe('normalising a card to other currents and temperatures', () => {
  it('at izt and 25 °C without self-heating returns the card’s own vz window and zzt (fast-check)', () => {
    fc.assert(
      fc.property(cardArbitrary, (card) => {
        const [point] = normalize({ card, currents: [card.izt], selfHeating: false }).points;
        expect(point.vzNom).toBeCloseTo(card.vzNom, 12);
        expect(point.vzMin).toBeCloseTo(card.vzMin!, 12);
        expect(point.vzMax).toBeCloseTo(card.vzMax!, 12);
        expect(point.zd! / card.zzt!).toBeCloseTo(1, 12);
      }),
    );
  });

  it('keeps the tolerance width at every current and temperature without self-heating (DESIGN: tolerance carried through)', () => {
    fc.assert(
      fc.property(cardArbitrary, logUniform(1e-4, 0.05), fc.double({ min: -40, max: 125, noNaN: true }), (card, current, t) => {
        const [p] = normalize({ card, currents: [current], temperaturesC: [t], selfHeating: false }).points;
        expect(p.vzMax! - p.vzMin!).toBeCloseTo(card.vzMax! - card.vzMin!, 9);
      }),
    );
  });

  it('answers in the published response shape, ambient-major, with the .model line and the caution', () => {
    const card: EngineeringCard = { vzNom: 5.1, vzMin: 4.85, vzMax: 5.36, izt: 0.02, zzt: 17, izk: 0.001, zzk: 550, tc: (0.03 / 100) * 5.1, rthJA: 300 };
    const response = normalize({ card, currents: [0.001, 0.005, 0.02], temperaturesC: [25, 85] });
    expect(normalizeResponseSchema.parse(response)).toEqual(response);
    expect(response.points.map((p) => [p.tempC, p.current])).toEqual([
      [25, 0.001],
      [25, 0.005],
      [25, 0.02],
      [85, 0.001],
      [85, 0.005],
      [85, 0.02],
    ]);
    expect(response.points[2].tjC).toBeGreaterThan(50);
    expect(response.mechanism).toBe('mixed');
    expect(response.spiceModel).toMatch(/^\.model DZ D\(BV=5\.1 IBV=0\.02 NBV=13\.23\d+ RS=0 TCV=-0\.00153 TLEV=0 TNOM=25\)$/);
    expect(response.caution).toMatch(/confirm by measurement and with the manufacturer/);
    expect(response.warnings.join(' ')).toMatch(/clamped/);
  });

  it('warns when asked below the lowest test current or above izm, and gives Zd as no data without impedance', () => {
    const response = normalize({ card: { vzNom: 10, izt: 0.0125, izm: 0.04 }, currents: [0.001, 0.05] });
    expect(response.points.every((p) => p.zd === null)).toBe(true);
    expect(response.warnings.join(' ')).toMatch(/1\.00 mA lies below .* extrapolated/);
    expect(response.warnings.join(' ')).toMatch(/50\.0 mA exceeds IZM/);
    expect(response.issues.map((i) => i.field)).toContain('zzt');
  });
});

describe('thermal runaway', () => {
  it('gives null values and says why when RthJA·I·dV/dT ≥ 1 (100 V, +0.1 %/K, 0.5 A, 100 K/W: loop gain 5)', () => {
    const response = normalize({ card: { vzNom: 100, izt: 0.5, zzt: 10, tc: (0.1 / 100) * 100, rthJA: 100 }, currents: [0.5, 0.001] });
    expect(normalizeResponseSchema.parse(response)).toEqual(response);
    expect(response.points[0]).toMatchObject({ current: 0.5, tjC: null, vzNom: null });
    expect(response.points[1].vzNom).toEqual(expect.any(Number));
    expect(response.warnings.join(' ')).toMatch(/thermal runaway/);
  });
});

describe('the request schema rejects bad input naming the field', () => {
  it('names card fields, current entries and unknown keys', () => {
    const result = normalizeRequestSchema.safeParse({
      card: { vzNom: 5.1, vzMin: 5.3, izt: -0.02, zzT: 5 },
      currents: [0.01, 0],
    });
    expect(result.success).toBe(false);
    const paths = result.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['card.izt', 'currents.1', 'card']));
    expect(result.error!.issues.find((i) => i.path.join('.') === 'card')!.message).toMatch(/zzT/);
  });

  it('names contradictions once the values themselves are valid', () => {
    const result = normalizeRequestSchema.safeParse({ card: { vzNom: 5.1, vzMin: 5.3, izt: 0.02, izk: 0.05 }, currents: [0.01] });
    expect(result.error!.issues.map((i) => i.path.join('.'))).toEqual(['card.vzMin', 'card.izk']);
  });

  it('names a tc given as printed rather than in V/K (the card mapping converts it before the core)', () => {
    const result = normalizeRequestSchema.safeParse({ card: { vzNom: 5.1, izt: 0.02, tc: { value: 2, unit: 'mV/K' } }, currents: [0.01] });
    expect(result.error!.issues[0].path.join('.')).toBe('card.tc');
    const tooLarge = normalizeRequestSchema.safeParse({ card: { vzNom: 5.1, izt: 0.02, tc: 2 }, currents: [0.01] });
    expect(tooLarge.error!.issues[0].path.join('.')).toBe('card.tc');
  });
});
