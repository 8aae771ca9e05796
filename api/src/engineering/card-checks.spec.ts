import type { CardIssue, EngineeringCard } from '@shuntwise/contracts';
import { checkCard } from './card-checks';

const good: EngineeringCard = {
  vzNom: 5.1,
  vzMin: 4.85,
  vzMax: 5.36,
  izt: 0.02,
  zzt: 17,
  izk: 0.001,
  zzk: 550,
  irMax: 2e-6,
  vr: 2,
  tc: (0.03 / 100) * 5.1,
  pdMax: 0.5,
  tjMax: 175,
  rthJA: 300,
  izm: 0.089,
};

function fields(issues: CardIssue[], severity: CardIssue['severity']): string[] {
  return issues.filter((i) => i.severity === severity).map((i) => i.field);
}

describe('card sanity checks name their field', () => {
  it('a complete, consistent card has no findings', () => {
    expect(checkCard(good)).toEqual([]);
  });

  it('contradictions are errors: vzMin ≤ vzNom ≤ vzMax, izk < izt, vr below vz, izm ≥ izt, tjMax above the rating temperature', () => {
    const issues = checkCard({ ...good, vzMin: 5.2, vzMax: 5.0, izk: 0.02, zzk: 100, vr: 5.1, izm: 0.01, tjMax: 20 });
    expect(fields(issues, 'error')).toEqual(['vzMin', 'vzMax', 'izk', 'vr', 'izm', 'tjMax']);
    expect(issues[0].message).toMatch(/VZ min \(5\.2 V\) is above VZ nom \(5\.1 V\)/);
  });

  it('an impedance too large for the voltage is an error (zzt·izt ≥ vzNom)', () => {
    expect(fields(checkCard({ ...good, zzt: 300 }), 'error')).toContain('zzt');
  });

  it('zzk below zzt is a warning: the fit ignores the knee point (a junction’s Zd falls with current)', () => {
    expect(fields(checkCard({ ...good, zzk: 10 }), 'warning')).toEqual(['zzk']);
  });

  it('names an implausible tc in mV/K and %/K with true minus signs (U+2212; common practice, no source)', () => {
    const issues = checkCard({ ...good, tc: -12e-3 }); // −12 mV/K;
    const message = issues.find((i) => i.field === 'tc' && /beyond the usual/.test(i.message))!.message;
    expect(message).toMatch(/^tc \u221212\.0 mV\/K is \u22120\.\d{3} %\/K of VZ/);
    expect(message).not.toMatch(/-\d/);
  });

  it('a tc sign that disagrees with the mechanism is a warning on tc (common practice: negative below ~5 V, positive above ~6 V)', () => {
    const issues = checkCard({ ...good, vzNom: 3.3, vzMin: 3.1, vzMax: 3.5, vr: 1, tc: 2e-3 });
    expect(fields(issues, 'warning')).toEqual(['tc']);
  });

  it('implausible values and missing data are warnings on their fields', () => {
    const issues = checkCard({ vzNom: 250, izt: 0.02, tc: (0.5 / 100) * 250, irMax: 1e-6 });
    expect(fields(issues, 'error')).toEqual([]);
    expect(fields(issues, 'warning')).toEqual(['vzNom', 'vzMin', 'zzt', 'tc', 'vr', 'pdMax', 'rthJA']);
    expect(issues.find((i) => i.field === 'tc')!.message).toMatch(/check the unit/);
  });

  it('ratings that disagree with each other are warnings (izm·vz vs pdMax, (tjMax − 25 °C)/RthJA vs pdMax)', () => {
    expect(fields(checkCard({ ...good, izm: 0.2 }), 'warning')).toEqual(['izm']);
    expect(fields(checkCard({ ...good, rthJA: 150 }), 'warning')).toEqual(['rthJA']);
  });
});
