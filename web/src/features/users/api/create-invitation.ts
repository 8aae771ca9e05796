import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, type CreateInvitationRequest, type Invitation } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './user-keys';

export function createInvitation(body: CreateInvitationRequest): Promise<Invitation> {
  return apiRequest('/users/invitations', { method: 'POST', body, schema: invitationSchema });
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.invitations() }),
  });
}
