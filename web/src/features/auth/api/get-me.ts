import { queryOptions, useQuery } from '@tanstack/react-query';
import { userSummarySchema, type UserSummary } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { authKeys } from './auth-keys';

export function getMe(signal?: AbortSignal): Promise<UserSummary> {
  return apiRequest('/auth/me', { schema: userSummarySchema, signal });
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 60_000 });

export function useMe(enabled = true) {
  return useQuery({ ...meQueryOptions(), enabled });
}
