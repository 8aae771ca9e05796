import { useMutation, useQueryClient } from '@tanstack/react-query';
import { vendorPartSchema, type UpdateVendorPartRequest, type VendorPart } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

export interface UpdateVendorPartVariables {
  id: number;
  changes: UpdateVendorPartRequest;
}

export function updateVendorPart({ id, changes }: UpdateVendorPartVariables): Promise<VendorPart> {
  return apiRequest(`/vendor-parts/${id}`, { method: 'PATCH', body: changes, schema: vendorPartSchema });
}

export function useUpdateVendorPart() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateVendorPart,
    onSuccess: (part) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.detail(part.id) }),
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.manufacturers() }),
      ]),
  });
}
