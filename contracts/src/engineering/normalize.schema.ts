import { z } from 'zod';
import { physical } from '../units/bounds';
import { cardIssueSchema, engineeringCardSchema } from './card.schema';

/** `POST /api/engineering/normalize`: a card evaluated at the caller's currents (A) and ambients (°C). */
export const normalizeRequestSchema = z.strictObject({
  card: engineeringCardSchema,
  currents: z.array(physical('current')).min(1).max(100),
  /** Ambient temperatures (°C); 25 °C when absent. */
  temperaturesC: z.array(physical('ambient')).min(1).max(20).optional(),
  /** Add self-heating Tj = Ta + RthJA·Vz·I (needs rthJA on the card); default true. */
  selfHeating: z.boolean().optional(),
});
export type NormalizeRequest = z.infer<typeof normalizeRequestSchema>;

/** How the impedance part of the breakdown model was obtained: from the card, or fitted to measured points. */
export const MODEL_BASES = ['two-point', 'izt-only', 'izk-only', 'clamped', 'none', 'measured'] as const;
export const modelBasisSchema = z.enum(MODEL_BASES);
export type ModelBasis = z.infer<typeof modelBasisSchema>;

/**
 * The SPICE reverse-branch parameters fitted to a card: V(I) = bv + nbvVt·ln(I/ibv) + rs·I,
 * Zd(I) = nbvVt/I + rs, at 25 °C; alphaVz is dVz/dT at izt (V/K), null when the card has none.
 */
export const breakdownModelSchema = z.object({
  bv: z.number(),
  ibv: z.number(),
  nbv: z.number(),
  rs: z.number(),
  nbvVt: z.number(),
  alphaVz: z.number().nullable(),
  basis: modelBasisSchema,
  assumptions: z.array(z.string()),
});
export type BreakdownModelSummary = z.infer<typeof breakdownModelSchema>;

export const MECHANISMS = ['tunnelling', 'mixed', 'avalanche'] as const;
export const mechanismSchema = z.enum(MECHANISMS);
export type Mechanism = z.infer<typeof mechanismSchema>;

/**
 * The card at one current and ambient: Zener voltage window (V) and dynamic impedance (Ω).
 * Values are null where the card has no data, and where the junction runs away thermally
 * (no steady state; the response's warnings say so).
 */
export const normalizedPointSchema = z.object({
  current: z.number(),
  tempC: z.number(),
  /** Junction temperature of the nominal part (°C). */
  tjC: z.number().nullable(),
  vzMin: z.number().nullable(),
  vzNom: z.number().nullable(),
  vzMax: z.number().nullable(),
  /** null when the card gives no impedance. */
  zd: z.number().nullable(),
});
export type NormalizedPoint = z.infer<typeof normalizedPointSchema>;

export const normalizeResponseSchema = z.object({
  model: breakdownModelSchema,
  points: z.array(normalizedPointSchema),
  mechanism: mechanismSchema,
  warnings: z.array(z.string()),
  assumptions: z.array(z.string()),
  issues: z.array(cardIssueSchema),
  spiceModel: z.string(),
  caution: z.string(),
});
export type NormalizeResponse = z.infer<typeof normalizeResponseSchema>;
