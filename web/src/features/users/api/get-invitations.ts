import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationSchema, type Invitation } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './user-keys';

const invitationsSchema = invitationSchema.array();

export function getInvitations(signal?: AbortSignal): Promise<Invitation[]> {
  return apiRequest('/users/invitations', { schema: invitationsSchema, signal });
}

export const invitationsQueryOptions = () => queryOptions({ queryKey: userKeys.invitations(), queryFn: ({ signal }) => getInvitations(signal) });

export function useInvitations() {
  return useQuery(invitationsQueryOptions());
}
