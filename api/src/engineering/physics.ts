/** Boltzmann constant (J/K), exact since the 2019 SI redefinition (CODATA 2018). */
export const BOLTZMANN = 1.380649e-23;
/** Elementary charge (C), exact since the 2019 SI redefinition (CODATA 2018). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;
/** k/q (V/K): Vt = K_OVER_Q · T. */
export const K_OVER_Q = BOLTZMANN / ELEMENTARY_CHARGE;
/** 0 °C in kelvin. */
export const ZERO_CELSIUS_K = 273.15;
/** Temperature that card values refer to (°C): datasheets state vz, zzt and tc at 25 °C. */
export const T_REF_C = 25;

/** Thermal voltage kT/q (V) at a temperature in °C; 25.69 mV at 25 °C. */
export function thermalVoltage(tempC: number): number {
  return K_OVER_Q * (tempC + ZERO_CELSIUS_K);
}
