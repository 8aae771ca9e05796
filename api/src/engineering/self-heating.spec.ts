import fc from 'fast-check';
import { diodeVoltage, fitBreakdownModel, voltageTempSlope } from './breakdown-model';
import { junctionTemperatureC, voltageAtAmbient } from './self-heating';
import { cardArbitrary, logUniform } from './testing/card-arbitraries';

describe('self-heating Tj = Ta + RthJA·Vz·I', () => {
  it('converges to the fixed point of the heating equation (DESIGN: iterate to convergence)', () => {
    fc.assert(
      fc.property(
        cardArbitrary.filter((c) => c.rthJA != null),
        logUniform(1e-4, 0.05),
        fc.double({ min: -40, max: 85, noNaN: true }),
        (card, current, taC) => {
          const model = fitBreakdownModel(card);
          const tj = junctionTemperatureC(model, current, taC);
          // No steady state only when heating feeds back at least one kelvin per kelvin.
          if (Number.isNaN(tj)) expect(card.rthJA! * current * voltageTempSlope(model, current)).toBeGreaterThanOrEqual(1);
          else expect(Math.abs(tj - (taC + card.rthJA! * diodeVoltage(model, current, tj) * current))).toBeLessThan(1e-6);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('a 5.1 V part at 20 mA and 300 K/W runs about 31 K above ambient (hand estimate 300 K/W × 5.1 V × 20 mA = 30.6 K)', () => {
    const model = fitBreakdownModel({ vzNom: 5.1, izt: 0.02, zzt: 17, rthJA: 300 });
    expect(junctionTemperatureC(model, 0.02, 25) - 25).toBeCloseTo(30.6, 0);
  });

  it('is Ta without rthJA, and when self-heating is off', () => {
    const model = fitBreakdownModel({ vzNom: 5.1, izt: 0.02, zzt: 17, tc: (0.03 / 100) * 5.1 });
    expect(junctionTemperatureC(model, 0.02, 60)).toBe(60);
    const heated = fitBreakdownModel({ vzNom: 5.1, izt: 0.02, zzt: 17, tc: (0.03 / 100) * 5.1, rthJA: 300 });
    expect(voltageAtAmbient(heated, 0.02, 60, 'nom', false)).toBe(diodeVoltage(heated, 0.02, 60));
  });

  it('reports thermal runaway as NaN when RthJA·I·dV/dT reaches 1', () => {
    // 100 V part with +0.1 %/K (0.1 V/K) at 0.5 A and 100 K/W: RthJA·I·αVz = 5.
    const model = fitBreakdownModel({ vzNom: 100, izt: 0.5, zzt: 10, tc: (0.1 / 100) * 100, rthJA: 100 });
    expect(junctionTemperatureC(model, 0.5, 25)).toBeNaN();
  });
});
