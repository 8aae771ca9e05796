import { z } from 'zod';
import { STALE_CONFLICT_CODE } from '../common/error.schema';
import {
  cardIssueSchema,
  engineeringCardContradictions,
  engineeringCardShape,
  tempCoSchema,
  tempCoUnitSchema,
  tcVoltsPerKelvin,
  type EngineeringCardInput,
} from '../engineering/card.schema';
import { breakdownModelSchema, normalizeResponseSchema } from '../engineering/normalize.schema';
import type { QuantityKind } from '../units/quantity';
import { actorSchema } from './page.schema';

/** The rating card's fields; every value is SI except tc, which keeps the unit the datasheet used. */
export const CARD_FIELDS = ['vzMin', 'vzNom', 'vzMax', 'izt', 'zzt', 'izk', 'zzk', 'irMax', 'vr', 'tc', 'pdMax', 'pdRefC', 'tjMax', 'rthJA', 'izm'] as const;
export type CardField = (typeof CARD_FIELDS)[number];
export type PlainCardField = Exclude<CardField, 'tc'>;

/** The quantity kind of each plain field (how CSV cells and typed values are read). */
export const CARD_FIELD_KINDS: Record<PlainCardField, QuantityKind> = {
  vzMin: 'voltage',
  vzNom: 'voltage',
  vzMax: 'voltage',
  izt: 'current',
  zzt: 'resistance',
  izk: 'current',
  zzk: 'resistance',
  irMax: 'current',
  vr: 'voltage',
  pdMax: 'power',
  pdRefC: 'temperature',
  tjMax: 'temperature',
  rthJA: 'thermalResistance',
  izm: 'current',
};

/** Fields a card cannot do without: the engineering core computes from vzNom at izt. */
export const REQUIRED_CARD_FIELDS = ['vzNom', 'izt'] as const satisfies readonly CardField[];

export const PROVENANCE_SOURCES = ['extracted', 'entered', 'imported'] as const;
export const provenanceSourceSchema = z.enum(PROVENANCE_SOURCES);
export type ProvenanceSource = z.infer<typeof provenanceSourceSchema>;

/** Where a value came from, as the editor sends it. An extracted value names its datasheet and page. */
export const provenanceInputSchema = z
  .strictObject({
    source: provenanceSourceSchema,
    datasheetId: z.number().int().positive().nullish(),
    page: z.number().int().min(1).max(10_000).nullish(),
    /** The printed text the value was read from. */
    text: z.string().max(500).nullish(),
  })
  .superRefine((p, ctx) => {
    if (p.source !== 'extracted') return;
    if (p.datasheetId == null) ctx.addIssue({ code: 'custom', path: ['datasheetId'], message: 'an extracted value names its datasheet' });
    if (p.page == null) ctx.addIssue({ code: 'custom', path: ['page'], message: 'an extracted value names its page' });
  });
export type ProvenanceInput = z.infer<typeof provenanceInputSchema>;

export const cardValueInputSchema = z.strictObject({
  /** SI value (V, A, Ω, W, °C, K/W). */
  value: z.number().finite(),
  /** The value as printed or typed, e.g. "20 mA". */
  printed: z.string().trim().max(80).nullish(),
  provenance: provenanceInputSchema,
  /** Saving with confirmed true records the saving engineer as the one who confirmed the value. */
  confirmed: z.boolean().default(true),
});
export type CardValueInput = z.input<typeof cardValueInputSchema>;

/** tc as the datasheet gives it: mV/K or %/K (within that unit's plausible range); the API stores its V/K beside it. */
export const tcValueInputSchema = cardValueInputSchema.extend({ unit: tempCoUnitSchema }).superRefine((tc, ctx) => {
  const printed = tempCoSchema.safeParse({ value: tc.value, unit: tc.unit });
  if (!printed.success) for (const issue of printed.error.issues) ctx.addIssue({ code: 'custom', path: ['value'], message: `tc: ${issue.message}` });
});
export type TcValueInput = z.input<typeof tcValueInputSchema>;

const fieldsInputShape = {
  vzMin: cardValueInputSchema.nullish(),
  vzNom: cardValueInputSchema,
  vzMax: cardValueInputSchema.nullish(),
  izt: cardValueInputSchema,
  zzt: cardValueInputSchema.nullish(),
  izk: cardValueInputSchema.nullish(),
  zzk: cardValueInputSchema.nullish(),
  irMax: cardValueInputSchema.nullish(),
  vr: cardValueInputSchema.nullish(),
  tc: tcValueInputSchema.nullish(),
  pdMax: cardValueInputSchema.nullish(),
  pdRefC: cardValueInputSchema.nullish(),
  tjMax: cardValueInputSchema.nullish(),
  rthJA: cardValueInputSchema.nullish(),
  izm: cardValueInputSchema.nullish(),
};

