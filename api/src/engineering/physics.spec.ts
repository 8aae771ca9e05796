import { BOLTZMANN, ELEMENTARY_CHARGE, K_OVER_Q, thermalVoltage } from './physics';

describe('physical constants (CODATA 2018, exact in the 2019 SI)', () => {
  it('k = 1.380649e-23 J/K and q = 1.602176634e-19 C exactly (CODATA 2018)', () => {
    expect(BOLTZMANN).toBe(1.380649e-23);
    expect(ELEMENTARY_CHARGE).toBe(1.602176634e-19);
  });

  it('k/q equals the published k in eV/K, 8.617333262e-5 (CODATA 2018)', () => {
    expect(K_OVER_Q).toBeCloseTo(8.617333262e-5, 14);
  });

  it('Vt at 25 °C (298.15 K) is 25.6926 mV (CODATA 2018 k/q × 298.15 K)', () => {
    expect(thermalVoltage(25)).toBeCloseTo(0.0256926, 7);
  });

  it('Vt at 0 °C is 23.5382 mV (CODATA 2018 k/q × 273.15 K)', () => {
    expect(thermalVoltage(0)).toBeCloseTo(0.0235382, 7);
  });
});
