import { mechanismOf, mechanismSignWarning } from './mechanism';

describe('breakdown mechanism and the sign of the temperature coefficient', () => {
  it('labels tunnelling below about 5 V, avalanche above about 6 V, mixed between (common practice, no source)', () => {
    expect(mechanismOf(2.4)).toBe('tunnelling');
    expect(mechanismOf(4.7)).toBe('tunnelling');
    expect(mechanismOf(5.1)).toBe('mixed');
    expect(mechanismOf(5.6)).toBe('mixed');
    expect(mechanismOf(6.2)).toBe('avalanche');
    expect(mechanismOf(33)).toBe('avalanche');
  });

  it('below roughly 5 V the coefficient is negative, above roughly 6 V positive: the other sign is flagged (common practice, no source)', () => {
    expect(mechanismSignWarning(3.3, -0.0022)).toBeNull();
    expect(mechanismSignWarning(3.3, 0.0022)).toMatch(/positive .* tunnelling/);
    expect(mechanismSignWarning(12, 0.0085)).toBeNull();
    expect(mechanismSignWarning(12, -0.0085)).toMatch(/negative .* avalanche/);
    // Between 5 and 6 V either sign occurs.
    expect(mechanismSignWarning(5.6, 0.001)).toBeNull();
    expect(mechanismSignWarning(5.1, -0.0005)).toBeNull();
  });
});