/**
 * Anything with card fields holding `value`: the stored card (tc with its `voltsPerKelvin`),
 * the input and the editor's draft (tc as printed, converted here with the card's vzNom).
 */
export type ValuedFields = Partial<Record<PlainCardField, { value: number } | null | undefined>> & {
  tc?: { value: number; unit: 'mV/K' | '%/K'; voltsPerKelvin?: number } | null;
};

/**
 * THE mapping from a card to the engineering core's input (all SI, tc in V/K); null without
 * vzNom or izt. The evaluation, the card read, search (and so the circuit check) and the
 * card editor all read a card through it, so the numbers shown and the numbers judged agree.
 */
export function toEngineeringCard(fields: ValuedFields): EngineeringCardInput | null {
  const v = (f: PlainCardField) => fields[f]?.value ?? null;
  const vzNom = v('vzNom');
  const izt = v('izt');
  if (vzNom === null || izt === null) return null;
  return {
    vzNom,
    izt,
    vzMin: v('vzMin'),
    vzMax: v('vzMax'),
    zzt: v('zzt'),
    izk: v('izk'),
    zzk: v('zzk'),
    irMax: v('irMax'),
    vr: v('vr'),
    tc: fields.tc ? (fields.tc.voltsPerKelvin ?? tcVoltsPerKelvin(fields.tc, vzNom)) : null,
    pdMax: v('pdMax'),
    pdRefC: v('pdRefC'),
    tjMax: v('tjMax'),
    rthJA: v('rthJA'),
    izm: v('izm'),
  };
}

const engineeringRanges = z.strictObject(engineeringCardShape);

/**
 * The engineering core's own rules on the SI values (ranges and contradictions), reported
 * at `<field>.value` so the editor can put each message under its input.
 */
export function cardFieldProblems(fields: ValuedFields): Array<{ path: string[]; message: string }> {
  const card = toEngineeringCard(fields);
  if (!card) return [];
  const problems: Array<{ path: string[]; message: string }> = [];
  const ranges = engineeringRanges.safeParse(card);
  if (!ranges.success) {
    for (const issue of ranges.error.issues) {
      const field = String(issue.path[0] ?? 'vzNom');
      problems.push({ path: [field, 'value'], message: `${field}: ${issue.message}` });
    }
    return problems;
  }
  for (const p of engineeringCardContradictions(card)) problems.push({ path: [p.field, 'value'], message: p.message });
  return problems;
}

/** A whole card's fields as the editor, the series review and the CSV import send them. */
export const ratingCardFieldsInputSchema = z.strictObject(fieldsInputShape).superRefine((fields, ctx) => {
  for (const p of cardFieldProblems(fields)) ctx.addIssue({ code: 'custom', path: p.path, message: p.message });
});
export type RatingCardFieldsInput = z.input<typeof ratingCardFieldsInputSchema>;
export type RatingCardFieldsParsed = z.infer<typeof ratingCardFieldsInputSchema>;

/** `PUT /vendor-parts/:id/rating-card`: the whole card, based on the version the editor loaded (0 for a new card). */
export const putRatingCardRequestSchema = z.strictObject({
  version: z.number().int().min(0),
  fields: ratingCardFieldsInputSchema,
  note: z.string().trim().max(500).nullish(),
});
export type PutRatingCardRequest = z.input<typeof putRatingCardRequestSchema>;

export const provenanceSchema = z.object({
  source: provenanceSourceSchema,
  datasheetId: z.number().int().nullable(),
  page: z.number().int().nullable(),
  text: z.string().nullable(),
  confirmedBy: actorSchema.nullable(),
  confirmedAt: z.string().nullable(),
});
export type Provenance = z.infer<typeof provenanceSchema>;

export const cardValueSchema = z.object({
  value: z.number(),
  printed: z.string().nullable(),
  provenance: provenanceSchema,
});
export type CardValue = z.infer<typeof cardValueSchema>;

export const tcValueSchema = cardValueSchema.extend({
  unit: tempCoUnitSchema,
  /** The coefficient in V/K (a %/K figure converted with the card's vzNom). */
  voltsPerKelvin: z.number(),
});
export type TcValue = z.infer<typeof tcValueSchema>;

