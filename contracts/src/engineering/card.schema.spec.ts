import { describe, expect, it } from 'vitest';
import { toEngineeringCard } from '../parts/rating-card.schema';
import { tcVoltsPerKelvin } from './card.schema';

describe('tcVoltsPerKelvin, the one conversion of a printed coefficient', () => {
  it('reads mV/K as given and %/K as a share of VZ nom (definition of a relative coefficient, common practice, no source)', () => {
    expect(tcVoltsPerKelvin({ value: -2.5, unit: 'mV/K' }, 3.3)).toBeCloseTo(-0.0025, 15);
    expect(tcVoltsPerKelvin({ value: 0.06, unit: '%/K' }, 10)).toBeCloseTo(0.006, 15);
  });
});

describe('toEngineeringCard', () => {
  const base = { vzNom: { value: 12 }, izt: { value: 0.005 } };

  it('takes the stored V/K as it is, without converting again', () => {
    const card = toEngineeringCard({ ...base, tc: { value: 0.06, unit: '%/K', voltsPerKelvin: 7.2e-3 } });
    expect(card!.tc).toBe(7.2e-3);
  });

  it('converts a draft’s printed tc with the card’s own VZ nom: 0.06 %/K of 12 V is 7.2 mV/K (definition, common practice, no source)', () => {
    expect(toEngineeringCard({ ...base, tc: { value: 0.06, unit: '%/K' } })!.tc).toBeCloseTo(7.2e-3, 15);
    expect(toEngineeringCard({ ...base, tc: { value: 0.3, unit: 'mV/K' } })!.tc).toBeCloseTo(3e-4, 15);
  });

  it('gives nothing without VZ nom or IZT, and null for the fields a card lacks', () => {
    expect(toEngineeringCard({ vzNom: { value: 12 } })).toBeNull();
    expect(toEngineeringCard(base)).toMatchObject({ vzNom: 12, izt: 0.005, tc: null, zzt: null });
  });
});
