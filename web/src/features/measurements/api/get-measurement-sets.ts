import { useQuery } from '@tanstack/react-query';
import { measurementSetSchema, type MeasurementSet } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { measurementKeys } from './measurement-keys';

const listSchema = measurementSetSchema.array();

/** A vendor part's measurement sets, each analysed against its card (and a house part's spec when named). */
export function getMeasurementSets(vendorPartId: number, housePartId: number | null, signal?: AbortSignal): Promise<MeasurementSet[]> {
  const search = housePartId ? `?housePartId=${housePartId}` : '';
  return apiRequest(`/vendor-parts/${vendorPartId}/measurement-sets${search}`, { schema: listSchema, signal });
}

export function useMeasurementSets(vendorPartId: number, housePartId: number | null = null) {
  return useQuery({
    queryKey: measurementKeys.forVendorPart(vendorPartId, housePartId),
    queryFn: ({ signal }) => getMeasurementSets(vendorPartId, housePartId, signal),
    enabled: vendorPartId > 0,
  });
}
