/**
 * A small, invented but physically shaped model of regulator diodes, used only to make
 * the demo datasheets plausible. Breakdown follows the SPICE diode reverse branch,
 * Zd(I) = NBV·Vt/I + RS: low-voltage (tunnelling) parts have a soft knee, so NBV·Vt is
 * large; avalanche parts have a sharp knee and a bulk resistance that grows with voltage.
 * The temperature coefficient is negative below about 5 V and positive above about 6 V.
 */

/** E24 nominal Zener voltages from 2.4 V to 75 V, as regulator series offer them. */
export const E24_VZ: readonly number[] = [
  2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1, 10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68,
  75,
];

export function vzRange(from: number, to: number): number[] {
  return E24_VZ.filter((v) => v >= from - 1e-9 && v <= to + 1e-9);
}

/** NBV·Vt in volts. */
export function nbvVt(vz: number): number {
  return 0.025 * (1 + 12 * Math.exp(-(vz - 2.4) / 1.6)) + 0.002 * vz;
}

/** Series resistance RS in ohms. */
export function seriesResistance(vz: number): number {
  return 0.5 + 0.06 * vz ** 1.8;
}

/** Typical dynamic impedance at current i (A). */
export function zdTypical(vz: number, i: number): number {
  return nbvVt(vz) / i + seriesResistance(vz);
}

/** Typical temperature coefficient in %/K. */
export function tcPercentPerK(vz: number): number {
  return 0.095 - 0.17 * Math.exp(-(vz - 2.4) / 4.98);
}

/** Reverse voltage (V) at which leakage is usually specified. */
export function leakageVoltage(vz: number): number {
  if (vz < 3.9) return 1;
  if (vz < 6.2) return 2;
  if (vz < 6.8) return 4;
  return Math.round(0.7 * vz * 10) / 10;
}

/** Typical maximum leakage (A) at leakageVoltage(vz) for a small-signal part. */
export function leakageBase(vz: number): number {
  const table: Array<[number, number]> = [
    [2.7, 50e-6],
    [3.0, 20e-6],
    [3.6, 5e-6],
    [4.7, 3e-6],
    [5.1, 2e-6],
    [5.6, 1e-6],
    [6.2, 3e-6],
    [6.8, 2e-6],
    [7.5, 1e-6],
    [8.2, 0.7e-6],
    [9.1, 0.5e-6],
    [10, 0.2e-6],
  ];
  for (const [limit, ir] of table) if (vz <= limit + 1e-9) return ir;
  return 0.1e-6;
}

/** Leakage limits as printed, in µA. */
export const LEAKAGE_LADDER_UA: readonly number[] = [0.05, 0.1, 0.2, 0.5, 1, 2, 3, 5, 10, 20, 50, 100, 200];

/** "5V1", "2V4", "3V0", "10", "75": the usual way a voltage sits inside a part number. */
export function vzCode(vz: number): string {
  if (vz >= 10) return String(Math.round(vz));
  const [whole, frac = '0'] = vz.toFixed(1).split('.');
  return `${whole}V${frac}`;
}