export const ratingCardFieldsSchema = z.object({
  vzMin: cardValueSchema.optional(),
  vzNom: cardValueSchema.optional(),
  vzMax: cardValueSchema.optional(),
  izt: cardValueSchema.optional(),
  zzt: cardValueSchema.optional(),
  izk: cardValueSchema.optional(),
  zzk: cardValueSchema.optional(),
  irMax: cardValueSchema.optional(),
  vr: cardValueSchema.optional(),
  tc: tcValueSchema.optional(),
  pdMax: cardValueSchema.optional(),
  pdRefC: cardValueSchema.optional(),
  tjMax: cardValueSchema.optional(),
  rthJA: cardValueSchema.optional(),
  izm: cardValueSchema.optional(),
});
export type RatingCardFields = z.infer<typeof ratingCardFieldsSchema>;

/** A card as stored: version 0 with no fields when the vendor part has none yet. */
export const ratingCardSchema = z.object({
  vendorPartId: z.number().int(),
  version: z.number().int(),
  fields: ratingCardFieldsSchema,
  note: z.string().nullable(),
  updatedAt: z.string().nullable(),
  updatedBy: actorSchema.nullable(),
});
export type RatingCard = z.infer<typeof ratingCardSchema>;

/**
 * The card with what the engineering core makes of it: field-named issues, and the fitted
 * model, mechanism and normalised values at the currents of a house part's spec (`basis`;
 * the card's own test currents at 25 °C when no spec applies).
 */
export const ratingCardViewSchema = ratingCardSchema.extend({
  issues: z.array(cardIssueSchema),
  /** Only with `include=engineering`: the card normalised by the same function and currents the card editor uses (normalizeBasis). */
  engineering: z
    .object({
      basis: z.object({ housePartId: z.number().int(), partNumber: z.string(), specVersion: z.number().int() }).nullable(),
      result: normalizeResponseSchema.nullable(),
      /** Why there is no result (no vzNom/izt yet, or the core refused the card). */
      reason: z.string().nullable(),
    })
    .optional(),
});
export type RatingCardView = z.infer<typeof ratingCardViewSchema>;

export const ratingCardQuerySchema = z.object({
  /** Read an earlier version. */
  version: z.coerce.number().int().min(1).optional(),
  /** Normalise at this house part's spec currents (with include=engineering). */
  housePartId: z.coerce.number().int().positive().optional(),
  /** `engineering` adds the card's normalised reading; a plain read does not compute it. */
  include: z.enum(['engineering']).optional(),
});
export type RatingCardQuery = z.infer<typeof ratingCardQuerySchema>;

/**
 * 409 body of a stale card save: the one stale-conflict body (staleConflictBodySchema in
 * common/error.schema.ts) whose `current` is the card as it is now, so the editor can show both.
 */
export const ratingCardConflictSchema = z.object({
  message: z.string(),
  code: z.literal(STALE_CONFLICT_CODE),
  errors: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  correlationId: z.string(),
  current: ratingCardViewSchema,
});
export type RatingCardConflict = z.infer<typeof ratingCardConflictSchema>;

/** A field's value on one side of a change: the number (SI; tc in its own unit) or null when absent. */
const cardChangeSideSchema = z.object({ value: z.number(), unit: z.enum(['mV/K', '%/K']).optional() }).nullable();

/** One changed field of a version against the one before: old → new (same numbers when only its provenance changed). */
export const cardFieldChangeSchema = z.object({ field: z.string(), from: cardChangeSideSchema, to: cardChangeSideSchema });
export type CardFieldChange = z.infer<typeof cardFieldChangeSchema>;

export const ratingCardVersionSummarySchema = z.object({
  version: z.number().int(),
  changedFields: z.array(z.string()),
  changes: z.array(cardFieldChangeSchema),
  note: z.string().nullable(),
  changedBy: actorSchema.nullable(),
  createdAt: z.string(),
});
export type RatingCardVersionSummary = z.infer<typeof ratingCardVersionSummarySchema>;

/** `GET /vendor-parts/:id/model`: the card's SPICE diode `.model` lines (nominal part and tolerance ends). */
export const vendorPartModelSchema = z.object({
  vendorPartId: z.number().int(),
  cardVersion: z.number().int(),
  /** Model name made from the mpn (letters, digits and _). */
  name: z.string(),
  lines: z.object({ nom: z.string(), min: z.string().nullable(), max: z.string().nullable() }),
  model: breakdownModelSchema,
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type VendorPartModel = z.infer<typeof vendorPartModelSchema>;
