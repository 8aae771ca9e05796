import { useActionState } from 'react';
import { loginResponseSchema, type LoginRequest, type LoginResponse } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { setSession } from '@/lib/session';

export function login(body: LoginRequest): Promise<LoginResponse> {
  return apiRequest('/auth/login', { method: 'POST', body, schema: loginResponseSchema, auth: false });
}

/**
 * Signs in and stores the session. React's own action state rather than a TanStack
 * mutation: the sign-in page runs without the query client to stay small.
 * Returns [last error or null, signIn(body) — call inside startTransition, pending].
 */
export function useSignIn(onSignedIn: (session: LoginResponse) => void) {
  return useActionState<unknown, LoginRequest>(async (_previous, body) => {
    try {
      const session = await login(body);
      setSession(session);
      onSignedIn(session);
      return null;
    } catch (error) {
      return error;
    }
  }, null);
}
