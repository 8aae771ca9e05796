import { z } from 'zod';

export const ROLES = ['admin', 'engineer', 'designer', 'buyer'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const emailSchema = z
  .string()
  .trim()
  .min(3)
  .max(254)
  .email('Enter a valid e-mail address')
  .transform((s) => s.toLowerCase());

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const userSummarySchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type UserSummary = z.infer<typeof userSummarySchema>;

export const loginResponseSchema = z.object({
  accessToken: z.string(),
  user: userSummarySchema,
});
export type LoginResponse = z.infer<typeof loginResponseSchema>;

export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

export const acceptInvitationRequestSchema = z.object({
  token: z.string().min(20).max(200),
  name: z.string().trim().min(1).max(120),
  password: passwordSchema,
});
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;
