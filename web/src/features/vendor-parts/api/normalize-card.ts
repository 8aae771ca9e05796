import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { normalizeResponseSchema, type NormalizeRequest, type NormalizeResponse } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

export function normalizeCard(request: NormalizeRequest, signal?: AbortSignal): Promise<NormalizeResponse> {
  return apiRequest('/engineering/normalize', { method: 'POST', body: request, schema: normalizeResponseSchema, signal });
}

/**
 * The engineering core's reading of the card being edited. A pure computation, so it is
 * a query keyed by its whole request: typing back to an earlier value reads the cache.
 */
export function useNormalizedCard(request: NormalizeRequest | null) {
  return useQuery({
    queryKey: vendorPartKeys.normalize(request),
    queryFn: ({ signal }) => normalizeCard(request!, signal),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
}
