import { z } from 'zod';
import { breakdownModelSchema, mechanismSchema } from '../engineering/normalize.schema';
import { voltageWindowSchema } from '../engineering/envelope.schema';
import { qualificationVerdictSchema } from './qualification-state.schema';

/**
 * The checks a vendor part's card is put through against a house part's spec. Each is
 * evaluated only when the spec sets its limit; the others are listed as not applicable.
 */
export const CHECK_IDS = [
  'vz-window',
  'zd',
  'knee-ratio',
  'knee-span',
  'leakage',
  'tc',
  'output-window',
  'power-dissipation',
  'power-rating',
  'package',
] as const;
export const checkIdSchema = z.enum(CHECK_IDS);
export type CheckId = z.infer<typeof checkIdSchema>;

export const CHECK_LABELS: Record<CheckId, string> = {
  'vz-window': 'Zener voltage at the reference current',
  zd: 'Dynamic impedance at the reference current',
  'knee-ratio': 'Knee ratio: Zd at the knee current ÷ Zd at the reference current',
  'knee-span': 'Voltage span over the operating currents',
  leakage: 'Reverse leakage',
  tc: 'Temperature coefficient',
  'output-window': 'Output window over the envelope',
  'power-dissipation': 'Worst-case dissipation',
  'power-rating': 'Power rating',
  package: 'Package',
};

/**
 * How the value is formatted: a quantity kind of contracts/src/units (SI), `ratio` for a
 * plain number, `text` when the check compares names (package).
 */
export const CHECK_QUANTITIES = ['voltage', 'current', 'resistance', 'power', 'tempCoVoltage', 'ratio', 'text'] as const;
export const checkQuantitySchema = z.enum(CHECK_QUANTITIES);
export type CheckQuantity = z.infer<typeof checkQuantitySchema>;

/** A limit is an upper bound, a lower bound, a window (both), or a list the value must be in. */
export const LIMIT_KINDS = ['max', 'min', 'window', 'member'] as const;
export const limitKindSchema = z.enum(LIMIT_KINDS);
export type LimitKind = z.infer<typeof limitKindSchema>;

export const qualificationCheckSchema = z.object({
  id: checkIdSchema,
  label: z.string(),
  verdict: qualificationVerdictSchema,
  quantity: checkQuantitySchema,
  limitKind: limitKindSchema,
  /** The normalised value nearest its limit (SI); null without data or for text checks. */
  value: z.number().nullable(),
  /** The limit that value is measured against (SI). */
  limit: z.number().nullable(),
  /** For window checks: the part's lowest and highest value (SI). */
  range: z.object({ low: z.number(), high: z.number() }).nullable(),
  /** For window checks: the spec's window (SI). */
  window: z.object({ min: z.number(), max: z.number() }).nullable(),
  /** For package checks: what the part has and what the spec allows. */
  text: z.object({ value: z.string().nullable(), allowed: z.array(z.string()) }).nullable(),
  /**
   * Distance to the limit in percent of the limit (window checks: the nearer end; the
   * temperature coefficient: of the larger window end); negative fails, below the spec's
   * marginal band is marginal. Null without data and for text checks.
   */
  margin: z.number().nullable(),
  /** One plain sentence: what was compared and how it came out. */
  detail: z.string(),
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
});
export type QualificationCheck = z.infer<typeof qualificationCheckSchema>;

/** A check the spec does not ask for (its limit is not set). */
export const skippedCheckSchema = z.object({ id: checkIdSchema, label: z.string(), reason: z.string() });
export type SkippedCheck = z.infer<typeof skippedCheckSchema>;

/**
 * The whole evaluation of one card against one spec version. `overall`: fail if any check
 * fails, no data if any lacks data, marginal if any is marginal, else pass.
 */
export const evaluationSchema = z.object({
  overall: qualificationVerdictSchema,
  /** Plain summary of the overall verdict, naming the checks that decided it. */
  summary: z.string(),
  specVersion: z.number().int(),
  cardVersion: z.number().int(),
  marginalBandPercent: z.number(),
  checks: z.array(qualificationCheckSchema),
  notApplicable: z.array(skippedCheckSchema),
  /** The breakdown model fitted to the card; null when the card cannot be read. */
  model: breakdownModelSchema.nullable(),
  mechanism: mechanismSchema.nullable(),
  /** Worst-case diode voltage over the spec's envelope (tolerance, currents, ambients, self-heating). */
  window: voltageWindowSchema.nullable(),
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
  caution: z.string(),
  evaluatedAt: z.string(),
});
export type Evaluation = z.infer<typeof evaluationSchema>;
