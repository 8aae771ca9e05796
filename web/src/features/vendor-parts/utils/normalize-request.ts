import { normalizeBasis, type EngineeringCardInput, type NormalizeBasis, type Spec } from '@shuntwise/contracts';

// One choice of currents for the editor, the card read and the evaluation: it lives in contracts.
export { normalizeRequestFor, STANDARD_CURRENTS, type NormalizeBasis } from '@shuntwise/contracts';

/** The spec's currents and ambients, as the API normalises a card for a house part. */
export function basisFromSpec(spec: Spec, partNumber: string, version: number): NormalizeBasis {
  return normalizeBasis({ izt: spec.iRef, izk: null }, { spec, partNumber, version });
}

/** The card's own test points and the stated standard currents at 25 °C. */
export function standardBasis(card: EngineeringCardInput): NormalizeBasis {
  return normalizeBasis(card, null);
}
