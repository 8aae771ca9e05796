import { z } from 'zod';
import { housePartStatusSchema } from '../parts/house-part.schema';
import { actorSchema, queryBooleanSchema } from '../parts/page.schema';
import { sourceRoleSchema } from '../parts/source.schema';
import { qualificationStateSchema } from './qualification-state.schema';
import { vendorPartRefSchema } from './qualification.schema';
import { SOURCE_STANDINGS } from './source-standing';
import { waiverBriefSchema } from './waiver.schema';

/**
 * Where a source stands for procurement: the state of its latest decided case (approved,
 * cleared, cleared with conditions, rejected, revoked); else the state of its latest case;
 * else `not-qualified` (no case yet). The rule is `sourceStanding` in ./source-standing.ts.
 */
export const sourceStandingSchema = z.enum(SOURCE_STANDINGS);
export type SourceStanding = z.infer<typeof sourceStandingSchema>;

export const SOURCE_STANDING_LABELS: Record<SourceStanding, string> = {
  approved: 'Approved source',
  cleared: 'Cleared',
  'cleared-with-conditions': 'Cleared with conditions',
  'cleared-with-waiver': 'Cleared with waiver',
  rejected: 'Rejected',
  revoked: 'Revoked',
  'waiver-lapsed': 'Waiver lapsed',
  'in-review': 'In review',
  draft: 'Draft',
  withdrawn: 'Withdrawn',
  'not-qualified': 'Not qualified',
};

export const sourceStandingRowSchema = z.object({
  vendorPart: vendorPartRefSchema,
  role: sourceRoleSchema,
  standing: sourceStandingSchema,
  /** The case the standing comes from. */
  caseId: z.number().int().nullable(),
  revision: z.number().int().nullable(),
  /** Conditions of a clearance with conditions, the reason of a rejection or revocation. */
  conditions: z.string().nullable(),
  /** When the standing began (the decision or the revocation) and who made it. */
  since: z.string().nullable(),
  decidedBy: actorSchema.nullable(),
  /** A newer case still open for this source (a re-check under way). */
  openCase: z.object({ id: z.number().int(), state: qualificationStateSchema }).nullable(),
  needsRecheck: z.boolean(),
  /** The approved waivers the standing's case was cleared on (a clearance with waiver), with their expiry. */
  waivers: z.array(waiverBriefSchema),
});
export type SourceStandingRow = z.infer<typeof sourceStandingRowSchema>;

export const sourcesViewItemSchema = z.object({
  housePart: z.object({ id: z.number().int(), partNumber: z.string(), description: z.string(), status: housePartStatusSchema }),
  sources: z.array(sourceStandingRowSchema),
});
export type SourcesViewItem = z.infer<typeof sourcesViewItemSchema>;

/** `GET /api/qualification-views/sources`: buyers, engineers and admins see every source; designers the approved ones and cleared alternates. */
export const sourcesViewSchema = z.object({ items: z.array(sourcesViewItemSchema) });
export type SourcesView = z.infer<typeof sourcesViewSchema>;

export const sourcesQuerySchema = z.object({
  housePartId: z.coerce.number().int().positive().optional(),
  /** Part-number prefix or words of the description. */
  q: z.string().trim().max(100).optional(),
  /** Only house parts this buyer is linked to (buyers' default view). */
  mine: queryBooleanSchema.optional(),
});
export type SourcesQuery = z.infer<typeof sourcesQuerySchema>;

/** Columns of `GET /api/qualification-views/sources.csv`, in order, in words (dates ISO 8601, UTC). */
export const SOURCES_CSV_COLUMNS = [
  'House part',
  'Description',
  'House part status',
  'Manufacturer',
  'Manufacturer part number',
  'Package',
  'Role',
  'Standing',
  'Conditions',
  'Since',
  'Decided by',
  'Case',
  'Revision',
  'Open case',
  'Needs re-check',
] as const;
