import { useMutation, useQueryClient } from '@tanstack/react-query';
import { housePartBuyerSchema } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { sourcesKeys } from './sources-keys';

/** A buyer follows a house part (is mailed when a source of it is cleared or revoked) or stops following it. */
export function setFollowing({ housePartId, userId, follow }: { housePartId: number; userId: number; follow: boolean }): Promise<unknown> {
  return follow
    ? apiRequest(`/house-parts/${housePartId}/buyers`, { method: 'POST', body: { userId }, schema: housePartBuyerSchema })
    : apiRequest(`/house-parts/${housePartId}/buyers/${userId}`, { method: 'DELETE' });
}

export function useSetFollowing() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setFollowing,
    onSettled: () => queryClient.invalidateQueries({ queryKey: sourcesKeys.all }),
  });
}
