// The sign-in path's schemas use zod/mini: the same checks as zod's classic API, but only
// what is used ends up in the browser bundle, which keeps the sign-in page small. Mini
// and classic schemas compose freely (both are zod 4 core schemas).
import { z } from 'zod/mini';

export const ROLES = ['admin', 'engineer', 'designer', 'buyer'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const emailSchema = z
  .string()
  .check(
    z.trim(),
    z.minLength(3, 'Enter a valid e-mail address'),
    z.maxLength(254, 'Use at most 254 characters'),
    z.email('Enter a valid e-mail address'),
    z.toLowerCase(),
  );

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: z.string().check(z.minLength(1, 'Enter your password'), z.maxLength(200, 'Use at most 200 characters')),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const userSummarySchema = z.object({
  id: z.number().check(z.int()),
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

export const passwordSchema = z.string().check(z.minLength(10, 'Use at least 10 characters'), z.maxLength(200, 'Use at most 200 characters'));

export const acceptInvitationRequestSchema = z.object({
  token: z.string().check(z.minLength(20), z.maxLength(200)),
  name: z.string().check(z.trim(), z.minLength(1), z.maxLength(120)),
  password: passwordSchema,
});
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;
