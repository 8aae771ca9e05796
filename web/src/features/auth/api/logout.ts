import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clearSession } from '@/lib/session';

export function logout(): Promise<void> {
  return apiRequest('/auth/logout', { method: 'POST' });
}

/** Ends the session on the server (its tokens stop working), then forgets it here. */
export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    // Signed out here even when the server cannot be reached: the token is forgotten.
    onSettled: () => {
      clearSession('signed-out');
      queryClient.clear();
    },
  });
}
