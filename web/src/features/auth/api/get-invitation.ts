import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationSchema } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** What the public invitation route tells the invitee: a subset of the admin's Invitation. */
export const invitationPreviewSchema = invitationSchema.pick({ email: true, name: true, role: true, expiresAt: true });
export type InvitationPreview = ReturnType<typeof invitationPreviewSchema.parse>;

export function getInvitation(token: string, signal?: AbortSignal): Promise<InvitationPreview> {
  return apiRequest(`/auth/invitations/${encodeURIComponent(token)}`, {
    schema: invitationPreviewSchema,
    auth: false,
    signal,
  });
}

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invitation(token),
    queryFn: ({ signal }) => getInvitation(token, signal),
    staleTime: Infinity,
  });

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
