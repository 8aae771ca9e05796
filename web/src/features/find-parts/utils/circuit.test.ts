import { regulatorRequestSchema } from '@shuntwise/contracts';
import { describe, expect, it } from 'vitest';
import { regulatorAnswer, searchItem } from '../testing/fixtures';
import {
  describeRange,
  EMPTY_CIRCUIT,
  regulatorRequest,
  simpleFinding,
  simpleOmissions,
  supplyAround,
  toCircuit,
  validateCircuit,
  type CircuitValues,
} from './circuit';

const filled: CircuitValues = { ...EMPTY_CIRCUIT, supplyMin: 10.8, supplyNom: 12, supplyMax: 13.2, loadMin: 0, loadMax: 0.02 };

describe('circuit form values', () => {
  it('names every missing value, and one that does not read', () => {
    expect(validateCircuit(EMPTY_CIRCUIT)).toEqual({
      supplyMin: 'Enter the lowest supply voltage',
      supplyMax: 'Enter the highest supply voltage',
      loadMax: 'Enter the largest load current',
    });
    expect(validateCircuit({ ...filled, loadMax: NaN }).loadMax).toMatch(/Does not read/);
    expect(toCircuit({ ...filled, loadMax: NaN })).toBeNull();
  });

  it("applies the contract's own rules with its wording (min above max)", () => {
    expect(validateCircuit({ ...filled, supplyMin: 14 })).toMatchObject({ supplyMin: 'Lowest supply (14 V) is above Highest supply (13.2 V)' });
    expect(validateCircuit({ ...filled, supplyNom: 20 })).toMatchObject({ supplyNom: 'Nominal supply (20 V) lies outside 10.8 V … 13.2 V' });
    expect(validateCircuit({ ...filled, ambientMin: 90 })).toMatchObject({
      ambientMin: expect.stringMatching(/Lowest ambient \(90 °C\) is above Highest ambient/),
    });
    expect(validateCircuit(filled)).toEqual({});
  });

  it('builds a request the API schema accepts, with the card fields the core reads and nothing else', () => {
    const request = regulatorRequest(toCircuit(filled)!, searchItem(1, 'BRZ05-5V1').card!);
    expect(() => regulatorRequestSchema.parse(request)).not.toThrow();
    expect(request).toMatchObject({
      supply: { min: 10.8, nom: 12, max: 13.2 },
      load: { min: 0, max: 0.02 },
      ambient: { min: -20, max: 70 },
      resistor: { series: 'E24', tolerance: 0.05 },
    });
    expect(Object.keys(request.card)).not.toContain('tolerance');
    expect(toCircuit({ ...filled, supplyNom: null })!.supply).toEqual({ min: 10.8, max: 13.2 });
  });

  it('fills the supply range from a nominal and a ± fraction (12 V ± 10 % is 10.8 V … 13.2 V; arithmetic)', () => {
    expect(supplyAround(12, 0.1)).toEqual({ min: 10.8, max: 13.2 });
    expect(supplyAround(24, 0.05)).toEqual({ min: 22.8, max: 25.2 });
  });
});

describe('what the simple formula would do', () => {
  it('places its resistor against the working range: above it the knee is lost, below it the power', () => {
    expect(simpleFinding(regulatorAnswer()).verdict).toBe('too-high');
    expect(simpleFinding(regulatorAnswer()).message).toMatch(/276 Ω is above the largest working value 244 Ω/);
    expect(simpleFinding(regulatorAnswer({ simple: { ...regulatorAnswer().simple, resistance: 120 } })).verdict).toBe('too-low');
    expect(simpleFinding(regulatorAnswer({ simple: { ...regulatorAnswer().simple, resistance: 200 } })).verdict).toBe('inside');
    expect(simpleFinding(regulatorAnswer({ range: { ...regulatorAnswer().range, min: 300 } })).verdict).toBe('no-range');
    expect(simpleFinding(regulatorAnswer({ simple: { ...regulatorAnswer().simple, resistance: null } })).verdict).toBe('none');
  });
});

describe('the working range as text', () => {
  it('reads min … max, or says why there is none when the power needs more than the knee allows', () => {
    expect(describeRange(regulatorAnswer().range)).toBe('137 Ω … 244 Ω');
    expect(describeRange({ ...regulatorAnswer().range, min: 368, max: 93.3 })).toBe('none: power needs ≥ 368 Ω, the knee ≤ 93.3 Ω');
  });

  it('reads as finished text when an end is missing, never a question mark', () => {
    const upOnly = describeRange({ ...regulatorAnswer().range, min: null });
    expect(upOnly).toBe('up to 244 Ω; no lower end, as the card gives no power limit');
    const none = describeRange({ ...regulatorAnswer().range, max: null });
    expect(none).toMatch(/^none: the lowest supply/);
    const neither = describeRange({ ...regulatorAnswer().range, min: null, max: null });
    for (const text of [upOnly, none, neither]) expect(text).not.toContain('?');
  });
});

// Typography of the displayed numbers: true minus U+2212 (ISO 80000-1, from memory) and the
// coefficient in mV/K as datasheets state it (common practice, no source).
describe('what the simple formula leaves out, in the shared formatter’s words', () => {
  it('writes negative ambients with a true minus, tc in mV/K and percentages alike', () => {
    const card = { ...searchItem(1, 'BRZ05-5V1').card!, tolerance: 0.05, tc: -0.0006 };
    const text = simpleOmissions(toCircuit(filled)!, card).join('\n');
    expect(text).toContain('(−0.60 mV/K) over −20 °C … 70 °C');
    expect(text).toContain('tolerance of ±5 % on VZ');
    expect(text).toContain('(±5 %)');
    expect(text).not.toMatch(/\d-|-\d/);
  });
});
