import { fitBreakdownModel, voltageSpan } from './breakdown-model';
import { kneeReading, powerLawKnee } from './knee';

describe('power-law knee Zd = ZZT·(IZT/I)^p', () => {
  it('passes through both printed points (definition of the law, common practice, no source)', () => {
    const law = powerLawKnee(0.005, 20, 0.00025, 900);
    expect(law.zd(0.005)).toBeCloseTo(20, 9);
    expect(law.zd(0.00025)).toBeCloseTo(900, 9);
  });

  it('with p = 1 is the junction log law, span nVt·ln(b/a): 0.1 V·ln 10 = 0.2303 V (Shockley diode equation, any semiconductor text; from memory)', () => {
    // zzt·izt = 10 Ω·10 mA = 0.1 V and zzk·izk = 400 Ω·0.25 mA = 0.1 V: Zd·I constant, so p = 1.
    const law = powerLawKnee(0.01, 10, 0.00025, 400);
    expect(law.p).toBeCloseTo(1, 12);
    expect(law.span(0.001, 0.01)).toBeCloseTo(0.1 * Math.log(10), 9);
  });

  it('with p = 2 the span is ZZT·IZT²·(1/a − 1/b), the integral of Zd dI (calculus, common practice, no source)', () => {
    // 10 Ω at 10 mA and 16 000 Ω at 0.25 mA: ratio 1600 = 40², so p = 2.
    const law = powerLawKnee(0.01, 10, 0.00025, 16_000);
    expect(law.p).toBeCloseTo(2, 12);
    expect(law.span(0.001, 0.005)).toBeCloseTo(10 * 0.01 ** 2 * (1 / 0.001 - 1 / 0.005), 9); // 0.8 V
  });

  it('is continuous through p = 1 (the log branch and the power branch meet; common practice, no source)', () => {
    const below = powerLawKnee(0.01, 10, 0.00025, 400 * (1 - 1e-7)).span(0.001, 0.01);
    const at = powerLawKnee(0.01, 10, 0.00025, 400).span(0.001, 0.01);
    expect(below).toBeCloseTo(at, 6);
  });
});

describe('kneeReading', () => {
  it('reads a physical two-point card by the fitted model itself', () => {
    const card = { vzNom: 5.1, izt: 0.02, zzt: 17, izk: 0.001, zzk: 200 };
    const model = fitBreakdownModel(card);
    expect(model.basis).toBe('two-point');
    const knee = kneeReading(model, card);
    if ('missing' in knee) throw new Error(knee.missing);
    expect(knee.span(0.001, 0.02)).toBeCloseTo(voltageSpan(model, 0.001, 0.02), 12);
  });

  it('joins a card that needs RS < 0 by the power law, through both printed points', () => {
    // Zd falls faster than 1/I: 5 Ω at 20 mA, 1000 Ω at 1 mA (zzk·izk = 1 V > zzt·izt = 0.1 V).
    const card = { vzNom: 12, izt: 0.02, zzt: 5, izk: 0.001, zzk: 1000 };
    const model = fitBreakdownModel(card);
    expect(model.basis).toBe('clamped');
    const knee = kneeReading(model, card);
    if ('missing' in knee) throw new Error(knee.missing);
    expect(knee.zd(0.001)).toBeCloseTo(1000, 9);
    expect(knee.zd(0.02)).toBeCloseTo(5, 9);
  });

  it('gives no reading without a knee point: no vendor data, no number', () => {
    const card = { vzNom: 5.1, izt: 0.02, zzt: 17 };
    expect(kneeReading(fitBreakdownModel(card), card)).toHaveProperty('missing');
  });
});
