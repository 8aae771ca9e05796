/**
 * Waiver routes (all under /api):
 *   GET  qualifications/:id/waivers                       engineer, admin
 *   POST qualifications/:id/waivers                       engineer (case open)       {checkId, acceptedLimit, reason, expiresOn}
 *   POST qualifications/:id/waivers/:waiverId/approve     engineer (not the preparer) {note?}
 *   POST qualifications/:id/waivers/:waiverId/refuse      engineer (not the preparer) {reason}
 * Designers and buyers see approved waivers through Sources and search. Who may do what,
 * and when a waiver is in force, is in ./source-standing.ts.
 */
import { z } from 'zod';
import { actorSchema } from '../parts/page.schema';
import { checkIdSchema, checkQuantitySchema, limitKindSchema } from './evaluation.schema';

/** A waiver's life: prepared by one engineer, approved or refused by another; an approved one lapses at its expiry. */
export const WAIVER_STATES = ['proposed', 'approved', 'refused', 'lapsed'] as const;
export const waiverStateSchema = z.enum(WAIVER_STATES);
export type WaiverState = z.infer<typeof waiverStateSchema>;

export const WAIVER_STATE_LABELS: Record<WaiverState, string> = {
  proposed: 'Waiting for approval',
  approved: 'Approved',
  refused: 'Refused',
  lapsed: 'Lapsed',
};

/** A calendar date `YYYY-MM-DD` (the last day the waiver holds). */
export const isoDateSchema = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date YYYY-MM-DD')
  .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'must be a real calendar date');

export const waiverSchema = z.object({
  id: z.number().int(),
  qualificationId: z.number().int(),
  housePartId: z.number().int(),
  vendorPartId: z.number().int(),
  checkId: checkIdSchema,
  checkLabel: z.string(),
  quantity: checkQuantitySchema,
  limitKind: limitKindSchema,
  /** The limit the check had and the one accepted instead (SI; null for a text check). */
  specLimit: z.number().nullable(),
  acceptedLimit: z.number().nullable(),
  /** The part's value the check found (SI), for reference. */
  value: z.number().nullable(),
  reason: z.string(),
  /** Last day the waiver holds; from the day after, the source is no longer usable on it. */
  expiresOn: z.string(),
  state: waiverStateSchema,
  preparedBy: actorSchema,
  decidedBy: actorSchema.nullable(),
  decidedAt: z.string().nullable(),
  decisionNote: z.string().nullable(),
  lapsedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Waiver = z.infer<typeof waiverSchema>;

/** What lists (Board, Sources, search) show of a waiver a standing rests on. */
export const waiverBriefSchema = z.object({
  id: z.number().int(),
  checkId: checkIdSchema,
  quantity: checkQuantitySchema,
  acceptedLimit: z.number().nullable(),
  expiresOn: z.string(),
  state: waiverStateSchema,
});
export type WaiverBrief = z.infer<typeof waiverBriefSchema>;

export const createWaiverRequestSchema = z.strictObject({
  checkId: checkIdSchema,
  /** The limit accepted instead of the spec's, in SI units of the check's quantity; null only for a text check (package). */
  acceptedLimit: z.number().finite().nullable(),
  reason: z.string().trim().min(1, 'Write the reason for the waiver').max(2000),
  expiresOn: isoDateSchema,
});
export type CreateWaiverRequest = z.input<typeof createWaiverRequestSchema>;

export const approveWaiverRequestSchema = z.strictObject({ note: z.string().trim().max(2000).nullish() });
export type ApproveWaiverRequest = z.input<typeof approveWaiverRequestSchema>;
export const refuseWaiverRequestSchema = z.strictObject({ reason: z.string().trim().min(1, 'Write the reason for refusing the waiver').max(2000) });
export type RefuseWaiverRequest = z.input<typeof refuseWaiverRequestSchema>;

export const waiverListSchema = z.object({ items: z.array(waiverSchema) });
export type WaiverList = z.infer<typeof waiverListSchema>;
