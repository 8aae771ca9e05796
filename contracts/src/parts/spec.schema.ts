import { z } from 'zod';
import { fieldValue, fieldWithValue as fw } from '../units/field-labels';
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
    leakage: z
      .strictObject({ irMax: physical('leakage'), vr: volts })
      .nullable()
      .default(null),
    /** Temperature-coefficient window (V/K). */
    tc: z
      .strictObject({ min: physical('tempCoVoltsPerK'), max: physical('tempCoVoltsPerK') })
      .nullable()
      .default(null),
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
    if (s.vz.min > s.vz.nom) issue(['vz', 'min'], `${fw('vz.min', s.vz.min)} is above ${fw('vz.nom', s.vz.nom)}`);
    if (s.vz.max < s.vz.nom) issue(['vz', 'max'], `${fw('vz.max', s.vz.max)} is below ${fw('vz.nom', s.vz.nom)}`);
    if (s.knee) {
      if (s.knee.maxRatio === null && s.knee.maxSpan === null)
        issue(['knee'], 'A knee limit needs the largest ratio (with the knee current) or the largest span');
      if (s.knee.maxRatio !== null && s.knee.iKnee === null) issue(['knee', 'iKnee'], 'The knee ratio is stated at a knee current: give the knee current');
      if (s.knee.iKnee !== null && s.knee.iKnee >= s.iRef)
        issue(['knee', 'iKnee'], `${fw('knee.iKnee', s.knee.iKnee)} must be below the reference current (${fieldValue('iRef', s.iRef)})`);
    }
    if (s.leakage && s.leakage.vr >= s.vz.min) issue(['leakage', 'vr'], `${fw('leakage.vr', s.leakage.vr)} must be below ${fw('vz.min', s.vz.min)}`);
    if (s.tc && s.tc.min > s.tc.max) issue(['tc', 'min'], `${fw('tc.min', s.tc.min)} is above ${fw('tc.max', s.tc.max)}`);
    if (s.outputWindow && s.outputWindow.vMin >= s.outputWindow.vMax) {
      issue(['outputWindow', 'vMin'], `${fw('outputWindow.vMin', s.outputWindow.vMin)} must be below ${fw('outputWindow.vMax', s.outputWindow.vMax)}`);
    }
  });
export type Spec = z.infer<typeof specSchema>;
export type SpecInput = z.input<typeof specSchema>;

/** Numbers closer than this (relative) are the same value: a unit round trip (5 mA → 0.005 A) leaves noise in the last bit. */
const SAME_RELATIVE = 1e-9;

function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return a === b || Math.abs(a - b) <= SAME_RELATIVE * Math.max(Math.abs(a), Math.abs(b));
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => sameValue(x, b[i]));
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    // A key left out and a key set to null say the same: no limit.
    return [...keys].every((k) => sameValue((a as Record<string, unknown>)[k] ?? null, (b as Record<string, unknown>)[k] ?? null));
  }
  return (a ?? null) === (b ?? null);
}

/**
 * Whether two specs state the same requirement: defaults filled in, numbers equal to
 * within a unit round trip, packages as a set. The API makes no new version (and flags
 * no decided case) for a save that changes nothing by this rule; the editor uses it too.
 */
export function sameSpec(a: SpecInput, b: SpecInput): boolean {
  const pa = specSchema.safeParse(a);
  const pb = specSchema.safeParse(b);
  if (!pa.success || !pb.success) return false;
  const canonical = (s: Spec) => ({ ...s, packages: [...new Set(s.packages)].sort() });
  return sameValue(canonical(pa.data), canonical(pb.data));
}

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
