import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { sourceSchema, vendorPartPageSchema, type AddSourceRequest, type Source, type UpdateSourceRequest, type VendorPartPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';
import { housePartKeys } from './house-part-keys';

const sourcesSchema = sourceSchema.array();

export function getSources(housePartId: number, signal?: AbortSignal): Promise<Source[]> {
  return apiRequest(`/house-parts/${housePartId}/sources`, { schema: sourcesSchema, signal });
}

export function useSources(housePartId: number) {
  return useQuery({ queryKey: housePartKeys.sources(housePartId), queryFn: ({ signal }) => getSources(housePartId, signal) });
}

function useInvalidateSources() {
  const queryClient = useQueryClient();
  return (housePartId: number) =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: housePartKeys.sources(housePartId) }),
      queryClient.invalidateQueries({ queryKey: housePartKeys.detail(housePartId), exact: true }),
      queryClient.invalidateQueries({ queryKey: housePartKeys.lists() }),
      invalidateKeys(queryClient, staleAfter.sourcesChanged()),
    ]);
}

export function useAddSource() {
  const invalidate = useInvalidateSources();
  return useMutation({
    mutationFn: ({ housePartId, request }: { housePartId: number; request: AddSourceRequest }) =>
      apiRequest(`/house-parts/${housePartId}/sources`, { method: 'POST', body: request, schema: sourceSchema }),
    onSuccess: (source) => invalidate(source.housePartId),
  });
}

export function useUpdateSource() {
  const invalidate = useInvalidateSources();
  return useMutation({
    mutationFn: ({ housePartId, vendorPartId, changes }: { housePartId: number; vendorPartId: number; changes: UpdateSourceRequest }) =>
      apiRequest(`/house-parts/${housePartId}/sources/${vendorPartId}`, { method: 'PATCH', body: changes, schema: sourceSchema }),
    onSuccess: (source) => invalidate(source.housePartId),
  });
}

export function useRemoveSource() {
  const invalidate = useInvalidateSources();
  return useMutation({
    mutationFn: ({ housePartId, vendorPartId }: { housePartId: number; vendorPartId: number }) =>
      apiRequest(`/house-parts/${housePartId}/sources/${vendorPartId}`, { method: 'DELETE' }),
    onSuccess: (_void, { housePartId }) => invalidate(housePartId),
  });
}

/** Vendor parts whose part number or manufacturer starts with the text, for linking a source. */
export function searchVendorParts(text: string, signal?: AbortSignal): Promise<VendorPartPage> {
  return apiRequest(`/vendor-parts?q=${encodeURIComponent(text)}&pageSize=20&sort=mpn`, { schema: vendorPartPageSchema, signal });
}

export function useVendorPartSearch(text: string) {
  return useQuery({
    queryKey: housePartKeys.vendorPartSearch(text),
    queryFn: ({ signal }) => searchVendorParts(text, signal),
    enabled: text.length >= 1,
    staleTime: 60_000,
  });
}
