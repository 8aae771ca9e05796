import { specSchema, tcVoltsPerKelvin, type EngineeringCardInput, type Evaluation, type QualificationCheck, type SpecInput } from '@shuntwise/contracts';
import { evaluateCard, overallVerdict, verdictOfMargin } from './evaluate';

/**
 * Hand-computed cases. The formulas the hand calculations use, and where they come from:
 * - breakdown: V(I) = vz + a·ln(I/izt) + RS·(I − izt), Zd(I) = a/I + RS, a = NBV·Vt, the
 *   reverse-breakdown branch of the SPICE diode model (ngspice manual, diode model; quoted
 *   from memory). Two points (izt, zzt), (izk, zzk) give a = (zzk − zzt)·izk·izt/(izt − izk),
 *   RS = zzt − a/izt (two equations, two unknowns).
 * - Vt = kT/q with the exact SI constants (CODATA 2018); a scales with the absolute temperature.
 * - margin = distance to the limit in % of the limit; marginal below the spec's band (our
 *   product's definition; common practice, no source).
 */
const K_OVER_Q = 1.380649e-23 / 1.602176634e-19;

function spec(overrides: Partial<SpecInput> = {}) {
  return specSchema.parse({
    iRef: 5e-3,
    vz: { min: 4.85, nom: 5.1, max: 5.36 },
    zdMax: 60,
    knee: { iKnee: 0.25e-3, maxRatio: 20, maxSpan: null },
    leakage: { irMax: 2e-6, vr: 2 },
    tc: { min: -1e-3, max: 3e-3 },
    power: { pdMin: 0.3, deratingFraction: 0.5 },
    packages: ['SOD-123', 'SOD-323'],
    envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
    outputWindow: null,
    marginalBandPercent: 5,
    ...overrides,
  });
}

/** An invented 5.1 V, 500 mW card of the usual size (common practice, no source). */
const CARD: EngineeringCardInput = {
  vzMin: 4.9,
  vzNom: 5.1,
  vzMax: 5.3,
  izt: 5e-3,
  zzt: 40,
  izk: 0.25e-3,
  zzk: 500,
  irMax: 1e-6,
  vr: 2,
  tc: 0.3e-3,
  pdMax: 0.5,
  pdRefC: 25,
  tjMax: 150,
  rthJA: 250,
  izm: 89e-3,
};
// The two-point fit of CARD by hand: a = 460·0.25e-3·5e-3/4.75e-3, RS = 40 − a/5e-3.
const A = (460 * 0.25e-3 * 5e-3) / 4.75e-3; // 0.121052… V
const RS = 40 - A / 5e-3; // 15.789… Ω

function run(s = spec(), card: EngineeringCardInput | null = CARD, pkg: string | null = 'SOD-123'): Evaluation {
  return evaluateCard({ spec: s, specVersion: 3, card, cardVersion: 7, vendorPackage: pkg, now: new Date('2026-12-01T10:00:00Z') });
}
function check(e: Evaluation, id: QualificationCheck['id']): QualificationCheck {
  const c = e.checks.find((x) => x.id === id);
  if (!c) throw new Error(`no ${id} check; not applicable: ${JSON.stringify(e.notApplicable)}`);
  return c;
}

describe('verdict rules (the product definition; common practice, no source)', () => {
  it('reads a margin against the band: below 0 fails, below the band is marginal, at the band passes', () => {
    expect(verdictOfMargin(-0.01, 5)).toBe('fail');
    expect(verdictOfMargin(0, 5)).toBe('marginal');
    expect(verdictOfMargin(4.99, 5)).toBe('marginal');
    expect(verdictOfMargin(5, 5)).toBe('pass');
  });

  it('overall: fail before no data before marginal before pass', () => {
    const v = (...verdicts: QualificationCheck['verdict'][]) => overallVerdict(verdicts.map((verdict) => ({ verdict })));
    expect(v('pass', 'marginal', 'no-data', 'fail')).toBe('fail');
    expect(v('pass', 'marginal', 'no-data')).toBe('no-data');
    expect(v('pass', 'marginal')).toBe('marginal');
    expect(v('pass', 'pass')).toBe('pass');
  });
});

