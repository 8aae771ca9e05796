import { specSchema } from '@shuntwise/contracts';
import { compareCurves, compareTemperatures, currentGrid } from './compare-curves';

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
});
