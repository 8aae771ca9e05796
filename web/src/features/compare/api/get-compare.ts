import { useQuery } from '@tanstack/react-query';
import { comparePayloadSchema, type ComparePayload } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { compareKeys } from './compare-keys';

/** The approved source and the alternates of a house part, each evaluated now, with their curves. */
export function getCompare(housePartId: number, signal?: AbortSignal): Promise<ComparePayload> {
  return apiRequest(`/qualification-views/compare/${housePartId}`, { schema: comparePayloadSchema, signal });
}

export function useCompare(housePartId: number) {
  return useQuery({ queryKey: compareKeys.housePart(housePartId), queryFn: ({ signal }) => getCompare(housePartId, signal), enabled: housePartId > 0 });
}