describe('Zener-voltage window at iRef', () => {
  it('at iRef = izt the window is the card’s own; 4.90 V is 1.03 % above 4.85 V: marginal with a 5 % band, pass with 1 %', () => {
    const c = check(run(), 'vz-window');
    expect(c.range).toEqual({ low: 4.9, high: 5.3 });
    // low end (4.90 − 4.85)/4.85 = 1.0309 %; high end (5.36 − 5.30)/5.36 = 1.1194 %: the low end binds
    expect(c.margin).toBeCloseTo(((4.9 - 4.85) / 4.85) * 100, 9);
    expect(c).toMatchObject({ value: 4.9, limit: 4.85, verdict: 'marginal', limitKind: 'window', window: { min: 4.85, max: 5.36 } });
    expect(check(run(spec({ marginalBandPercent: 1 })), 'vz-window').verdict).toBe('pass');
  });

  it('moves the window to a spec current of 10 mA along the fitted curve: + a·ln 2 + RS·5 mA', () => {
    const shift = A * Math.log(2) + RS * 5e-3; // 0.1629 V
    const c = check(run(spec({ iRef: 10e-3, vz: { min: 5.0, nom: 5.26, max: 5.5 }, knee: { iKnee: 0.25e-3, maxRatio: 40, maxSpan: null } })), 'vz-window');
    expect(c.range!.low).toBeCloseTo(4.9 + shift, 9);
    expect(c.range!.high).toBeCloseTo(5.3 + shift, 9);
    // low margin (5.0629 − 5.0)/5.0 = 1.26 %; high (5.5 − 5.4629)/5.5 = 0.68 %: the high end binds
    expect(c.limit).toBe(5.5);
    expect(c.margin).toBeCloseTo(((5.5 - (5.3 + shift)) / 5.5) * 100, 9);
    expect(c.assumptions.join(' ')).toMatch(/moved from IZT/);
  });

  it('fails a part whose tolerance reaches past the window, and is no data without vzMax', () => {
    const c = check(run(undefined, { ...CARD, vzMax: 5.4 }), 'vz-window');
    expect(c.verdict).toBe('fail');
    expect(c.margin).toBeCloseTo(((5.36 - 5.4) / 5.36) * 100, 9);
    const missing = check(run(undefined, { ...CARD, vzMax: null }), 'vz-window');
    expect(missing).toMatchObject({ verdict: 'no-data', margin: null, value: null });
    expect(missing.detail).toMatch(/no VZ max/);
  });
});

describe('dynamic impedance at iRef', () => {
  it('is zzt at izt (the fit passes through the point): 40 Ω against 60 Ω is a 33.3 % margin', () => {
    const c = check(run(), 'zd');
    expect(c.value).toBeCloseTo(40, 9);
    expect(c.margin).toBeCloseTo((20 / 60) * 100, 9);
    expect(c.verdict).toBe('pass');
  });

  it('at 10 mA is a/10 mA + RS = 27.9 Ω; a card with no impedance is no data', () => {
    const c = check(run(spec({ iRef: 10e-3, vz: { min: 5.0, nom: 5.26, max: 5.5 }, knee: null })), 'zd');
    expect(c.value).toBeCloseTo(A / 10e-3 + RS, 9);
    const none = check(run(undefined, { ...CARD, zzt: null, izk: null, zzk: null }), 'zd');
    expect(none.verdict).toBe('no-data');
  });
});

