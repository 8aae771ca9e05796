import { specSchema } from '@shuntwise/contracts';
import { compareCurves, comparePowerLimit, compareTemperatures, currentGrid } from './compare-curves';

const spec = specSchema.parse({
  iRef: 5e-3,
  vz: { min: 4.85, nom: 5.1, max: 5.36 },
  knee: { iKnee: 0.25e-3, maxRatio: 20, maxSpan: null },
  envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
});

describe('Compare chart data', () => {
  it('grids the currents from half the knee current to 1.5 × iMax, log-spaced, with the spec’s currents on it', () => {
    const grid = currentGrid(spec);
    expect(grid[0]).toBeCloseTo(0.125e-3, 15);
    expect(grid[grid.length - 1]).toBeCloseTo(30e-3, 15);
    for (const i of [0.25e-3, 1e-3, 5e-3, 20e-3]) expect(grid).toContain(i);
    for (let k = 1; k < grid.length; k++) expect(grid[k]).toBeGreaterThan(grid[k - 1]);
    expect(compareTemperatures(spec)).toEqual([-40, 25, 85]);
  });

  it('draws each ambient’s curve; without rthJA Tj = Ta, so at izt V = vz + αVz·(Ta − 25 °C) (DESIGN.md temperature law, common practice, no source)', () => {
    const card = { vzNom: 5.1, vzMin: 4.9, vzMax: 5.3, izt: 5e-3, zzt: 40, izk: 0.25e-3, zzk: 500, tc: 0.3e-3 };
    const curves = compareCurves(card, [1e-3, 5e-3, 20e-3], [-40, 25, 85]);
    expect(curves.map((c) => c.tempC)).toEqual([-40, 25, 85]);
    const atIzt = (t: number) => curves.find((c) => c.tempC === t)!.points[1];
    expect(atIzt(25)).toMatchObject({ current: 5e-3, tjC: 25, vzNom: 5.1, vzMin: 4.9, vzMax: 5.3, zd: expect.any(Number) });
    expect(atIzt(85).vzNom).toBeCloseTo(5.1 + 0.3e-3 * 60, 12);
    expect(atIzt(-40).vzMax).toBeCloseTo(5.3 - 0.3e-3 * 65, 12);
    // Zd at izt and 25 °C is the card's zzt: the fit passes through its test point
    expect(atIzt(25).zd).toBeCloseTo(40, 9);
  });

  describe('each source’s own dissipation limit at the hottest ambient', () => {
    const base = { vzNom: 5.1, izt: 5e-3, zzt: 40 };
    const powered = specSchema.parse({ ...spec, power: { pdMin: 0.2, deratingFraction: 0.5 } });

    it('derates PD max linearly above 25 °C to zero at TJ max (hand calculation; linear derating is common practice, no source)', () => {
      // 500 mW, TJ max 150 °C, at 85 °C: 0.5 W × (150 − 85)/(150 − 25) = 0.26 W; half of it allowed = 0.13 W
      const a = comparePowerLimit({ ...base, pdMax: 0.5, tjMax: 150 }, powered);
      expect(a).toMatchObject({ ambientC: 85, basis: 'pdMax', policyFraction: 0.5 });
      expect(a.derated).toBeCloseTo(0.26, 12);
      expect(a.allowed).toBeCloseTo(0.13, 12);
      // 300 mW, TJ max 125 °C: 0.3 W × (125 − 85)/(125 − 25) = 0.12 W — a different limit from the part above
      const b = comparePowerLimit({ ...base, pdMax: 0.3, tjMax: 125 }, powered);
      expect(b.derated).toBeCloseTo(0.12, 12);
      expect(b.allowed).toBeCloseTo(0.06, 12);
    });

    it('takes (TJ max − Ta)/RthJA when it is lower, and says so (hand calculation, common practice, no source)', () => {
      // 500 mW to 150 °C gives 0.26 W at 85 °C; 400 K/W gives (150 − 85)/400 = 0.1625 W, the lower
      const c = comparePowerLimit({ ...base, pdMax: 0.5, tjMax: 150, rthJA: 400 }, powered);
      expect(c.basis).toBe('rthJA');
      expect(c.derated).toBeCloseTo(65 / 400, 12);
    });

    it('returns no number rather than a doubtful one: PD max without TJ max cannot be derated above 25 °C', () => {
      const d = comparePowerLimit({ ...base, pdMax: 0.5 }, powered);
      expect(d).toMatchObject({ derated: null, allowed: null, basis: 'none' });
      expect(d.reason).toMatch(/no TJ max/);
      // A spec without a power requirement still shows the derated rating, with no allowed share.
      expect(comparePowerLimit({ ...base, pdMax: 0.5, tjMax: 150 }, spec)).toMatchObject({ policyFraction: null, allowed: null });
    });
  });
});
