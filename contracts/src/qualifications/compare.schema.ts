import { z } from 'zod';
import { envelopeSchema } from '../engineering/envelope.schema';
import { normalizedPointSchema } from '../engineering/normalize.schema';
import { housePartStatusSchema } from '../parts/house-part.schema';
import { sourceRoleSchema } from '../parts/source.schema';
import { specSchema } from '../parts/spec.schema';
import { evaluationSchema } from './evaluation.schema';
import { qualificationStateSchema, qualificationVerdictSchema } from './qualification-state.schema';
import { vendorPartRefSchema } from './qualification.schema';

/** One I–V curve in breakdown: the card's voltages (tolerance ends and nominal) at one ambient over the current grid. */
export const compareCurveSchema = z.object({
  tempC: z.number(),
  points: z.array(normalizedPointSchema),
});
export type CompareCurve = z.infer<typeof compareCurveSchema>;

/**
 * A source's own dissipation limit at the spec's hottest ambient: its card's rating derated
 * there (the engineering core's `deratedPowerLimit`), then the spec's derating fraction.
 * Each part has its own, so Compare shows one per source.
 */
export const comparePowerLimitSchema = z.object({
  /** The ambient it is taken at (°C): the envelope's highest, where the derated rating is lowest. */
  ambientC: z.number(),
  /** The card's rating derated to that ambient (W); null when the card cannot say (see `reason`). */
  derated: z.number().nullable(),
  /** What set it: PD max derated linearly, (TJ max − Ta)/RthJA, or nothing. */
  basis: z.enum(['pdMax', 'rthJA', 'none']),
  reason: z.string(),
  /** The spec's fraction of the derated rating a part may use; null when the spec sets no power requirement. */
  policyFraction: z.number().nullable(),
  /** derated × policyFraction (W); null without either. */
  allowed: z.number().nullable(),
});
export type ComparePowerLimit = z.infer<typeof comparePowerLimitSchema>;

export const compareSourceSchema = z.object({
  vendorPart: vendorPartRefSchema,
  role: sourceRoleSchema,
  cardVersion: z.number().int().nullable(),
  latestCase: z.object({ id: z.number().int(), revision: z.number().int(), state: qualificationStateSchema, overall: qualificationVerdictSchema }).nullable(),
  /** The card evaluated now against the current spec; null when the card cannot be read (see `reason`). */
  evaluation: evaluationSchema.nullable(),
  /** One curve per temperature of `temperaturesC`, same order; empty without a readable card. */
  curves: z.array(compareCurveSchema),
  /** The source's own derated dissipation limit; null without a readable card. */
  powerLimit: comparePowerLimitSchema.nullable(),
  reason: z.string().nullable(),
});
export type CompareSource = z.infer<typeof compareSourceSchema>;

/**
 * `GET /api/qualification-views/compare/:housePartId`: the approved source and the alternates
 * side by side. Curves come from each card's fitted model with self-heating at each
 * ambient (the same law as the checks); the worst-case band is each evaluation's `window`.
 */
export const comparePayloadSchema = z.object({
  housePart: z.object({ id: z.number().int(), partNumber: z.string(), description: z.string(), status: housePartStatusSchema }),
  specVersion: z.number().int(),
  spec: specSchema,
  envelope: envelopeSchema,
  /** 25 °C and the envelope's ambient ends (°C), ascending, without repeats. */
  temperaturesC: z.array(z.number()),
  /** The current grid (A), log-spaced, covering the spec's knee, reference and operating currents. */
  currents: z.array(z.number()),
  /** The spec's Zener-voltage window at iRef (V), for a marker on the chart. */
  specWindow: z.object({ current: z.number(), min: z.number(), nom: z.number(), max: z.number() }),
  /** The spec's output window over the envelope (V), when it sets one. */
  outputWindow: z.object({ vMin: z.number(), vMax: z.number() }).nullable(),
  sources: z.array(compareSourceSchema),
  caution: z.string(),
});
export type ComparePayload = z.infer<typeof comparePayloadSchema>;
