import { z } from 'zod';

/**
 * Plausible ranges of the physical values Shuntwise accepts, in SI, with headroom around
 * voltage-regulator (Zener and avalanche) diodes and the circuits around them. A value
 * outside is refused with a message naming the field (the schemas put the field in the
 * issue's path) rather than computed with: precision before recall. Chosen for this product
 * (common practice, no source): catalogue regulator diodes run from about 1.8 V to a few
 * hundred volts, test currents from about 50 µA to 1 A, impedances from below 1 Ω to a few
 * kΩ, tempcos up to about ±0.1 %/K (±0.3 V/K absolute on the highest voltages).
 */
export const PHYSICAL_BOUNDS = {
  /** Zener (breakdown) voltage: vzNom/vzMin/vzMax, spec window (V). */
  zenerVoltage: { min: 0.5, max: 1000, unit: 'V' },
  /** Other voltages: reverse voltage, supply, output window, knee span (V). */
  voltage: { min: 1e-3, max: 1000, unit: 'V' },
  /** Currents: izt, izk, izm, iRef, envelope, load (A). */
  current: { min: 1e-9, max: 100, unit: 'A' },
  /** Reverse leakage: 0 (none measurable) or at least 1 pA, at most 1 A. */
  leakage: { min: 1e-12, max: 1, unit: 'A' },
  /** Dynamic impedance zzt/zzk/zdMax (Ω). */
  resistance: { min: 1e-3, max: 1e7, unit: 'Ω' },
  /** Power rating (W). */
  power: { min: 1e-3, max: 1000, unit: 'W' },
  /** Junction/reference temperature (°C). */
  temperature: { min: -100, max: 400, unit: '°C' },
  /** Ambient temperature of an envelope or circuit (°C). */
  ambient: { min: -100, max: 300, unit: '°C' },
  /** Junction-to-ambient thermal resistance (K/W). */
  thermalResistance: { min: 0.01, max: 1e4, unit: 'K/W' },
  /** Temperature coefficient as printed in mV/K (absolute). */
  tempCoMilliVoltsPerK: { min: -1000, max: 1000, unit: 'mV/K' },
  /** Temperature coefficient as printed in %/K (relative). */
  tempCoPercentPerK: { min: -2, max: 2, unit: '%/K' },
  /** Temperature coefficient in V/K (spec window). */
  tempCoVoltsPerK: { min: -1, max: 1, unit: 'V/K' },
} as const;
export type PhysicalBound = keyof typeof PHYSICAL_BOUNDS;

const fmt = (n: number) => String(n).replace('e-', '×10^-').replace('e+', '×10^');

/** A finite number within the quantity's plausible range; the message says the range and unit. */
export function physical(kind: PhysicalBound) {
  const { min, max, unit } = PHYSICAL_BOUNDS[kind];
  const range = `between ${fmt(min)} and ${fmt(max)} ${unit}`;
  return z
    .number({ error: (issue) => (issue.input === undefined ? 'Required' : `must be a number ${range}`) })
    .min(min, { error: `must be ${range}` })
    .max(max, { error: `must be ${range}` });
}

/** Reverse leakage: 0 or within PHYSICAL_BOUNDS.leakage. */
export function leakageCurrent() {
  const { min, max, unit } = PHYSICAL_BOUNDS.leakage;
  return z
    .number({ error: (issue) => (issue.input === undefined ? 'Required' : `must be a number, 0 or between ${fmt(min)} and ${fmt(max)} ${unit}`) })
    .refine((v) => v === 0 || (v >= min && v <= max), { error: `must be 0 or between ${fmt(min)} and ${fmt(max)} ${unit}` });
}
