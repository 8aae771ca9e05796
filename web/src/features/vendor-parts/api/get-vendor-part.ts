import { queryOptions, useQuery } from '@tanstack/react-query';
import { vendorPartDetailSchema, type VendorPartDetail } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

export function getVendorPart(id: number, signal?: AbortSignal): Promise<VendorPartDetail> {
  return apiRequest(`/vendor-parts/${id}`, { schema: vendorPartDetailSchema, signal });
}

export const vendorPartQueryOptions = (id: number) => queryOptions({ queryKey: vendorPartKeys.detail(id), queryFn: ({ signal }) => getVendorPart(id, signal) });

export function useVendorPart(id: number) {
  return useQuery(vendorPartQueryOptions(id));
}
