import { z } from 'zod';
import { csvCellErrorSchema } from '../parts/csv-import.schema';

/**
 * Bench measurements of a vendor part's samples, as CSV: one row per point, a header row
 * naming the columns with their units — `sample`, `current (mA)`, `voltage (V)`, optional
 * `temperature (°C)` and `lot` — or units in each cell (`5 mA`). Currents in A/mA/µA, voltages
 * in V/mV. Reverse points may be written with both signs negative (as a source-measure unit
 * reports them); they are read as magnitudes. Points without a temperature are taken at 25 °C.
 */
export const MEASUREMENT_COLUMNS = ['sample', 'current', 'voltage', 'temperature', 'lot'] as const;
export const measurementColumnSchema = z.enum(MEASUREMENT_COLUMNS);
export type MeasurementColumn = z.infer<typeof measurementColumnSchema>;

/** One point in SI: reverse current (A, > 0), voltage (V), temperature (°C). */
export const measuredPointSchema = z.object({ current: z.number(), voltage: z.number(), tempC: z.number() });
export type MeasuredPointDto = z.infer<typeof measuredPointSchema>;

export const measuredSampleSchema = z.object({
  sampleId: z.string(),
  lot: z.string().nullable(),
  points: z.array(measuredPointSchema),
});
export type MeasuredSample = z.infer<typeof measuredSampleSchema>;

export const measurementCsvReadingSchema = z.object({
  columns: z.array(z.object({ header: z.string(), column: measurementColumnSchema.nullable(), unit: z.string().nullable() })),
  samples: z.array(measuredSampleSchema),
  errors: z.array(csvCellErrorSchema),
  warnings: z.array(z.string()),
});
export type MeasurementCsvReading = z.infer<typeof measurementCsvReadingSchema>;

/** Mean, extremes and sample standard deviation (n − 1) of one figure across samples (SI). */
export const spreadSchema = z.object({ n: z.number().int(), mean: z.number(), min: z.number(), max: z.number(), stdDev: z.number() });
export type SpreadDto = z.infer<typeof spreadSchema>;
