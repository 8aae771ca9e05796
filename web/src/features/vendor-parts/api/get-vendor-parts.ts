import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { vendorPartPageSchema, type VendorPartPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys, type VendorPartListParams } from './vendor-part-keys';

export function vendorPartListSearch(params: VendorPartListParams): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === '' || (typeof value === 'number' && Number.isNaN(value))) continue;
    search.set(key, String(value));
  }
  return search.toString();
}

export function getVendorParts(params: VendorPartListParams, signal?: AbortSignal): Promise<VendorPartPage> {
  return apiRequest(`/vendor-parts?${vendorPartListSearch(params)}`, { schema: vendorPartPageSchema, signal });
}

export const vendorPartsQueryOptions = (params: VendorPartListParams) =>
  queryOptions({
    queryKey: vendorPartKeys.list(params),
    queryFn: ({ signal }) => getVendorParts(params, signal),
    // The table keeps the last page on screen while the next one loads.
    placeholderData: keepPreviousData,
  });

export function useVendorParts(params: VendorPartListParams) {
  return useQuery(vendorPartsQueryOptions(params));
}
