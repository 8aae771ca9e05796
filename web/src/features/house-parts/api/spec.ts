import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { specVersionSchema, specVersionSummarySchema, type PutSpecRequest, type SpecVersion, type SpecVersionSummary } from '@shuntwise/contracts';
import { apiRequest, ApiError } from '@/lib/api-client';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';
import { housePartKeys } from './house-part-keys';

const currentSpecSchema = specVersionSchema.nullable();

/** The current spec (the API answers null while the house part has none yet: a state, not an error), or `version`. */
export function getSpec(housePartId: number, version?: number, signal?: AbortSignal): Promise<SpecVersion | null> {
  if (version !== undefined) return apiRequest(`/house-parts/${housePartId}/spec?version=${version}`, { schema: specVersionSchema, signal });
  return apiRequest(`/house-parts/${housePartId}/spec`, { schema: currentSpecSchema, signal });
}

export function useSpec(housePartId: number) {
  return useQuery({ queryKey: housePartKeys.spec(housePartId), queryFn: ({ signal }) => getSpec(housePartId, undefined, signal) });
}

/** An earlier version, read-only; versions never change, so it is read once. */
export function useSpecVersion(housePartId: number, version: number | null) {
  return useQuery({
    queryKey: housePartKeys.specVersion(housePartId, version ?? 0),
    queryFn: ({ signal }) => getSpec(housePartId, version!, signal),
    enabled: version !== null,
    staleTime: Infinity,
  });
}

const summariesSchema = specVersionSummarySchema.array();

export function getSpecVersions(housePartId: number, signal?: AbortSignal): Promise<SpecVersionSummary[]> {
  return apiRequest(`/house-parts/${housePartId}/spec/versions`, { schema: summariesSchema, signal });
}

export function useSpecVersions(housePartId: number) {
  return useQuery({ queryKey: housePartKeys.specVersions(housePartId), queryFn: ({ signal }) => getSpecVersions(housePartId, signal) });
}

export function putSpec({ housePartId, request }: { housePartId: number; request: PutSpecRequest }): Promise<SpecVersion> {
  return apiRequest(`/house-parts/${housePartId}/spec`, { method: 'PUT', body: request, schema: specVersionSchema });
}

export function usePutSpec() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: putSpec,
    onSuccess: (saved) => {
      queryClient.setQueryData(housePartKeys.spec(saved.housePartId), saved);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: housePartKeys.specVersions(saved.housePartId) }),
        queryClient.invalidateQueries({ queryKey: housePartKeys.detail(saved.housePartId), exact: true }),
        queryClient.invalidateQueries({ queryKey: housePartKeys.lists() }),
        // The vendor parts' spec basis, Compare, the Board and the flagged cases.
        invalidateKeys(queryClient, staleAfter.specSaved(saved.housePartId)),
      ]);
    },
    // A stale base: read the version that is there now, so the editor can offer it.
    onError: (error, { housePartId }) => {
      if (error instanceof ApiError && error.status === 409) {
        void queryClient.invalidateQueries({ queryKey: housePartKeys.spec(housePartId) });
        void queryClient.invalidateQueries({ queryKey: housePartKeys.specVersions(housePartId) });
      }
    },
  });
}
