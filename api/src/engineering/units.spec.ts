// The engine reads datasheet text through the shared parser in contracts; these properties
// check that what the UI prints is read back to the same SI value.
import fc from 'fast-check';
import { formatQuantity, parseQuantity, QUANTITY_KINDS, type QuantityKind } from '@shuntwise/contracts';

const PREFIXED: QuantityKind[] = ['voltage', 'current', 'resistance', 'power'];

describe('unit parsing round-trips through formatting (fast-check)', () => {
  it('parse(format(x)) equals x to the printed digits, for every kind and sign', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...QUANTITY_KINDS),
        fc.double({ min: Math.log(1e-11), max: Math.log(1e8), noNaN: true }),
        fc.boolean(),
        fc.integer({ min: 2, max: 6 }),
        (kind, logMagnitude, negative, digits) => {
          const x = (negative ? -1 : 1) * Math.exp(logMagnitude);
          const text = formatQuantity(x, kind, { digits });
          const back = parseQuantity(text, kind, { field: 'x' });
          // Rounding to `digits` significant figures moves x by at most half a unit in the last place;
          // a coefficient below 1 mV/K is printed with one figure fewer (contracts/units/format.ts).
          const figures = kind === 'tempCoVoltage' && Math.abs(x) < 1e-3 ? Math.max(2, digits - 1) : digits;
          expect(Math.abs(back - x)).toBeLessThanOrEqual(Math.abs(x) * 5 * 10 ** -figures * (1 + 1e-9));
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('prefixed kinds print within 1…999 of their prefix (engineering notation, SI prefixes)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...PREFIXED), fc.double({ min: Math.log(1e-11), max: Math.log(1e8), noNaN: true }), (kind, logMagnitude) => {
        const text = formatQuantity(Math.exp(logMagnitude), kind);
        const mantissa = Number(/^[0-9.]+/.exec(text)![0]);
        expect(mantissa).toBeGreaterThanOrEqual(1);
        expect(mantissa).toBeLessThan(1000);
        expect(text).not.toMatch(/e[+-]/);
      }),
    );
  });

  it('temperature coefficients always print in mV/K, as datasheets state them', () => {
    fc.assert(
      fc.property(fc.double({ min: Math.log(1e-9), max: Math.log(1), noNaN: true }), fc.boolean(), (logMagnitude, negative) => {
        const text = formatQuantity((negative ? -1 : 1) * Math.exp(logMagnitude), 'tempCoVoltage');
        expect(text).toMatch(/^\u2212?[0-9.]+ mV\/K$/);
      }),
    );
  });
});
