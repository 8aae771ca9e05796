/**
 * Qualification routes (all under /api):
 *   GET  qualifications                      engineer, admin, designer (cleared only)   ?state,housePartId,vendorPartId,engineerId,needsRecheck,latest,sort,pageIndex,pageSize
 *   POST qualifications                      engineer                                    {housePartId, vendorPartId, summary?}
 *   GET  qualifications/:id                  engineer, admin, designer (cleared only)
 *   PATCH qualifications/:id                 engineer (draft only)                       {version, summary?, reviewerId?}
 *   POST qualifications/:id/<action>         engineer                                    QUALIFICATION_ACTION_REQUEST_SCHEMAS[action]
 *   POST qualifications/:id/comments         engineer                                    {text}
 *   GET  qualification-views/board           engineer, admin                             boardQuerySchema
 *   GET  qualification-views/compare/:housePartId  engineer, admin, designer
 *   GET  qualification-views/sources(.csv)   buyer, engineer, admin, designer            sourcesQuerySchema
 *   GET/POST house-parts/:id/buyers, DELETE house-parts/:id/buyers/:userId   engineer, admin, buyer (themself)
 */
import { z } from 'zod';
import { actorSchema, pageQueryShape, pageSchema, queryBooleanSchema, sortQuerySchema } from '../parts/page.schema';
import { sourceRoleSchema } from '../parts/source.schema';
import { evaluationSchema } from './evaluation.schema';
import { qualificationActionSchema, qualificationStateSchema, qualificationVerdictSchema, type QualificationAction } from './qualification-state.schema';

/** What the audit trail records. Every state change and edit writes one entry. */
export const AUDIT_ACTIONS = [
  'opened',
  'evaluated',
  'edited',
  'submitted',
  'sent-back',
  'approved',
  'cleared',
  'cleared-with-conditions',
  'cleared-with-waiver',
  'rejected',
  'withdrawn',
  'revoked',
  'recheck-opened',
  'flagged-for-recheck',
  'commented',
  'waiver-prepared',
  'waiver-approved',
  'waiver-refused',
  'waiver-lapsed',
] as const;
export const auditActionSchema = z.enum(AUDIT_ACTIONS);
export type AuditAction = z.infer<typeof auditActionSchema>;

const auditValueSchema = z.union([z.string(), z.number(), z.boolean(), z.null()]);

