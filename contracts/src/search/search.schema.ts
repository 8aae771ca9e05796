import { z } from 'zod';
import { fieldWithValue as fw } from '../units/field-labels';
import { housePartStatusSchema } from '../parts/house-part.schema';
import { actorSchema, pageQueryShape, pageSchema, queryBooleanSchema, sortQuerySchema } from '../parts/page.schema';
import { RULED_OUT_STATES, USABLE_STATES } from '../qualifications/source-standing';
import { waiverBriefSchema } from '../qualifications/waiver.schema';

/**
 * `GET /api/search` (designer, engineer, admin): the parts a designer may design in, found
 * by parametric filters and text. A vendor part is usable for a house part when it is on
 * that house part's source list and its latest decided qualification approved it as the
 * approved source or cleared it (with or without conditions): USABLE_STATES in
 * qualifications/source-standing.ts. A rejection or revocation ends that.
 */
export const CLEARANCE_STANDINGS = USABLE_STATES;
export const clearanceStandingSchema = z.enum(CLEARANCE_STANDINGS);
export type ClearanceStanding = z.infer<typeof clearanceStandingSchema>;

export const CLEARANCE_STANDING_LABELS: Record<ClearanceStanding, string> = {
  approved: 'Approved source',
  cleared: 'Cleared',
  'cleared-with-conditions': 'Cleared with conditions',
  'cleared-with-waiver': 'Cleared with waiver',
};

export const SEARCH_SORTS = ['relevance', 'vzNom', 'mpn', 'manufacturer', 'package', 'pdMax'] as const;
export type SearchSort = (typeof SEARCH_SORTS)[number];

/** The n-gram index hands at most this many best-matching parts (after the filters) to the fuzzy ranking. */
export const SEARCH_TEXT_CANDIDATES = 300;

/** A comma list of exact names ("SOD-123,SOD-323"); empty entries dropped. */
const commaListSchema = (max: number) =>
  z
    .string()
    .trim()
    .max(max)
    .transform((text) => [
      ...new Set(
        text
          .split(',')
          .map((s) => s.trim())
          .filter(Boolean),
      ),
    ])
    .optional();

export const searchQuerySchema = z
  .object({
    ...pageQueryShape,
    pageSize: z.coerce.number().int().min(1).max(100).default(25),
    /** Part numbers (vendor and house), manufacturer, house-part description; typos tolerated. */
    q: z
      .string()
      .trim()
      .max(100)
      .optional()
      .transform((s) => (s ? s : undefined)),
    /** Zener voltage at the part's own test current, 25 °C (V): its nominal value lies in vzFrom..vzTo. */
    vzFrom: z.coerce.number().positive().max(1000).optional(),
    vzTo: z.coerce.number().positive().max(1000).optional(),
    /** With true the whole tolerance window vzMin..vzMax must lie in vzFrom..vzTo (parts without both ends drop out). */
    vzWindow: queryBooleanSchema.optional(),
    /** Packages, exact names, comma separated. */
    package: commaListSchema(1000),
    /** Smallest power rating pdMax (W). */
    pdMin: z.coerce.number().positive().max(1000).optional(),
    /** Largest Zener-voltage tolerance as a fraction (0.02 for ±2 %), as `vzTolerance` reads the card: printed, else the window ends less their print rounding. */
    toleranceMax: z.coerce.number().positive().max(0.5).optional(),
    /** Manufacturers, exact names, comma separated. */
    manufacturer: commaListSchema(2000),
    /** Only parts usable for this house part. */
    housePartId: z.coerce.number().int().positive().optional(),
    /** Also catalogue parts that are not usable anywhere (marked `cleared: false`). */
    includeNotCleared: queryBooleanSchema.optional(),
    /** relevance (with text; else as vzNom), or a field, `-` for descending. */
    sort: sortQuerySchema(SEARCH_SORTS, 'relevance'),
  })
  .superRefine((q, ctx) => {
    if (q.vzFrom !== undefined && q.vzTo !== undefined && q.vzFrom > q.vzTo) {
      ctx.addIssue({ code: 'custom', path: ['vzFrom'], message: `${fw('vzFrom', q.vzFrom)} is above ${fw('vzTo', q.vzTo)}` });
    }
    if (q.vzWindow && q.vzFrom === undefined && q.vzTo === undefined) {
      ctx.addIssue({ code: 'custom', path: ['vzWindow'], message: 'vzWindow needs vzFrom or vzTo: the window is checked against that range' });
    }
    if (q.housePartId !== undefined && q.includeNotCleared) {
      ctx.addIssue({
        code: 'custom',
        path: ['includeNotCleared'],
        message: 'housePartId lists the parts usable for that house part; it cannot be combined with includeNotCleared',
      });
    }
  });
export type SearchQuery = z.infer<typeof searchQuerySchema>;
export type SearchQueryInput = z.input<typeof searchQuerySchema>;

