import { useQuery } from '@tanstack/react-query';
import { specVersionSchema, type SpecVersion } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

/** The current spec of a house part the vendor part is a source of; null when it has none yet. */
export function getSpecBasis(housePartId: number, signal?: AbortSignal): Promise<SpecVersion | null> {
  // The API answers null while the house part has no spec yet.
  return apiRequest(`/house-parts/${housePartId}/spec`, { schema: specVersionSchema.nullable(), signal });
}

export function useSpecBasis(housePartId: number | null) {
  return useQuery({
    queryKey: vendorPartKeys.spec(housePartId ?? 0),
    queryFn: ({ signal }) => getSpecBasis(housePartId!, signal),
    enabled: housePartId !== null,
  });
}
