import { z } from 'zod';
import { leakageCurrent, physical, PHYSICAL_BOUNDS } from '../units/bounds';
import { fieldWithValue as fw } from '../units/field-labels';

/**
 * The ratings the engineering core computes from, all SI (V, A, Ω, W, °C, K/W, and the
 * temperature coefficient in V/K). The card keeps the coefficient as printed (mV/K or %/K)
 * for provenance; `tcVoltsPerKelvin` is the one conversion. Missing values may be absent or null.
 */
export const TEMP_CO_UNITS = ['mV/K', '%/K'] as const;
export const tempCoUnitSchema = z.enum(TEMP_CO_UNITS);
export type TempCoUnit = z.infer<typeof tempCoUnitSchema>;

export const tempCoSchema = z
  .strictObject({
    value: z.number(),
    unit: tempCoUnitSchema,
  })
  .superRefine((tc, ctx) => {
    const bound = PHYSICAL_BOUNDS[tc.unit === 'mV/K' ? 'tempCoMilliVoltsPerK' : 'tempCoPercentPerK'];
    if (tc.value < bound.min || tc.value > bound.max) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: `must be between ${bound.min} and ${bound.max} ${bound.unit}` });
    }
  });
export type TempCo = z.infer<typeof tempCoSchema>;

/**
 * A coefficient as printed in V/K: mV/K scaled, %/K taken of the nominal Zener voltage
 * (a relative coefficient is a fraction of VZ per kelvin). The only place the printed
 * form becomes the SI value: the card write, the card mapping and extraction call it.
 */
export function tcVoltsPerKelvin(tc: TempCo, vzNom: number): number {
  return tc.unit === 'mV/K' ? tc.value * 1e-3 : (tc.value / 100) * vzNom;
}

// Ranges from the one table of plausible values (units/bounds.ts).
const zenerVolts = physical('zenerVoltage');
const amperes = physical('current');
const ohms = physical('resistance');
const celsius = physical('temperature');

/** The card's fields, unrefined, for schemas that extend or pick from it. */
export const engineeringCardShape = {
  /** Nominal Zener voltage at izt, 25 °C (V). */
  vzNom: zenerVolts,
  vzMin: zenerVolts.nullish(),
  vzMax: zenerVolts.nullish(),
  /** Test current for vz and zzt (A). */
  izt: amperes,
  /** Dynamic impedance at izt (Ω). */
  zzt: ohms.nullish(),
  /** Knee current and the impedance there (A, Ω). */
  izk: amperes.nullish(),
  zzk: ohms.nullish(),
  /** Maximum reverse leakage (A) at reverse voltage vr (V). */
  irMax: leakageCurrent().nullish(),
  vr: physical('voltage').nullish(),
  /** Temperature coefficient of VZ at izt (V/K). */
  tc: physical('tempCoVoltsPerK').nullish(),
  /** Power rating (W) at the reference temperature pdRefC (°C, 25 °C when absent). */
  pdMax: physical('power').nullish(),
  pdRefC: celsius.nullish(),
  tjMax: celsius.nullish(),
  /** Junction-to-ambient thermal resistance (K/W). */
  rthJA: physical('thermalResistance').nullish(),
  /** Largest allowed Zener current (A). */
  izm: amperes.nullish(),
};

export type EngineeringCardInput = z.infer<z.ZodObject<typeof engineeringCardShape>>;

export interface CardFieldProblem {
  field: keyof EngineeringCardInput & string;
  message: string;
}

/**
 * The contradictions that make a card unusable (an error, not a warning): the order of
 * the voltage window, the knee below the test current, impedances too large for the
 * voltage, the leakage voltage below breakdown, a current rating below the test current,
 * tjMax above the rating's reference temperature. Shared by the API schema, the core and the card editor.
 */
export function engineeringCardContradictions(card: EngineeringCardInput): CardFieldProblem[] {
  const problems: CardFieldProblem[] = [];
  if (card.vzMin != null && card.vzMin > card.vzNom) {
    problems.push({ field: 'vzMin', message: `${fw('vzMin', card.vzMin)} is above ${fw('vzNom', card.vzNom)}` });
  }
  if (card.vzMax != null && card.vzMax < card.vzNom) {
    problems.push({ field: 'vzMax', message: `${fw('vzMax', card.vzMax)} is below ${fw('vzNom', card.vzNom)}` });
  }
  if (card.izk != null && card.izk >= card.izt) {
    problems.push({ field: 'izk', message: `${fw('izk', card.izk)} must be below ${fw('izt', card.izt)}` });
  }
  // zzt·izt is the junction's log slope at izt if RS were 0; a slope as large as vz itself
  // would put the voltage below zero a few times below izt.
  if (card.zzt != null && card.zzt * card.izt >= card.vzNom) {
    problems.push({
      field: 'zzt',
      message: `${fw('zzt', card.zzt)} × ${fw('izt', card.izt)} is not below ${fw('vzNom', card.vzNom)}: no junction in breakdown has that impedance`,
    });
  }
  if (card.zzk != null && card.izk != null && card.zzk * card.izk >= card.vzNom) {
    problems.push({
      field: 'zzk',
      message: `${fw('zzk', card.zzk)} × ${fw('izk', card.izk)} is not below ${fw('vzNom', card.vzNom)}: no junction in breakdown has that impedance`,
    });
  }
  if (card.vr != null && card.vr >= card.vzNom) {
    problems.push({ field: 'vr', message: `${fw('vr', card.vr)} must be below the Zener voltage ${fw('vzNom', card.vzNom)}` });
  }
  if (card.izm != null && card.izm < card.izt) {
    problems.push({ field: 'izm', message: `${fw('izm', card.izm)} is below the test current ${fw('izt', card.izt)}` });
  }
  const pdRefC = card.pdRefC ?? 25;
  if (card.tjMax != null && card.tjMax <= pdRefC) {
    problems.push({ field: 'tjMax', message: `${fw('tjMax', card.tjMax)} must be above the power rating's reference temperature ${fw('pdRefC', pdRefC)}` });
  }
  return problems;
}

export const engineeringCardSchema = z.strictObject(engineeringCardShape).superRefine((card, ctx) => {
  for (const problem of engineeringCardContradictions(card)) {
    ctx.addIssue({ code: 'custom', path: [problem.field], message: problem.message });
  }
});
export type EngineeringCard = z.infer<typeof engineeringCardSchema>;

/** A finding on a card, with the field it concerns (for the card editor). */
export const cardIssueSchema = z.object({
  field: z.string(),
  severity: z.enum(['error', 'warning']),
  message: z.string(),
});
export type CardIssue = z.infer<typeof cardIssueSchema>;
