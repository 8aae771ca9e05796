import { useQuery } from '@tanstack/react-query';
import { specVersionSchema, type SpecVersion } from '@shuntwise/contracts';
import { apiRequest, ApiError } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

/** The current spec of a house part the vendor part is a source of; null when it has none yet. */
export async function getSpecBasis(housePartId: number, signal?: AbortSignal): Promise<SpecVersion | null> {
  try {
    return await apiRequest(`/house-parts/${housePartId}/spec`, { schema: specVersionSchema, signal });
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}

export function useSpecBasis(housePartId: number | null) {
  return useQuery({
    queryKey: vendorPartKeys.spec(housePartId ?? 0),
    queryFn: ({ signal }) => getSpecBasis(housePartId!, signal),
    enabled: housePartId !== null,
  });
}
