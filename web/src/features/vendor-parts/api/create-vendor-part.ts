import { useMutation, useQueryClient } from '@tanstack/react-query';
import { vendorPartSchema, type CreateVendorPartRequest, type VendorPart } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

export function createVendorPart(body: CreateVendorPartRequest): Promise<VendorPart> {
  return apiRequest('/vendor-parts', { method: 'POST', body, schema: vendorPartSchema });
}

export function useCreateVendorPart() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createVendorPart,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.manufacturers() }),
      ]),
  });
}
