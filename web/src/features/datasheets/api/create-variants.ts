import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createVariantsResponseSchema, type CreateVariantsRequest, type CreateVariantsResponse } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';
import { datasheetKeys } from './datasheet-keys';

export interface CreateVariantsVariables {
  datasheetId: number;
  request: CreateVariantsRequest;
}

export function createVariants({ datasheetId, request }: CreateVariantsVariables): Promise<CreateVariantsResponse> {
  return apiRequest(`/datasheets/${datasheetId}/variants`, { method: 'POST', body: request, schema: createVariantsResponseSchema });
}

export function useCreateVariants() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createVariants,
    // New vendor parts and cards: every list that shows them is stale.
    onSuccess: (_result, { datasheetId }) =>
      Promise.all([queryClient.invalidateQueries({ queryKey: datasheetKeys.detail(datasheetId) }), invalidateKeys(queryClient, staleAfter.vendorPartsAdded())]),
  });
}