/** Why a part may be designed in for one house part, and since when. */
export const clearanceSchema = z.object({
  housePart: z.object({ id: z.number().int(), partNumber: z.string(), description: z.string(), status: housePartStatusSchema }),
  standing: clearanceStandingSchema,
  /** The conditions of a clearance with conditions (else the decision's note, if any). */
  conditions: z.string().nullable(),
  /** The decision (or, for an approved source without a case, when it joined the source list). */
  since: z.string().nullable(),
  decidedBy: actorSchema.nullable(),
  caseId: z.number().int().nullable(),
  revision: z.number().int().nullable(),
  /** A catalogue change since the decision: engineers are to re-check it. */
  needsRecheck: z.boolean(),
  /** A newer case for this pair is open (a re-check under way). */
  recheckOpen: z.boolean(),
  /** For a clearance with waiver: the waivers it rests on and when each expires. */
  waivers: z.array(waiverBriefSchema),
});
export type Clearance = z.infer<typeof clearanceSchema>;

/**
 * A house part this part was ruled out for by its latest decision (RULED_OUT_STATES in
 * qualifications/source-standing.ts): rejected, or a clearance revoked. Not a standing to
 * design by: the reason, who decided and when, so a designer does not ask again blindly.
 */
export const ruledOutSchema = z.object({
  housePart: z.object({ id: z.number().int(), partNumber: z.string(), description: z.string(), status: housePartStatusSchema }),
  state: z.enum(RULED_OUT_STATES),
  caseId: z.number().int(),
  /** The rejection's reason, or the revocation's. */
  reason: z.string().nullable(),
  at: z.string().nullable(),
  by: actorSchema.nullable(),
});
export type RuledOut = z.infer<typeof ruledOutSchema>;

/**
 * The card as a designer chooses by it (SI): the engineering card as `toEngineeringCard`
 * reads the stored card (what `POST /engineering/regulator` takes as `card`), plus
 * `version` and `tolerance` for display.
 */
export const searchCardSchema = z.object({
  version: z.number().int(),
  vzMin: z.number().nullable(),
  vzNom: z.number(),
  vzMax: z.number().nullable(),
  izt: z.number(),
  zzt: z.number().nullable(),
  izk: z.number().nullable(),
  zzk: z.number().nullable(),
  irMax: z.number().nullable(),
  vr: z.number().nullable(),
  /** Temperature coefficient (V/K). */
  tc: z.number().nullable(),
  pdMax: z.number().nullable(),
  pdRefC: z.number().nullable(),
  tjMax: z.number().nullable(),
  rthJA: z.number().nullable(),
  izm: z.number().nullable(),
  /** The Zener-voltage tolerance as `vzTolerance` reads the card (printed, else the ends less their print rounding); null without both ends. */
  tolerance: z.number().nullable(),
});
export type SearchCard = z.infer<typeof searchCardSchema>;

export const searchItemSchema = z.object({
  vendorPart: z.object({
    id: z.number().int(),
    manufacturer: z.string(),
    mpn: z.string(),
    package: z.string().nullable(),
    lifecycleNote: z.string().nullable(),
  }),
  /** null when the part has no rating card yet (no circuit check then). */
  card: searchCardSchema.nullable(),
  /** The newest datasheet linked to the part (`GET /datasheets/:id/file`). */
  datasheetId: z.number().int().nullable(),
  /** Usable for at least one house part. */
  cleared: z.boolean(),
  clearances: z.array(clearanceSchema),
  /** The house parts its latest decision ruled it out for (rejected or revoked). */
  ruledOut: z.array(ruledOutSchema),
  /** Not usable yet, but a qualification case is open for it. */
  qualificationOpen: z.boolean(),
  /** Text match quality, 0 (exact) to 1; null without text. */
  score: z.number().nullable(),
});
export type SearchItem = z.infer<typeof searchItemSchema>;

export const SEARCH_TEXT_MODES = ['none', 'fuzzy', 'prefix'] as const;

export const searchPageSchema = pageSchema(searchItemSchema).extend({
  /** How the text was matched: fuzzily over the parts the n-gram index found closest (after the filters), or, for text too short to index, over parts whose names start with the words. */
  text: z.object({
    mode: z.enum(SEARCH_TEXT_MODES),
    /** Parts the text was ranked over. */
    candidates: z.number().int(),
    /** More parts matched the SQL narrowing than were ranked: narrow the filters. */
    truncated: z.boolean(),
    note: z.string().nullable(),
  }),
});
export type SearchPage = z.infer<typeof searchPageSchema>;

/** `GET /api/search/facets`: what the filters can choose from, with how many usable parts (and all catalogue parts) each has. */
export const searchFacetsSchema = z.object({
  packages: z.array(z.object({ value: z.string(), cleared: z.number().int(), total: z.number().int() })),
  manufacturers: z.array(z.object({ value: z.string(), cleared: z.number().int(), total: z.number().int() })),
  houseParts: z.array(
    z.object({ id: z.number().int(), partNumber: z.string(), description: z.string(), status: housePartStatusSchema, cleared: z.number().int() }),
  ),
  clearedParts: z.number().int(),
  catalogueParts: z.number().int(),
});
export type SearchFacets = z.infer<typeof searchFacetsSchema>;
