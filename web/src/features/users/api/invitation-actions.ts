import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, type Invitation } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './user-keys';

/** Sends the invitation again with a new link (the old link stops working). */
export function resendInvitation(id: number): Promise<Invitation> {
  return apiRequest(`/users/invitations/${id}/resend`, { method: 'POST', schema: invitationSchema });
}

/** Takes the invitation back: its link stops working. */
export function revokeInvitation(id: number): Promise<Invitation> {
  return apiRequest(`/users/invitations/${id}/revoke`, { method: 'POST', schema: invitationSchema });
}

export function useInvitationAction(action: 'resend' | 'revoke') {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: action === 'resend' ? resendInvitation : revokeInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.invitations() }),
  });
}
