/**
 * Decision records (all under /api):
 *   GET qualifications/:id/record        engineer, admin, buyer, designer (usable cases)   the PDF, byte for byte as stored
 *   GET qualifications/:id/record/meta   same                                               DecisionRecordMeta
 */
import { z } from 'zod';

/**
 * The PDF written once when a case is decided. `pending`: the decision committed but the
 * object store has not taken the PDF yet (the next read makes it from the frozen inputs).
 */
export const decisionRecordMetaSchema = z.object({
  qualificationId: z.number().int(),
  state: z.enum(['pending', 'stored']),
  /** sha256 of the PDF bytes; null while pending. */
  sha256: z.string().nullable(),
  /** sha256 of the canonical JSON of the case snapshot the PDF was drawn from. */
  inputsSha256: z.string(),
  size: z.number().int().nullable(),
  createdAt: z.string(),
  storedAt: z.string().nullable(),
  /** Where to download it. */
  path: z.string(),
});
export type DecisionRecordMeta = z.infer<typeof decisionRecordMetaSchema>;

/** The download path of a case's record (web buttons, the buyers' mail). */
export function decisionRecordPath(qualificationId: number): string {
  return `/api/qualifications/${qualificationId}/record`;
}
