import { z } from 'zod';
import { emailSchema, roleSchema } from './auth.schema';

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  createdAt: z.string(),
  lastLoginAt: z.string().nullable(),
});
export type User = z.infer<typeof userSchema>;

export const createInvitationRequestSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1).max(120),
  role: roleSchema,
});
export type CreateInvitationRequest = z.infer<typeof createInvitationRequestSchema>;

export const invitationSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
  /** Taken back by an admin; the link no longer works. */
  revokedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const updateUserRequestSchema = z
  .object({
    role: z.optional(roleSchema),
    active: z.boolean().optional(),
    name: z.string().trim().min(1).max(120).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

export const capturedMailSchema = z.object({
  id: z.number().int(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  receivedAt: z.string(),
});
export type CapturedMail = z.infer<typeof capturedMailSchema>;

export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded', 'down']),
  services: z.object({
    database: z.enum(['up', 'down']),
    objectStore: z.enum(['up', 'down']),
    mail: z.enum(['up', 'down']),
  }),
});
export type Health = z.infer<typeof healthSchema>;
