import { z } from 'zod';
import { physical } from '../units/bounds';
import { fieldWithValue as fw } from '../units/field-labels';

/** Where a part operates: diode current iMin..iMax (A) and ambient taMin..taMax (°C). */
export const envelopeSchema = z
  .strictObject({
    iMin: physical('current'),
    iMax: physical('current'),
    taMin: physical('ambient'),
    taMax: physical('ambient'),
  })
  .superRefine((e, ctx) => {
    if (e.iMin > e.iMax) ctx.addIssue({ code: 'custom', path: ['iMin'], message: `${fw('envelope.iMin', e.iMin)} is above ${fw('envelope.iMax', e.iMax)}` });
    if (e.taMin > e.taMax)
      ctx.addIssue({ code: 'custom', path: ['taMin'], message: `${fw('envelope.taMin', e.taMin)} is above ${fw('envelope.taMax', e.taMax)}` });
  });
export type Envelope = z.infer<typeof envelopeSchema>;

/** Which tolerance end of the card a value belongs to. */
export const toleranceCornerSchema = z.enum(['min', 'nom', 'max']);
export type ToleranceCorner = z.infer<typeof toleranceCornerSchema>;

/** One evaluated corner: the diode's current and ambient, the junction temperature reached, the voltage. */
export const envelopeCornerSchema = z.object({
  current: z.number(),
  taC: z.number(),
  tjC: z.number(),
  corner: toleranceCornerSchema,
  voltage: z.number(),
});
export type EnvelopeCorner = z.infer<typeof envelopeCornerSchema>;

/** Lowest and highest diode voltage over an envelope, with where each occurs. */
export const voltageWindowSchema = z.object({
  vMin: z.number(),
  vMax: z.number(),
  atMin: envelopeCornerSchema,
  atMax: envelopeCornerSchema,
  toleranceIncluded: z.boolean(),
  selfHeating: z.boolean(),
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
});
export type VoltageWindow = z.infer<typeof voltageWindowSchema>;

export const verdictSchema = z.enum(['pass', 'fail', 'no-data']);
export type Verdict = z.infer<typeof verdictSchema>;

/** Worst-case dissipation in an envelope against the derated rating times the policy fraction. */
export const powerCheckSchema = z.object({
  verdict: verdictSchema,
  /** Worst dissipation (W) and where it occurs. */
  power: z.number().nullable(),
  at: envelopeCornerSchema.nullable(),
  /** Derated rating at that ambient (W), the policy fraction, and their product (W). */
  deratedLimit: z.number().nullable(),
  policyFraction: z.number(),
  allowed: z.number().nullable(),
  /** allowed − power (W); negative fails. */
  margin: z.number().nullable(),
  reason: z.string(),
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
});
export type PowerCheck = z.infer<typeof powerCheckSchema>;
