/**
 * Measurement sets (all under /api):
 *   POST measurement-sets/preview        engineer   multipart `file` → MeasurementCsvReading (nothing stored)
 *   POST measurement-sets                engineer   multipart `file` + MeasurementSetFields → MeasurementSet
 *   GET  measurement-sets/:id            engineer, admin   ?housePartId → MeasurementSet with its analysis
 *   GET  measurement-sets/:id/file       engineer, admin   the raw file, byte for byte
 *   GET  vendor-parts/:id/measurement-sets  engineer, admin   ?housePartId → MeasurementSet[]
 */
import { z } from 'zod';
import { breakdownModelSchema } from '../engineering/normalize.schema';
import { actorSchema } from '../parts/page.schema';
import { checkQuantitySchema, limitKindSchema } from '../qualifications/evaluation.schema';
import { qualificationVerdictSchema } from '../qualifications/qualification-state.schema';
import { measuredSampleSchema, spreadSchema } from './measurement-csv.schema';

const shortText = (max: number) => z.string().trim().min(1).max(max);

/** The multipart fields beside the file. */
export const measurementSetFieldsSchema = z.strictObject({
  vendorPartId: z.coerce.number().int().positive(),
  /** Lot or date code of the samples (also per row in a `lot` column). */
  lot: shortText(60).optional(),
  instrument: shortText(120).optional(),
  /** The day the samples were measured (YYYY-MM-DD). */
  measuredOn: z.iso.date().optional(),
  note: shortText(2000).optional(),
});
export type MeasurementSetFields = z.infer<typeof measurementSetFieldsSchema>;

/** One sample's fit and its figures at the card's and the spec's currents (SI, 25 °C). */
export const sampleResultSchema = z.object({
  sampleId: z.string(),
  lot: z.string().nullable(),
  points: z.number().int(),
  temperaturesC: z.array(z.number()),
  /** null when the points could not be fitted (see `error`). */
  model: breakdownModelSchema.nullable(),
  residualRms: z.number().nullable(),
  currentRange: z.object({ min: z.number(), max: z.number() }).nullable(),
  vzAtIzt: z.number().nullable(),
  vzAtIRef: z.number().nullable(),
  zdAtIzt: z.number().nullable(),
  zdAtIRef: z.number().nullable(),
  zdAtKnee: z.number().nullable(),
  /** dVz/dT (V/K) when the sample was measured at two or more temperatures. */
  alphaVz: z.number().nullable(),
  warnings: z.array(z.string()),
  error: z.string().nullable(),
});
export type SampleResult = z.infer<typeof sampleResultSchema>;

export const lotResultSchema = z.object({
  lot: z.string().nullable(),
  samples: z.number().int(),
  vzAtIzt: spreadSchema.nullable(),
  vzAtIRef: spreadSchema.nullable(),
  zdAtIzt: spreadSchema.nullable(),
  zdAtKnee: spreadSchema.nullable(),
});
export type LotResult = z.infer<typeof lotResultSchema>;

export const MEASURED_CHECK_IDS = ['card-vz', 'card-zzt', 'card-zzk', 'spec-vz', 'spec-zd'] as const;
export const measuredCheckIdSchema = z.enum(MEASURED_CHECK_IDS);
export type MeasuredCheckId = z.infer<typeof measuredCheckIdSchema>;

export const MEASURED_CHECK_LABELS: Record<MeasuredCheckId, string> = {
  'card-vz': 'Zener voltage at the card’s test current, within the datasheet’s limits',
  'card-zzt': 'Dynamic impedance at the card’s test current, within the datasheet’s limit',
  'card-zzk': 'Knee impedance at the card’s knee current, within the datasheet’s limit',
  'spec-vz': 'Zener voltage at the spec’s reference current, within the spec’s window',
  'spec-zd': 'Dynamic impedance at the spec’s reference current, within the spec’s limit',
};

/** Every sample against one limit: the sample nearest (or furthest past) the limit decides. */
export const measuredCheckSchema = z.object({
  id: measuredCheckIdSchema,
  label: z.string(),
  against: z.enum(['card', 'spec']),
  verdict: qualificationVerdictSchema,
  quantity: checkQuantitySchema,
  limitKind: limitKindSchema,
  value: z.number().nullable(),
  limit: z.number().nullable(),
  window: z.object({ min: z.number(), max: z.number() }).nullable(),
  margin: z.number().nullable(),
  /** Samples outside the limit. */
  failingSamples: z.array(z.string()),
  detail: z.string(),
});
export type MeasuredCheck = z.infer<typeof measuredCheckSchema>;

export const measurementAnalysisSchema = z.object({
  cardVersion: z.number().int().nullable(),
  housePartId: z.number().int().nullable(),
  specVersion: z.number().int().nullable(),
  referenceCurrent: z.number().nullable(),
  samples: z.array(sampleResultSchema),
  /** Per lot, and a last entry with lot null over every sample when there are several lots. */
  lots: z.array(lotResultSchema),
  checks: z.array(measuredCheckSchema),
  /**
   * The datasheet's band at 25 °C from the card's fitted model, over the measured currents:
   * the low and high tolerance ends and the nominal part (V), for drawing the samples against.
   */
  datasheetBand: z.array(z.object({ current: z.number(), low: z.number(), nom: z.number(), high: z.number() })),
  overall: qualificationVerdictSchema,
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type MeasurementAnalysis = z.infer<typeof measurementAnalysisSchema>;

export const measurementSetSchema = z.object({
  id: z.number().int(),
  vendorPartId: z.number().int(),
  fileName: z.string(),
  sha256: z.string(),
  sizeBytes: z.number().int(),
  lot: z.string().nullable(),
  instrument: z.string().nullable(),
  measuredOn: z.string().nullable(),
  note: z.string().nullable(),
  uploadedBy: actorSchema.nullable(),
  createdAt: z.string(),
  samples: z.array(measuredSampleSchema),
  analysis: measurementAnalysisSchema,
});
export type MeasurementSet = z.infer<typeof measurementSetSchema>;

/** `?housePartId=` holds the samples against that house part's current spec as well as the card. */
export const measurementSetQuerySchema = z.object({ housePartId: z.coerce.number().int().positive().optional() });
export type MeasurementSetQuery = z.infer<typeof measurementSetQuerySchema>;
