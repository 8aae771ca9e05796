import { describe, expect, it } from 'vitest';
import { specSchema } from '../parts/spec.schema';
import { engineeringCardContradictions } from '../engineering/card.schema';
import { envelopeSchema } from '../engineering/envelope.schema';
import { fieldName, fieldValue, issueMessage } from './field-labels';

// Values with SI prefixes (BIPM SI Brochure, 9th edition): 0.0051 V = 5.1 mV, 0.01 A = 10 mA.
describe('messages name fields by their labels and values with prefixes and units', () => {
  it('finds the label behind any request path', () => {
    expect(fieldName('spec.vz.min')).toBe('VZ min');
    expect(fieldName('card.vzMax')).toBe('VZ max');
    expect(fieldName(['fields', 'izt', 'value'])).toBe('IZT');
    expect(fieldName('spec.envelope.iMin')).toBe('Current from');
    expect(fieldName('supply.min')).toBe('Lowest supply');
    expect(fieldValue('vz.nom', 0.0051)).toBe('5.1 mV');
    expect(fieldValue('envelope.iMin', 0.01)).toBe('10 mA');
    expect(fieldValue('power.deratingFraction', 0.5)).toBe('50 %');
  });

  it('the spec rules read in the form’s words', () => {
    const spec = {
      iRef: 0.005,
      vz: { min: 6, nom: 0.0051, max: 6.2 },
      envelope: { iMin: 0.01, iMax: 0.002, taMin: -40, taMax: 85 },
    };
    const messages = specSchema.safeParse(spec).error!.issues.map((i) => i.message);
    expect(messages).toContain('VZ min (6 V) is above VZ nom (5.1 mV)');
    expect(messages).toContain('Current from (10 mA) is above Current to (2 mA)');
    expect(messages.join(' ')).not.toMatch(/vz\.min|iMin|0\.0051/);
    expect(envelopeSchema.safeParse({ iMin: 1e-3, iMax: 2e-3, taMin: 90, taMax: 85 }).error!.issues[0].message).toBe(
      'Ambient from (90 °C) is above Ambient to (85 °C)',
    );
    expect(engineeringCardContradictions({ vzNom: 5.1, vzMin: 5.3, izt: 0.005 } as never)[0].message).toBe('VZ min (5.3 V) is above VZ nom (5.1 V)');
  });

  it('rewords zod’s generic messages', () => {
    const issue = specSchema
      .safeParse({ iRef: 0.005, vz: { min: 4.8, nom: 5.1, max: -1 }, envelope: { iMin: 1e-3, iMax: 2e-3, taMin: 0, taMax: 85 } })
      .error!.issues.find((i) => i.path.join('.') === 'vz.max')!;
    // a Zener voltage is held to the physical bounds (units/bounds.ts): named by its label, the range in units
    expect(issueMessage({ ...issue, path: ['spec', ...issue.path] })).toBe('VZ max must be between 0.5 and 1000 V');
    expect(
      issueMessage({
        code: 'too_big',
        origin: 'number',
        maximum: 1,
        inclusive: true,
        path: ['spec', 'power', 'deratingFraction'],
        message: 'Too big: expected number to be <=1',
      }),
    ).toBe('Share of derated power must be at most 100 %');
    expect(issueMessage({ code: 'invalid_type', expected: 'number', path: ['card', 'izt'], message: 'Invalid input: expected number, received string' })).toBe(
      'IZT: give a number',
    );
    // the contracts' own messages pass unchanged
    expect(issueMessage({ code: 'custom', path: ['x'], message: 'Give the knee current' })).toBe('Give the knee current');
  });
});
