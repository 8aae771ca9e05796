/**
 * Requests for a qualification (all under /api):
 *   GET  qualification-requests                 engineer, admin (all); designer (their own)   ?status=open|all, mine, vendorPartId, pageIndex, pageSize
 *   POST qualification-requests                 designer, engineer                            {vendorPartId, housePartId?, note, neededBy?}
 *   GET  qualification-requests/:id             engineer, admin; designer (their own)
 *   POST qualification-requests/:id/open-case   engineer                                      {housePartId?, summary?}
 *   POST qualification-requests/:id/decline     engineer                                      {reply}
 *
 * A designer asks for a vendor part to be qualified, optionally for a named house part,
 * saying what it is for. An engineer opens a case from it (the request is then taken up
 * and points at the case) or declines it with a reply. Any case opened for the same vendor
 * part and house part — by whatever way — takes up the open requests for it; a request that
 * named no house part is taken up by the first case opened for its vendor part.
 */
import { z } from 'zod';
import { actorSchema, pageQueryShape, pageSchema, queryBooleanSchema } from '../parts/page.schema';
import { housePartRefSchema, vendorPartRefSchema } from './qualification.schema';
import { qualificationStateSchema } from './qualification-state.schema';
import { RULED_OUT_STATES } from './source-standing';

export const QUALIFICATION_REQUEST_STATES = ['open', 'taken-up', 'declined'] as const;
export const qualificationRequestStateSchema = z.enum(QUALIFICATION_REQUEST_STATES);
export type QualificationRequestState = z.infer<typeof qualificationRequestStateSchema>;

export const QUALIFICATION_REQUEST_STATE_LABELS: Record<QualificationRequestState, string> = {
  open: 'Waiting for an engineer',
  'taken-up': 'Taken up',
  declined: 'Declined',
};

export const qualificationRequestSchema = z.object({
  id: z.number().int(),
  vendorPart: vendorPartRefSchema,
  /** The house part it is wanted for; null when the requester left the choice to the engineer. */
  housePart: housePartRefSchema.nullable(),
  /** The application: what it is for, why this part, by when. */
  note: z.string(),
  /** When the design needs it (a date, YYYY-MM-DD), if the requester said. */
  neededBy: z.string().nullable(),
  state: qualificationRequestStateSchema,
  requestedBy: actorSchema,
  createdAt: z.string(),
  /** Who took it up or declined it, and when. */
  closedBy: actorSchema.nullable(),
  closedAt: z.string().nullable(),
  /** The engineer's reply when declined. */
  reply: z.string().nullable(),
  /**
   * When the latest decision on this vendor part for the named house part ruled it out
   * (rejected, or revoked): that case, so the engineer sees it before taking the request up.
   */
  ruledOut: z.object({ caseId: z.number().int(), state: z.enum(RULED_OUT_STATES), reason: z.string().nullable(), at: z.string().nullable() }).nullable(),
  /** The case that took it up, as it stands now. */
  case: z
    .object({
      id: z.number().int(),
      revision: z.number().int(),
      state: qualificationStateSchema,
      housePart: housePartRefSchema,
    })
    .nullable(),
});
export type QualificationRequest = z.infer<typeof qualificationRequestSchema>;

export const QUALIFICATION_REQUEST_STATUSES = ['open', 'all'] as const;

export const qualificationRequestListQuerySchema = z.object({
  ...pageQueryShape,
  /** open (default): waiting for an engineer; all: every state, newest first. */
  status: z.enum(QUALIFICATION_REQUEST_STATUSES).default('open'),
  /** Only the caller's own requests (designers always see only theirs). */
  mine: queryBooleanSchema.optional(),
  vendorPartId: z.coerce.number().int().positive().optional(),
});
export type QualificationRequestListQuery = z.infer<typeof qualificationRequestListQuerySchema>;

export const qualificationRequestPageSchema = pageSchema(qualificationRequestSchema);
export type QualificationRequestPage = z.infer<typeof qualificationRequestPageSchema>;

/** A calendar date as YYYY-MM-DD that exists (no 31 April). */
export const calendarDateSchema = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'a date as YYYY-MM-DD')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'not a calendar date');

export const QUALIFICATION_REQUEST_NOTE_MAX = 2000;

/** `POST /api/qualification-requests` (designers, engineers). */
export const createQualificationRequestRequestSchema = z.strictObject({
  vendorPartId: z.number().int().positive(),
  housePartId: z.number().int().positive().nullish(),
  note: z.string().trim().min(1, 'Say what it is for: the design, why this part, by when').max(QUALIFICATION_REQUEST_NOTE_MAX),
  neededBy: calendarDateSchema.nullish(),
});
export type CreateQualificationRequestRequest = z.input<typeof createQualificationRequestRequestSchema>;

/** `POST /api/qualification-requests/:id/open-case` (engineers): the house part is required when the request named none. */
export const openCaseFromRequestSchema = z.strictObject({
  housePartId: z.number().int().positive().optional(),
  /** The case's notes; without them the case notes quote the request. */
  summary: z.string().trim().max(4000).optional(),
});
export type OpenCaseFromRequest = z.input<typeof openCaseFromRequestSchema>;

/** `POST /api/qualification-requests/:id/decline` (engineers): the requester is mailed the reply. */
export const declineQualificationRequestSchema = z.strictObject({
  reply: z.string().trim().min(1, 'Write the reply to the requester: why not, or what to use instead').max(2000),
});
export type DeclineQualificationRequest = z.input<typeof declineQualificationRequestSchema>;