describe('knee', () => {
  it('ratio at iKnee = izk is zzk/zzt = 500/40 = 12.5: 37.5 % inside 20, 4.2 % beyond 12', () => {
    const c = check(run(), 'knee-ratio');
    expect(c.value).toBeCloseTo(12.5, 9);
    expect(c.margin).toBeCloseTo(37.5, 9);
    const tight = check(run(spec({ knee: { iKnee: 0.25e-3, maxRatio: 12, maxSpan: null } })), 'knee-ratio');
    expect(tight.verdict).toBe('fail');
    expect(tight.margin).toBeCloseTo(((12 - 12.5) / 12) * 100, 9);
  });

  it('span over 1…20 mA at 25 °C is a·ln 20 + RS·19 mA = 0.663 V: fails 0.5 V, passes 0.7 V by 5.3 %', () => {
    const span = A * Math.log(20) + RS * 19e-3;
    const fails = check(run(spec({ knee: { iKnee: null, maxRatio: null, maxSpan: 0.5 } })), 'knee-span');
    expect(fails.value).toBeCloseTo(span, 9);
    expect(fails.verdict).toBe('fail');
    const passes = check(run(spec({ knee: { iKnee: null, maxRatio: null, maxSpan: 0.7 } })), 'knee-span');
    expect(passes.margin).toBeCloseTo(((0.7 - span) / 0.7) * 100, 9);
    expect(passes.verdict).toBe('pass');
  });

  it('is no data without a knee point on the card, never a pass from the one-point assumption', () => {
    const e = run(spec({ knee: { iKnee: 0.25e-3, maxRatio: 20, maxSpan: 0.7 } }), { ...CARD, izk: null, zzk: null });
    expect(check(e, 'knee-ratio')).toMatchObject({ verdict: 'no-data' });
    expect(check(e, 'knee-span')).toMatchObject({ verdict: 'no-data' });
    expect(check(e, 'knee-ratio').detail).toMatch(/no knee point/);
    expect(e.overall).toBe('no-data');
  });

  it('when the two points need RS < 0, joins them without understating the knee: the ratio at the card’s own currents is zzk/zzt', () => {
    // 84 Ω at 5 mA and 1700 Ω at 0.25 mA need RS = 84 − a/5 mA < 0 (a = 1616·0.25e-3·5e-3/4.75e-3 = 0.425 V)
    const card = { ...CARD, zzt: 84, zzk: 1700 };
    const c = check(run(spec({ zdMax: 100, knee: { iKnee: 0.25e-3, maxRatio: 25, maxSpan: null } }), card), 'knee-ratio');
    expect(c.value).toBeCloseTo(1700 / 84, 9);
    // the clamped fit (RS = 0) would give 5 mA/0.25 mA = 20, below what the card states
    expect(c.value!).toBeGreaterThan(20);
    expect(c.assumptions[0]).toMatch(/RS < 0/);
  });
});

