import type { EngineeringCardInput, NormalizeRequest, Spec } from '@shuntwise/contracts';

/**
 * Currents a card is shown at when no spec applies: its own test points and the usual
 * small-signal currents of regulator diodes (1, 5, 10 and 20 mA; common practice, no source).
 */
export const STANDARD_CURRENTS = [0.001, 0.005, 0.01, 0.02] as const;

export interface NormalizeBasis {
  /** How the currents were chosen, for the panel's heading. */
  label: string;
  currents: number[];
  temperaturesC: number[];
}

const sorted = (values: number[]) => [...new Set(values.map((v) => Number(v.toPrecision(12))))].sort((a, b) => a - b);

/** The spec's currents and ambients, as the API normalises a card for a house part. */
export function basisFromSpec(spec: Spec, partNumber: string, version: number): NormalizeBasis {
  const currents = [spec.iRef, spec.knee?.iKnee ?? null, spec.envelope.iMin, spec.envelope.iMax].filter((c): c is number => c !== null);
  return {
    label: `at the currents of ${partNumber}'s spec v${version}`,
    currents: sorted(currents),
    temperaturesC: sorted([25, spec.envelope.taMin, spec.envelope.taMax]),
  };
}

export function standardBasis(card: EngineeringCardInput): NormalizeBasis {
  const own = [card.izk ?? null, card.izt].filter((c): c is number => c !== null);
  return { label: 'at its test currents and 1, 5, 10, 20 mA, 25 °C', currents: sorted([...own, ...STANDARD_CURRENTS]), temperaturesC: [25] };
}

export function normalizeRequestFor(card: EngineeringCardInput, basis: NormalizeBasis): NormalizeRequest {
  return { card, currents: basis.currents, temperaturesC: basis.temperaturesC };
}