export const auditEntrySchema = z.object({
  id: z.number().int(),
  at: z.string(),
  /** null when the system did it (a catalogue change flagging the case). */
  by: actorSchema.nullable(),
  action: auditActionSchema,
  fromState: qualificationStateSchema.nullable(),
  toState: qualificationStateSchema.nullable(),
  /** What changed: each field with its value before and after. */
  changes: z.array(z.object({ field: z.string(), from: auditValueSchema, to: auditValueSchema })),
  note: z.string().nullable(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;

export const qualificationCommentSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  by: actorSchema,
  text: z.string(),
});
export type QualificationComment = z.infer<typeof qualificationCommentSchema>;

/** Why a case needs a re-check: a catalogue change after it was evaluated, or a waiver it was cleared on expired. */
export const RECHECK_CAUSES = ['card-changed', 'spec-changed', 'datasheet-revised', 'measurements-added', 'waiver-expired'] as const;
export const recheckCauseSchema = z.enum(RECHECK_CAUSES);
export type RecheckCause = z.infer<typeof recheckCauseSchema>;

export const recheckReasonSchema = z.object({
  cause: recheckCauseSchema,
  at: z.string(),
  /** e.g. "rating card version 2 (changed: zzt, zzk)". */
  detail: z.string(),
});
export type RecheckReason = z.infer<typeof recheckReasonSchema>;

export const housePartRefSchema = z.object({ id: z.number().int(), partNumber: z.string(), description: z.string() });
export const vendorPartRefSchema = z.object({ id: z.number().int(), manufacturer: z.string(), mpn: z.string(), package: z.string().nullable() });

export const qualificationDecisionSchema = z.object({
  state: z.enum(['approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver', 'rejected']),
  by: actorSchema,
  at: z.string(),
  /** The spec and card versions the decision was made on. */
  specVersion: z.number().int(),
  cardVersion: z.number().int(),
  /** Conditions of a clearance with conditions; the reason of a rejection; an optional note otherwise (approval, clearance). */
  text: z.string().nullable(),
});
export type QualificationDecision = z.infer<typeof qualificationDecisionSchema>;

export const qualificationRevocationSchema = z.object({ by: actorSchema, at: z.string(), reason: z.string() });
export type QualificationRevocation = z.infer<typeof qualificationRevocationSchema>;

/** The fields a list shows. */
export const qualificationSummarySchema = z.object({
  id: z.number().int(),
  /** 1 for the first case of a house part and vendor part, then one more per re-check or new case. */
  revision: z.number().int(),
  /** The case this one revises, and the one that revised it (null when none). */
  previousId: z.number().int().nullable(),
  nextId: z.number().int().nullable(),
  housePart: housePartRefSchema,
  vendorPart: vendorPartRefSchema,
  /** The vendor part's role among the house part's sources; null when it is no longer a source. */
  sourceRole: sourceRoleSchema.nullable(),
  state: qualificationStateSchema,
  overall: qualificationVerdictSchema,
  specVersion: z.number().int(),
  cardVersion: z.number().int(),
  preparedBy: actorSchema,
  /** The engineer asked to review, when the preparer named one. */
  reviewer: actorSchema.nullable(),
  submittedAt: z.string().nullable(),
  decision: qualificationDecisionSchema.nullable(),
  revocation: qualificationRevocationSchema.nullable(),
  /** A catalogue change after the evaluation: decided cases need a re-check, open ones a new evaluation. */
  needsRecheck: z.boolean(),
  recheckReasons: z.array(recheckReasonSchema),
  /** Increments with every change; send it back with an edit or action to refuse stale ones. */
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type QualificationSummary = z.infer<typeof qualificationSummarySchema>;

/** `GET /api/qualifications/:id`: the case with its evaluation, comments, audit trail and what the caller may do. */
export const qualificationSchema = qualificationSummarySchema.extend({
  /** The preparer's notes on the case (editable in draft). */
  summary: z.string(),
  evaluation: evaluationSchema,
  /** The versions the catalogue is at now, to show an out-of-date evaluation. */
  current: z.object({ specVersion: z.number().int().nullable(), cardVersion: z.number().int().nullable() }),
  comments: z.array(qualificationCommentSchema),
  audit: z.array(auditEntrySchema),
  /** Actions the caller may take now (role, state and the two-person rule applied). */
  allowedActions: z.array(qualificationActionSchema),
  caution: z.string(),
});
export type Qualification = z.infer<typeof qualificationSchema>;

export const QUALIFICATION_SORTS = ['updatedAt', 'createdAt', 'state', 'id'] as const;
export type QualificationSort = (typeof QUALIFICATION_SORTS)[number];

/** States as a comma list, e.g. `state=draft,in-review`. */
export const qualificationStateListSchema = z
  .string()
  .trim()
  .max(200)
  .transform((text, ctx) => {
    const states = text
      .split(',')
      .map((s) => s.trim())
      .filter(Boolean);
    const parsed = z.array(qualificationStateSchema).safeParse(states);
    if (!parsed.success) {
      ctx.addIssue({ code: 'custom', message: `unknown state in "${text}"; states: ${qualificationStateSchema.options.join(', ')}` });
      return z.NEVER;
    }
    return [...new Set(parsed.data)];
  });

export const qualificationListQuerySchema = z.object({
  ...pageQueryShape,
  sort: sortQuerySchema(QUALIFICATION_SORTS, '-updatedAt'),
  state: qualificationStateListSchema.optional(),
  housePartId: z.coerce.number().int().positive().optional(),
  vendorPartId: z.coerce.number().int().positive().optional(),
  /** Cases this engineer prepared or decided. */
  engineerId: z.coerce.number().int().positive().optional(),
  needsRecheck: queryBooleanSchema.optional(),
  /** Only the latest revision of each house part and vendor part (default true). */
  latest: queryBooleanSchema.optional(),
});
export type QualificationListQuery = z.infer<typeof qualificationListQuerySchema>;

export const qualificationPageSchema = pageSchema(qualificationSummarySchema);
export type QualificationPage = z.infer<typeof qualificationPageSchema>;

const text = (max: number) => z.string().trim().max(max);
const required = (what: string, max = 2000) => z.string().trim().min(1, `Write the ${what}`).max(max);
/**
 * The case version the caller saw; a stale one is refused with 409. Required on every action
 * that changes the case, so no request can skip the optimistic lock by leaving it out
 * (a re-check opens a new case and leaves this one as it is, so it takes none).
 */
const versionField = z
  .number({ error: (i) => (i.input === undefined ? 'Send the case version you loaded' : 'must be the case version, a whole number') })
  .int()
  .min(0);

/** `POST /api/qualifications` (engineers): opens a case and evaluates it against the current spec and card. */
export const createQualificationRequestSchema = z.strictObject({
  housePartId: z.number().int().positive(),
  vendorPartId: z.number().int().positive(),
  summary: text(4000).optional(),
});
export type CreateQualificationRequest = z.input<typeof createQualificationRequestSchema>;

/** `PATCH /api/qualifications/:id` (engineers, draft only). */
export const updateQualificationRequestSchema = z
  .strictObject({
    version: z.number().int().min(0),
    summary: text(4000).optional(),
    reviewerId: z.number().int().positive().nullable().optional(),
  })
  .refine((v) => v.summary !== undefined || v.reviewerId !== undefined, { message: 'Nothing to change' });
export type UpdateQualificationRequest = z.input<typeof updateQualificationRequestSchema>;

export const qualificationEvaluateRequestSchema = z.strictObject({ version: versionField });
/** Send for review; name a reviewer (another engineer) or leave it to every other engineer. */
export const qualificationSubmitRequestSchema = z.strictObject({
  version: versionField,
  reviewerId: z.number().int().positive().nullish(),
  note: text(2000).nullish(),
});
export const qualificationSendBackRequestSchema = z.strictObject({ version: versionField, reason: required('reason for sending it back') });
/** A second engineer makes the source the house part's approved source (the reference part). */
export const qualificationApproveRequestSchema = z.strictObject({ version: versionField, note: text(2000).nullish() });
export const qualificationClearRequestSchema = z.strictObject({ version: versionField, note: text(2000).nullish() });
export const qualificationClearWithConditionsRequestSchema = z.strictObject({ version: versionField, conditions: required('conditions') });
/** Clears the source while its failing or marginal checks are covered by approved, unexpired waivers. */
export const qualificationClearWithWaiverRequestSchema = z.strictObject({ version: versionField, note: text(2000).nullish() });
export const qualificationRejectRequestSchema = z.strictObject({ version: versionField, reason: required('reason for the rejection') });
export const qualificationWithdrawRequestSchema = z.strictObject({ version: versionField, reason: text(2000).nullish() });
export const qualificationRevokeRequestSchema = z.strictObject({ version: versionField, reason: required('reason for revoking the clearance') });
export const qualificationRecheckRequestSchema = z.strictObject({ note: text(2000).nullish() });
export const qualificationCommentRequestSchema = z.strictObject({ text: required('comment', 4000) });

export type QualificationEvaluateRequest = z.input<typeof qualificationEvaluateRequestSchema>;
export type QualificationSubmitRequest = z.input<typeof qualificationSubmitRequestSchema>;
export type QualificationSendBackRequest = z.input<typeof qualificationSendBackRequestSchema>;
export type QualificationApproveRequest = z.input<typeof qualificationApproveRequestSchema>;
export type QualificationClearRequest = z.input<typeof qualificationClearRequestSchema>;
export type QualificationClearWithConditionsRequest = z.input<typeof qualificationClearWithConditionsRequestSchema>;
export type QualificationClearWithWaiverRequest = z.input<typeof qualificationClearWithWaiverRequestSchema>;
export type QualificationRejectRequest = z.input<typeof qualificationRejectRequestSchema>;
export type QualificationWithdrawRequest = z.input<typeof qualificationWithdrawRequestSchema>;
export type QualificationRevokeRequest = z.input<typeof qualificationRevokeRequestSchema>;
export type QualificationRecheckRequest = z.input<typeof qualificationRecheckRequestSchema>;
export type QualificationCommentRequest = z.input<typeof qualificationCommentRequestSchema>;

/** The body each action takes, for forms that build the request from the action's name. */
export const QUALIFICATION_ACTION_REQUEST_SCHEMAS: Record<QualificationAction, z.ZodType> = {
  evaluate: qualificationEvaluateRequestSchema,
  submit: qualificationSubmitRequestSchema,
  'send-back': qualificationSendBackRequestSchema,
  approve: qualificationApproveRequestSchema,
  clear: qualificationClearRequestSchema,
  'clear-with-conditions': qualificationClearWithConditionsRequestSchema,
  'clear-with-waiver': qualificationClearWithWaiverRequestSchema,
  reject: qualificationRejectRequestSchema,
  withdraw: qualificationWithdrawRequestSchema,
  revoke: qualificationRevokeRequestSchema,
  recheck: qualificationRecheckRequestSchema,
};