describe('leakage at the spec’s reverse voltage', () => {
  it('1 µA at 2 V against 2 µA at 2 V: 50 % margin', () => {
    const c = check(run(), 'leakage');
    expect(c).toMatchObject({ value: 1e-6, limit: 2e-6, verdict: 'pass' });
    expect(c.margin).toBeCloseTo(50, 9);
  });

  it('a figure at a lower voltage than the spec’s is no data, never a pass', () => {
    const c = check(run(undefined, { ...CARD, vr: 1, irMax: 0.1e-6 }), 'leakage');
    expect(c.verdict).toBe('no-data');
    expect(c.detail).toMatch(/below the spec's 2\.00 V/);
  });

  it('a figure at a higher voltage bounds it (leakage rises with reverse voltage; common practice, no source)', () => {
    const ok = check(run(undefined, { ...CARD, vr: 3, irMax: 1e-6 }), 'leakage');
    expect(ok.verdict).toBe('pass');
    expect(ok.assumptions[0]).toMatch(/bounds the leakage/);
    const over = check(run(undefined, { ...CARD, vr: 3, irMax: 3e-6 }), 'leakage');
    expect(over.verdict).toBe('fail');
    expect(over.margin).toBeCloseTo(-50, 9);
    // 1.95 µA is 2.5 % under the limit: marginal with the 5 % band
    expect(check(run(undefined, { ...CARD, irMax: 1.95e-6 }), 'leakage').verdict).toBe('marginal');
  });
});

describe('temperature coefficient and mechanism', () => {
  it('+0.3 mV/K in −1…+3 mV/K: 1.3 mV/K to the nearer end, 43.3 % of the larger end', () => {
    const e = run();
    const c = check(e, 'tc');
    expect(c.value).toBeCloseTo(0.3e-3, 15);
    expect(c.margin).toBeCloseTo((1.3e-3 / 3e-3) * 100, 9);
    expect(c.verdict).toBe('pass');
    // 5.1 V lies between tunnelling (below about 5 V) and avalanche (above about 6 V) (common practice, no source)
    expect(e.mechanism).toBe('mixed');
    expect(c.detail).toMatch(/mixed breakdown/);
  });

  it('0.06 %/K of 5.1 V is 3.06 mV/K: 2 % beyond the window’s +3 mV/K', () => {
    const c = check(run(undefined, { ...CARD, tc: tcVoltsPerKelvin({ value: 0.06, unit: '%/K' }, CARD.vzNom) }), 'tc');
    expect(c.value).toBeCloseTo(3.06e-3, 12);
    expect(c.margin).toBeCloseTo(-2, 9);
    expect(c.verdict).toBe('fail');
  });

  it('warns when the sign disagrees with the mechanism: a 3.3 V (tunnelling) part drifting up with heat (common practice, no source)', () => {
    const card = { ...CARD, vzMin: 3.1, vzNom: 3.3, vzMax: 3.5, vr: 1, zzt: 80, zzk: 1200, tc: 0.5e-3 };
    const e = run(spec({ vz: { min: 3.0, nom: 3.3, max: 3.6 }, zdMax: 100, leakage: { irMax: 5e-6, vr: 1 }, knee: null }), card);
    expect(e.mechanism).toBe('tunnelling');
    expect(check(e, 'tc').warnings[0]).toMatch(/tc is positive but a 3\.3 V part breaks down mainly by tunnelling/);
  });

  it('is no data without a coefficient on the card', () => {
    expect(check(run(undefined, { ...CARD, tc: null }), 'tc').verdict).toBe('no-data');
  });
});

describe('output window over the envelope', () => {
  // One current, the test current itself: the log and RS terms vanish, so V(Tj) = vz + α·(Tj − 25 °C)
  // and Tj = Ta + RthJA·V·I has the exact solution Tj = (Ta + Rth·I·(vz − 25α))/(1 − Rth·I·α)
  // (steady state of the junction-to-ambient thermal resistance, as JEDEC JESD51-1 defines it; quoted from memory).
  const alpha = 0.3e-3;
  const rthI = 250 * 5e-3;
  const tj = (ta: number, vz: number) => (ta + rthI * (vz - 25 * alpha)) / (1 - rthI * alpha);
  const vHigh = 5.3 + alpha * (tj(85, 5.3) - 25); // 5.3200 V at 85 °C, Tj 91.65 °C
  const vLow = 4.9 + alpha * (tj(-40, 4.9) - 25); // 4.8823 V at −40 °C, Tj −33.90 °C
  const single = { iMin: 5e-3, iMax: 5e-3, taMin: -40, taMax: 85 };

  it('takes tolerance, ambient and self-heating: 4.882…5.320 V, 1.48 % under 5.4 V (marginal with a 5 % band)', () => {
    const c = check(run(spec({ envelope: single, outputWindow: { vMin: 4.8, vMax: 5.4 } })), 'output-window');
    expect(c.range!.low).toBeCloseTo(vLow, 9);
    expect(c.range!.high).toBeCloseTo(vHigh, 9);
    expect(c.limit).toBe(5.4);
    expect(c.margin).toBeCloseTo(((5.4 - vHigh) / 5.4) * 100, 9);
    expect(c.verdict).toBe('marginal');
    expect(check(run(spec({ envelope: single, outputWindow: { vMin: 4.5, vMax: 5.8 } })), 'output-window').verdict).toBe('pass');
  });

  it('is no data without rthJA (no self-heating) and fails when the junction runs away thermally', () => {
    const s = spec({ envelope: single, outputWindow: { vMin: 4.5, vMax: 5.8 } });
    expect(check(run(s, { ...CARD, rthJA: null }), 'output-window')).toMatchObject({ verdict: 'no-data' });
    // loop gain Rth·I·α = 1000 K/W · 5 mA · 0.25 V/K ≥ 1: no steady state at any corner
    const runaway = check(run(s, { ...CARD, rthJA: 1000, tc: 250e-3 }), 'output-window');
    expect(runaway.verdict).toBe('fail');
    expect(runaway.detail).toMatch(/thermal runaway/);
  });

  it('is listed as not applicable when the spec sets no output window', () => {
    const e = run();
    expect(e.checks.some((c) => c.id === 'output-window')).toBe(false);
    expect(e.notApplicable).toContainEqual({ id: 'output-window', label: expect.any(String), reason: expect.stringMatching(/no output window/) });
    expect(e.window).not.toBeNull(); // the band is still computed for the Compare chart
  });
});

describe('power', () => {
  // No rthJA and no tc: Tj = Ta, and with one impedance point a = zzt·izt = 0.05 V, RS = 0.
  const card: EngineeringCardInput = { vzNom: 5.1, vzMin: 4.9, vzMax: 5.3, izt: 5e-3, zzt: 10, pdMax: 0.5, pdRefC: 25, tjMax: 150 };
  // At 20 mA and 85 °C: V = 5.3 + 0.05·(358.15/298.15)·ln 4 (a follows absolute temperature) → P = V·20 mA = 0.1077 W;
  // the rating derated linearly from 25 °C to zero at 150 °C is 0.5·65/125 = 0.26 W (common practice: datasheet derating curve, no source).
  const v85 = 5.3 + 0.05 * ((85 + 273.15) / (25 + 273.15)) * Math.log(4);
  const p85 = v85 * 20e-3;
  const derated = (0.5 * (150 - 85)) / (150 - 25);

  it('worst case at the hottest ambient against half the derated rating: 0.1077 W of 0.13 W, 17.2 % margin', () => {
    expect(K_OVER_Q * 298.15).toBeCloseTo(0.025693, 6); // Vt at 25 °C (CODATA 2018 constants)
    const c = check(run(spec({ tc: null }), card), 'power-dissipation');
    expect(c.value).toBeCloseTo(p85, 9);
    expect(c.limit).toBeCloseTo(0.5 * derated, 12);
    expect(c.margin).toBeCloseTo(((0.5 * derated - p85) / (0.5 * derated)) * 100, 9);
    expect(c.verdict).toBe('pass');
  });

  it('a stricter policy (40 % of the derated rating, 0.104 W) fails it', () => {
    const c = check(run(spec({ tc: null, power: { pdMin: 0.3, deratingFraction: 0.4 } }), card), 'power-dissipation');
    expect(c.verdict).toBe('fail');
    expect(c.margin).toBeCloseTo(((0.4 * derated - p85) / (0.4 * derated)) * 100, 9);
  });

  it('no rating to derate is no data; the rating check meets 0.5 W ≥ 0.3 W, fails 0.6 W, and meets a rating equal to the minimum', () => {
    const bare = { ...card, pdMax: null, tjMax: null };
    expect(check(run(spec({ tc: null }), bare), 'power-dissipation').verdict).toBe('no-data');
    expect(check(run(spec({ tc: null }), bare), 'power-rating').verdict).toBe('no-data');
    const rating = check(run(spec({ tc: null }), card), 'power-rating');
    expect(rating.margin).toBeCloseTo((0.2 / 0.3) * 100, 9);
    expect(check(run(spec({ tc: null, power: { pdMin: 0.6, deratingFraction: 0.5 } }), card), 'power-rating').verdict).toBe('fail');
    expect(check(run(spec({ tc: null, power: { pdMin: 0.5, deratingFraction: 0.5 } }), card), 'power-rating')).toMatchObject({ verdict: 'pass', margin: 0 });
  });
});

describe('package', () => {
  it('passes an allowed package whatever its case, fails another, no data without one, not applicable with an empty list', () => {
    expect(check(run(undefined, CARD, 'sod-123'), 'package').verdict).toBe('pass');
    expect(check(run(undefined, CARD, 'SMA'), 'package')).toMatchObject({ verdict: 'fail', text: { value: 'SMA', allowed: ['SOD-123', 'SOD-323'] } });
    expect(check(run(undefined, CARD, null), 'package').verdict).toBe('no-data');
    expect(run(spec({ packages: [] })).notApplicable.map((s) => s.id)).toContain('package');
  });
});

describe('the whole evaluation', () => {
  it('a clean card passes every check, records the versions and carries the caution', () => {
    const e = run(spec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } }));
    expect(e.checks.map((c) => [c.id, c.verdict])).toEqual([
      ['vz-window', 'pass'],
      ['zd', 'pass'],
      ['knee-ratio', 'pass'],
      ['leakage', 'pass'],
      ['tc', 'pass'],
      ['power-dissipation', 'pass'],
      ['power-rating', 'pass'],
      ['package', 'pass'],
    ]);
    expect(e).toMatchObject({ overall: 'pass', specVersion: 3, cardVersion: 7, marginalBandPercent: 5, evaluatedAt: '2026-12-01T10:00:00.000Z' });
    expect(e.caution).toMatch(/confirm by measurement/);
    expect(e.notApplicable.map((s) => s.id)).toEqual(['knee-span', 'output-window']);
  });

  it('overall is marginal, fail or no data as its checks say, naming them', () => {
    expect(run()).toMatchObject({ overall: 'marginal', summary: expect.stringMatching(/zener voltage/i) });
    const fail = run(undefined, CARD, 'SMA');
    expect(fail.overall).toBe('fail');
    expect(fail.summary).toMatch(/^Fails: package/);
    const noData = run(spec({ vz: { min: 4.6, nom: 5.1, max: 5.6 } }), { ...CARD, vr: 1 });
    expect(noData.overall).toBe('no-data');
    expect(noData.summary).toMatch(/reverse leakage/);
  });

  it('a card without vzNom/izt gives no data everywhere but the package', () => {
    const e = run(undefined, null, 'SOD-123');
    expect(e.model).toBeNull();
    expect(e.checks.filter((c) => c.verdict !== 'no-data').map((c) => c.id)).toEqual(['package']);
    expect(e.overall).toBe('no-data');
  });
});
