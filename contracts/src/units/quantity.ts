/**
 * Physical quantities as Shuntwise stores them: SI numbers (V, A, Ω, W, °C, K/W, V/K).
 * Each kind lists the unit symbols a datasheet may print for it, with the factor that
 * turns a value in that unit into SI.
 */
export const QUANTITY_KINDS = ['voltage', 'current', 'resistance', 'power', 'temperature', 'thermalResistance', 'tempCoVoltage', 'tempCoPercent'] as const;
export type QuantityKind = (typeof QUANTITY_KINDS)[number];

/** The SI unit symbol that each kind is formatted with. */
export const SI_UNIT: Record<QuantityKind, string> = {
  voltage: 'V',
  current: 'A',
  resistance: 'Ω',
  power: 'W',
  temperature: '°C',
  thermalResistance: 'K/W',
  tempCoVoltage: 'V/K',
  tempCoPercent: '%/K',
};
