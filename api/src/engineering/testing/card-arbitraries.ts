// Test-only: fast-check generators of plausible, invented rating cards for the engineering specs.
import fc from 'fast-check';
import { tcVoltsPerKelvin, type EngineeringCard } from '@shuntwise/contracts';

/** Log-uniform double in [min, max]. */
export function logUniform(min: number, max: number): fc.Arbitrary<number> {
  return fc.double({ min: Math.log(min), max: Math.log(max), noNaN: true }).map((x) => Math.exp(x));
}

/**
 * Cards in the range datasheets print: 2.4…75 V, izt 1…50 mA, a junction slope zzt·izt of
 * 0.3…8 % of vz, an optional knee point 5…50× below izt with 1.5…60× zzt (which often
 * gives RS < 0 and exercises the clamp), a coefficient whose sign follows the mechanism,
 * ±1…10 % tolerance and thermal data. The slope is kept small enough that the model stays
 * above a third of vz at 0.1 mA, where the tests sweep.
 */
export const cardArbitrary: fc.Arbitrary<EngineeringCard> = fc
  .record({
    vzNom: logUniform(2.4, 75),
    izt: logUniform(1e-3, 50e-3),
    slopeFraction: logUniform(0.003, 0.08),
    knee: fc.option(fc.record({ ratio: logUniform(5, 50), zRatio: logUniform(1.5, 60) }), { nil: undefined }),
    tcPercent: logUniform(0.005, 0.09),
    tcUnit: fc.constantFrom('mV/K' as const, '%/K' as const),
    tolerance: logUniform(0.01, 0.1),
    rthJA: fc.option(logUniform(60, 450), { nil: undefined }),
  })
  .map(({ vzNom, izt, slopeFraction, knee, tcPercent, tcUnit, tolerance, rthJA }) => {
    const zzt = (slopeFraction * vzNom) / izt;
    // Below ~5 V the coefficient is negative, above ~6 V positive; in between either.
    const sign = vzNom < 5 ? -1 : vzNom > 6 ? 1 : vzNom < 5.5 ? -1 : 1;
    const alpha = (sign * tcPercent * vzNom) / 100; // V/K
    const card: EngineeringCard = {
      vzNom,
      vzMin: vzNom * (1 - tolerance),
      vzMax: vzNom * (1 + tolerance),
      izt,
      zzt,
      // As the card mapping hands it over: V/K, whichever unit the datasheet printed.
      tc: tcUnit === 'mV/K' ? tcVoltsPerKelvin({ value: alpha * 1e3, unit: 'mV/K' }, vzNom) : tcVoltsPerKelvin({ value: sign * tcPercent, unit: '%/K' }, vzNom),
      pdMax: 0.5,
      tjMax: 175,
      rthJA: rthJA ?? null,
    };
    if (knee) {
      card.izk = izt / knee.ratio;
      card.zzk = Math.min(zzt * knee.zRatio, (0.9 * vzNom) / card.izk);
    }
    return card;
  })
  .filter((card) => {
    // Every fit keeps NBV·Vt ≤ zzt·izt; keep V(0.1 mA) above a third of vz.
    return card.zzt! * card.izt * Math.log(card.izt / 1e-4) < (2 / 3) * card.vzNom;
  });
