import { z } from 'zod';
import { envelopeSchema } from '../engineering/envelope.schema';
import { physical } from '../units/bounds';
import { actorSchema } from './page.schema';

/**
 * A house part's spec: the approved requirement at reference conditions, all SI
 * (A, V, Ω, W, °C, V/K). Optional limits are null when the spec sets none; the
 * qualification treats a null limit as "not required", never as a pass of missing data.
 */
// Ranges from the one table of plausible values (units/bounds.ts).
const amperes = physical('current');
const zenerVolts = physical('zenerVoltage');
const volts = physical('voltage');

export const specSchema = z
  .strictObject({
    /** Reference current the window and impedance are stated at (A). */
    iRef: amperes,
    /** Zener-voltage window at iRef, 25 °C (V). */
    vz: z.strictObject({ min: zenerVolts, nom: zenerVolts, max: zenerVolts }),
    /** Largest dynamic impedance at iRef (Ω). */
    zdMax: physical('resistance').nullable().default(null),
    /** Knee limit: Zd(iKnee)/Zd(iRef) at most maxRatio, and/or the voltage span over iMin..iMax at most maxSpan (V). */
    knee: z
      .strictObject({
        iKnee: amperes.nullable().default(null),
        maxRatio: z.number().min(1).max(1e4).nullable().default(null),
        maxSpan: volts.nullable().default(null),
      })
      .nullable()
      .default(null),
    /** Largest reverse leakage irMax (A) at reverse voltage vr (V). */
    leakage: z.strictObject({ irMax: physical('leakage'), vr: volts }).nullable().default(null),
    /** Temperature-coefficient window (V/K). */
    tc: z.strictObject({ min: physical('tempCoVoltsPerK'), max: physical('tempCoVoltsPerK') }).nullable().default(null),
    /** Smallest power rating (W) and the largest fraction of the derated power the part may dissipate. */
    power: z
      .strictObject({ pdMin: physical('power'), deratingFraction: z.number().positive().max(1) })
      .nullable()
      .default(null),
    /** Packages allowed; empty means any. */
    packages: z.array(z.string().trim().min(1).max(40)).max(50).default([]),
    /** Where the part operates: diode current iMin..iMax (A), ambient taMin..taMax (°C). */
    envelope: envelopeSchema,
    /** Optional output window over the whole envelope (V). */
    outputWindow: z.strictObject({ vMin: volts, vMax: volts }).nullable().default(null),
    /** A check within this many percent of its limit is "marginal" rather than a clean pass. */
    marginalBandPercent: z.number().min(0).max(50).default(5),
  })
  .superRefine((s, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    if (s.vz.min > s.vz.nom) issue(['vz', 'min'], `vz.min (${s.vz.min} V) is above vz.nom (${s.vz.nom} V)`);
    if (s.vz.max < s.vz.nom) issue(['vz', 'max'], `vz.max (${s.vz.max} V) is below vz.nom (${s.vz.nom} V)`);
    if (s.knee) {
      if (s.knee.maxRatio === null && s.knee.maxSpan === null) issue(['knee'], 'a knee limit needs maxRatio (with iKnee) or maxSpan');
      if (s.knee.maxRatio !== null && s.knee.iKnee === null) issue(['knee', 'iKnee'], 'maxRatio is stated at a knee current: give iKnee');
      if (s.knee.iKnee !== null && s.knee.iKnee >= s.iRef) issue(['knee', 'iKnee'], `iKnee (${s.knee.iKnee} A) must be below iRef (${s.iRef} A)`);
    }
    if (s.leakage && s.leakage.vr >= s.vz.min) issue(['leakage', 'vr'], `vr (${s.leakage.vr} V) must be below the window's vz.min (${s.vz.min} V)`);
    if (s.tc && s.tc.min > s.tc.max) issue(['tc', 'min'], `tc.min (${s.tc.min} V/K) is above tc.max (${s.tc.max} V/K)`);
    if (s.outputWindow && s.outputWindow.vMin >= s.outputWindow.vMax) {
      issue(['outputWindow', 'vMin'], `outputWindow.vMin (${s.outputWindow.vMin} V) must be below vMax (${s.outputWindow.vMax} V)`);
    }
  });
export type Spec = z.infer<typeof specSchema>;
export type SpecInput = z.input<typeof specSchema>;

/** `PUT /house-parts/:id/spec`: a new version, based on the version the editor loaded (0 for the first). */
export const putSpecRequestSchema = z.strictObject({
  baseVersion: z.number().int().min(0),
  spec: specSchema,
  note: z.string().trim().max(500).optional(),
});
export type PutSpecRequest = z.input<typeof putSpecRequestSchema>;

export const specVersionSchema = z.object({
  housePartId: z.number().int(),
  version: z.number().int(),
  spec: specSchema,
  note: z.string().nullable(),
  createdAt: z.string(),
  createdBy: actorSchema.nullable(),
});
export type SpecVersion = z.infer<typeof specVersionSchema>;

export const specQuerySchema = z.object({ version: z.coerce.number().int().min(1).optional() });
export type SpecQuery = z.infer<typeof specQuerySchema>;

export const specVersionSummarySchema = specVersionSchema.omit({ spec: true });
export type SpecVersionSummary = z.infer<typeof specVersionSummarySchema>;
