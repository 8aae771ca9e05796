import { useMutation } from '@tanstack/react-query';
import { loginResponseSchema, type AcceptInvitationRequest, type LoginResponse } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { setSession } from '@/lib/session';

export function acceptInvitation(body: AcceptInvitationRequest): Promise<LoginResponse> {
  return apiRequest('/auth/invitations/accept', {
    method: 'POST',
    body,
    schema: loginResponseSchema,
    auth: false,
  });
}

/** Accepting signs the new user in straight away (the API answers as login does). */
export function useAcceptInvitation() {
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (session) => setSession(session),
  });
}
