import type { Spec } from '../parts/spec.schema';
import type { EngineeringCardInput } from './card.schema';
import type { NormalizeRequest } from './normalize.schema';

/**
 * Currents a card is read at when no spec applies: its own test points and the usual
 * small-signal currents of regulator diodes (1, 5, 10 and 20 mA; common practice, no source).
 */
export const STANDARD_CURRENTS = [0.001, 0.005, 0.01, 0.02] as const;

/** The currents and ambients a card is normalised at, with how they were chosen. */
export interface NormalizeBasis {
  /** How the currents were chosen, for a heading. */
  label: string;
  currents: number[];
  temperaturesC: number[];
}

const sorted = (values: number[]) => [...new Set(values.map((v) => Number(v.toPrecision(12))))].sort((a, b) => a - b);

/**
 * The one choice of currents and ambients: the spec's (iRef, iKnee, iMin, iMax at 25 °C and
 * the envelope's ambient ends) when there is a spec, else the card's test points and
 * STANDARD_CURRENTS at 25 °C. The card editor, the card read and the evaluation's reading
 * of a card all take it from here.
 */
export function normalizeBasis(
  card: Pick<EngineeringCardInput, 'izt' | 'izk'>,
  spec: { spec: Spec; partNumber: string; version: number } | null,
): NormalizeBasis {
  if (spec) {
    const s = spec.spec;
    const currents = [s.iRef, s.knee?.iKnee ?? null, s.envelope.iMin, s.envelope.iMax].filter((c): c is number => c !== null);
    return {
      label: `at the currents of ${spec.partNumber}'s spec v${spec.version}`,
      currents: sorted(currents),
      temperaturesC: sorted([25, s.envelope.taMin, s.envelope.taMax]),
    };
  }
  const own = [card.izk ?? null, card.izt].filter((c): c is number => c !== null);
  return { label: 'at its test currents and 1, 5, 10, 20 mA, 25 °C', currents: sorted([...own, ...STANDARD_CURRENTS]), temperaturesC: [25] };
}

/** The request POST /engineering/normalize takes for a card at a basis (self-heating on, as everywhere). */
export function normalizeRequestFor(card: EngineeringCardInput, basis: NormalizeBasis): NormalizeRequest {
  return { card, currents: basis.currents, temperaturesC: basis.temperaturesC, selfHeating: true };
}
