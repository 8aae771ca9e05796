import { queryOptions, useQuery } from '@tanstack/react-query';
import { extractionResultSchema, type ExtractionResult } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { datasheetKeys } from './datasheet-keys';

export function getExtraction(datasheetId: number, signal?: AbortSignal): Promise<ExtractionResult> {
  return apiRequest(`/datasheets/${datasheetId}/extraction`, { schema: extractionResultSchema, signal });
}

/** A datasheet's extraction never changes once stored: read it once. */
export const extractionQueryOptions = (datasheetId: number) =>
  queryOptions({ queryKey: datasheetKeys.extraction(datasheetId), queryFn: ({ signal }) => getExtraction(datasheetId, signal), staleTime: Infinity });

export function useExtraction(datasheetId: number | null) {
  return useQuery({ ...extractionQueryOptions(datasheetId ?? 0), enabled: datasheetId !== null });
}
