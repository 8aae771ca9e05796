import { fitBreakdownModel } from './breakdown-model';
import { spiceModelLine } from './spice-model';

describe('the SPICE .model line', () => {
  const model = fitBreakdownModel({ vzNom: 6.8, vzMin: 6.46, vzMax: 7.14, izt: 0.02, zzt: 5, izk: 0.004, zzk: 20, tc: 3.4e-3, rthJA: 250 });

  it('carries BV, IBV, NBV, RS and the coefficient as ngspice reads it (TCV = −αVz with TLEV=0, TNOM=25)', () => {
    // BV = 6.8 − 1.25 Ω × 20 mA = 6.775 V; NBV = 0.075 V / 25.6926 mV (hand calculation).
    expect(spiceModelLine(model)).toMatch(/^\.model DZ D\(BV=6\.775 IBV=0\.02 NBV=2\.9191\d* RS=1\.25 TCV=-0\.0034 TLEV=0 TNOM=25\)$/);
  });

  it('never writes a bare "m" or "M" suffix, which SPICE reads as milli', () => {
    expect(spiceModelLine(model)).not.toMatch(/\d[mM]\b/);
    const tiny = fitBreakdownModel({ vzNom: 3.3, izt: 1e-4, zzt: 900 });
    expect(spiceModelLine(tiny)).toMatch(/IBV=0\.0001 /);
  });

  it('exports the tolerance ends and the thermal resistance on request; cleans the name', () => {
    expect(spiceModelLine(model, { corner: 'min' })).toMatch(/BV=6\.435 /);
    expect(spiceModelLine(model, { corner: 'max' })).toMatch(/BV=7\.115 /);
    expect(spiceModelLine(model, { thermal: true })).toMatch(/ RTH0=250\)$/);
    expect(spiceModelLine(model, { name: 'ZX-5V1 (alt)' })).toMatch(/^\.model ZX_5V1__alt_ D\(/);
  });
});
