import { z } from 'zod';
import { physical } from '../units/bounds';
import { fieldValue, fieldWithValue as fw } from '../units/field-labels';
import { engineeringCardSchema } from './card.schema';
import { toleranceCornerSchema } from './envelope.schema';

export const RESISTOR_SERIES = ['E24', 'E96'] as const;
export const resistorSeriesSchema = z.enum(RESISTOR_SERIES);
export type ResistorSeries = z.infer<typeof resistorSeriesSchema>;

const supplySchema = z
  .strictObject({
    min: physical('voltage'),
    /** Nominal supply (V); the middle of min..max when absent. */
    nom: physical('voltage').optional(),
    max: physical('voltage'),
  })
  .superRefine((s, ctx) => {
    if (s.min > s.max) ctx.addIssue({ code: 'custom', path: ['min'], message: `${fw('supply.min', s.min)} is above ${fw('supply.max', s.max)}` });
    if (s.nom !== undefined && (s.nom < s.min || s.nom > s.max)) {
      ctx.addIssue({
        code: 'custom',
        path: ['nom'],
        message: `${fw('supply.nom', s.nom)} lies outside ${fieldValue('supply.min', s.min)} … ${fieldValue('supply.max', s.max)}`,
      });
    }
  });

const loadSchema = z.strictObject({ min: z.number().nonnegative().max(100), max: z.number().nonnegative().max(100) }).superRefine((l, ctx) => {
  if (l.min > l.max) ctx.addIssue({ code: 'custom', path: ['min'], message: `${fw('load.min', l.min)} is above ${fw('load.max', l.max)}` });
});

const ambientSchema = z.strictObject({ min: physical('ambient'), max: physical('ambient') }).superRefine((a, ctx) => {
  if (a.min > a.max) ctx.addIssue({ code: 'custom', path: ['min'], message: `${fw('ambient.min', a.min)} is above ${fw('ambient.max', a.max)}` });
});

/** `POST /api/engineering/regulator`: a shunt regulator (supply → R → diode ∥ load) designed around a card. */
export const regulatorRequestSchema = z.strictObject({
  card: engineeringCardSchema,
  supply: supplySchema,
  load: loadSchema,
  ambient: ambientSchema,
  resistor: z.strictObject({
    series: resistorSeriesSchema,
    /** Resistor tolerance as a fraction (0.05 for ±5 %). */
    tolerance: z.number().nonnegative().max(0.2),
  }),
  /** Diode current the simple formula aims for (A); izt when absent. */
  diodeCurrent: physical('current').optional(),
  /** Lowest diode current as a multiple of izk (default 5). */
  kneeFactor: z.number().min(1).max(100).optional(),
  /** Largest fraction of the derated power the diode may dissipate (default 1). */
  powerFraction: z.number().positive().max(1).optional(),
  /** Include self-heating (needs rthJA on the card); default true. */
  selfHeating: z.boolean().optional(),
});
export type RegulatorRequest = z.infer<typeof regulatorRequestSchema>;

export const regulatorVerdictSchema = z.enum(['ok', 'no-solution', 'no-data']);
export type RegulatorVerdict = z.infer<typeof regulatorVerdictSchema>;

/** One corner of the circuit, solved: supply (V), load (A), ambient (°C), resistor actually fitted (Ω). */
export const regulatorCornerSchema = z.object({
  supply: z.number(),
  load: z.number(),
  ambientC: z.number(),
  corner: toleranceCornerSchema,
  resistance: z.number(),
  vOut: z.number(),
  diodeCurrent: z.number(),
  /** null where the junction runs away thermally. */
  tjC: z.number().nullable(),
  diodePower: z.number(),
  resistorPower: z.number(),
  belowKnee: z.boolean(),
  overPower: z.boolean(),
});
export type RegulatorCorner = z.infer<typeof regulatorCornerSchema>;

export const regulatorResponseSchema = z.object({
  verdict: regulatorVerdictSchema,
  reasons: z.array(z.string()),
  /** R = (Vs − Vz)/(Iz + IL,max) at nominal supply (Ω), with its inputs. */
  simple: z.object({
    resistance: z.number().nullable(),
    supply: z.number(),
    vz: z.number(),
    diodeCurrent: z.number(),
    loadMax: z.number(),
  }),
  /** Nominal resistor values that keep every corner above the knee and inside the power (Ω). */
  range: z.object({
    min: z.number().nullable(),
    max: z.number().nullable(),
    kneeCurrent: z.number(),
    allowedDiodeCurrent: z.number().nullable(),
    minReason: z.string(),
    maxReason: z.string(),
  }),
  selected: z
    .object({
      resistance: z.number(),
      series: resistorSeriesSchema,
      tolerance: z.number(),
      low: z.number(),
      high: z.number(),
    })
    .nullable(),
  /** Worst resistor dissipation (W) over the corners of the selected or simple resistor. */
  resistorPower: z.number().nullable(),
  /** Worst diode dissipation (W) and the derated, policy-reduced allowance at that ambient (W). */
  diodePower: z.number().nullable(),
  diodePowerAllowed: z.number().nullable(),
  /** Small-signal line regulation ΔVout/ΔVs ≈ Zd/(R + Zd) (V/V) and output resistance R∥Zd (Ω). */
  lineRegulation: z.number().nullable(),
  outputResistance: z.number().nullable(),
  /** Vout at minimum load minus Vout at maximum load, nominal supply (V). */
  loadRegulation: z.number().nullable(),
  outputBand: z
    .object({
      vMin: z.number(),
      vMax: z.number(),
      corners: z.array(regulatorCornerSchema),
    })
    .nullable(),
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type RegulatorResponse = z.infer<typeof regulatorResponseSchema>;
