import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userSchema, type UpdateUserRequest, type User } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './user-keys';

export interface UpdateUserVariables {
  id: number;
  changes: UpdateUserRequest;
}

export function updateUser({ id, changes }: UpdateUserVariables): Promise<User> {
  return apiRequest(`/users/${id}`, { method: 'PATCH', body: changes, schema: userSchema });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: (user) => {
      // Show the server's answer at once, then re-read the list in the background.
      queryClient.setQueryData<User[]>(userKeys.lists(), (users) => users?.map((u) => (u.id === user.id ? user : u)));
      return queryClient.invalidateQueries({ queryKey: userKeys.lists() });
    },
  });
}
