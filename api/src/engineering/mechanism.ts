import { formatQuantity, type Mechanism } from '@shuntwise/contracts';

/** Below this Zener voltage (V) breakdown is mainly tunnelling (common practice: about 5 V). */
export const TUNNELLING_BELOW_V = 5;
/** Above this Zener voltage (V) breakdown is mainly avalanche (common practice: about 6 V). */
export const AVALANCHE_ABOVE_V = 6;

/** Breakdown mechanism expected from the Zener voltage (V): it sets the sign of the temperature coefficient. */
export function mechanismOf(vz: number): Mechanism {
  if (vz < TUNNELLING_BELOW_V) return 'tunnelling';
  if (vz > AVALANCHE_ABOVE_V) return 'avalanche';
  return 'mixed';
}

/**
 * A warning when the coefficient's sign (alphaVz in V/K) disagrees with the mechanism:
 * tunnelling parts drift down with heat, avalanche parts up; mixed parts may go either way.
 */
export function mechanismSignWarning(vz: number, alphaVz: number): string | null {
  const mechanism = mechanismOf(vz);
  if (mechanism === 'tunnelling' && alphaVz > 0) {
    return `tc is positive but a ${formatQuantity(vz, 'voltage', { trim: true })} part breaks down mainly by tunnelling, whose voltage falls with temperature: check the sign on the datasheet`;
  }
  if (mechanism === 'avalanche' && alphaVz < 0) {
    return `tc is negative but a ${formatQuantity(vz, 'voltage', { trim: true })} part breaks down mainly by avalanche, whose voltage rises with temperature: check the sign on the datasheet`;
  }
  return null;
}
