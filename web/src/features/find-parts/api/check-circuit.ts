import { useQueries } from '@tanstack/react-query';
import { regulatorResponseSchema, type RegulatorRequest, type RegulatorResponse } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { findPartsKeys } from './find-parts-keys';

export function checkCircuit(request: RegulatorRequest, signal?: AbortSignal): Promise<RegulatorResponse> {
  return apiRequest('/engineering/regulator', { method: 'POST', body: request, schema: regulatorResponseSchema, signal });
}

/**
 * The regulator designed around each chosen part. A pure computation, so each is a query
 * keyed by its whole request: the same circuit and card read the cache.
 */
export function useCircuitChecks(requests: readonly RegulatorRequest[]) {
  return useQueries({
    queries: requests.map((request) => ({
      queryKey: findPartsKeys.circuit(request),
      queryFn: ({ signal }: { signal: AbortSignal }) => checkCircuit(request, signal),
      staleTime: Infinity,
    })),
  });
}
