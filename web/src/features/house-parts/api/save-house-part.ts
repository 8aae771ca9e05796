import { useMutation, useQueryClient } from '@tanstack/react-query';
import { housePartSchema, type CreateHousePartRequest, type HousePart, type UpdateHousePartRequest } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { housePartKeys } from './house-part-keys';

export function createHousePart(body: CreateHousePartRequest): Promise<HousePart> {
  return apiRequest('/house-parts', { method: 'POST', body, schema: housePartSchema });
}

export function updateHousePart({ id, changes }: { id: number; changes: UpdateHousePartRequest }): Promise<HousePart> {
  return apiRequest(`/house-parts/${id}`, { method: 'PATCH', body: changes, schema: housePartSchema });
}

export function useCreateHousePart() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createHousePart, onSuccess: () => queryClient.invalidateQueries({ queryKey: housePartKeys.lists() }) });
}

export function useUpdateHousePart() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateHousePart,
    onSuccess: (part) => {
      queryClient.setQueryData(housePartKeys.detail(part.id), part);
      return queryClient.invalidateQueries({ queryKey: housePartKeys.lists() });
    },
  });
}
