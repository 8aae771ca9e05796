import fc from 'fast-check';
import { diodeVoltage, fitBreakdownModel } from './breakdown-model';
import { worstCaseWindow } from './envelope';
import { junctionTemperatureC } from './self-heating';
import { cardArbitrary, logUniform } from './testing/card-arbitraries';

describe('worst-case voltage window over an envelope', () => {
  it('a positive-tc part reaches its lowest at iMin, cold, vzMin and its highest at iMax, hot, vzMax', () => {
    const model = fitBreakdownModel({ vzNom: 12, vzMin: 11.4, vzMax: 12.6, izt: 0.02, zzt: 9, tc: 8.5e-3, rthJA: 300 });
    const w = worstCaseWindow(model, { iMin: 0.005, iMax: 0.03, taMin: -40, taMax: 85 });
    expect(w.atMin).toMatchObject({ current: 0.005, taC: -40, corner: 'min' });
    expect(w.atMax).toMatchObject({ current: 0.03, taC: 85, corner: 'max' });
    expect(w.toleranceIncluded).toBe(true);
    expect(w.selfHeating).toBe(true);
  });

  it('contains every point of the envelope (fast-check)', () => {
    fc.assert(
      fc.property(
        cardArbitrary,
        logUniform(1e-4, 0.01),
        logUniform(1, 10),
        fc.double({ min: -40, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (card, iMin, ratio, taMin, span, u, v) => {
          const model = fitBreakdownModel(card);
          const envelope = { iMin, iMax: iMin * ratio, taMin, taMax: taMin + span };
          const w = worstCaseWindow(model, envelope);
          const current = iMin * ratio ** u;
          const taC = taMin + span * v;
          for (const corner of ['min', 'nom', 'max'] as const) {
            const vz = diodeVoltage(model, current, junctionTemperatureC(model, current, taC, corner), corner);
            // Between current samples the curve can bend by a hair: allow 1 µV.
            expect(vz).toBeGreaterThanOrEqual(w.vMin - 1e-6);
            expect(vz).toBeLessThanOrEqual(w.vMax + 1e-6);
          }
        },
      ),
    );
  });

  it('says when tolerance or rthJA is missing', () => {
    const model = fitBreakdownModel({ vzNom: 5.1, izt: 0.02, zzt: 17 });
    const w = worstCaseWindow(model, { iMin: 0.01, iMax: 0.02, taMin: 0, taMax: 50 });
    expect(w.toleranceIncluded).toBe(false);
    expect(w.warnings.join(' ')).toMatch(/VZ min or VZ max.*no RthJA/);
  });
});
