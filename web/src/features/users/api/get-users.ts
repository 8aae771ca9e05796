import { queryOptions, useQuery } from '@tanstack/react-query';
import { userSchema, type User } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './user-keys';

const usersSchema = userSchema.array();

export function getUsers(signal?: AbortSignal): Promise<User[]> {
  return apiRequest('/users', { schema: usersSchema, signal });
}

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.lists(), queryFn: ({ signal }) => getUsers(signal) });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
