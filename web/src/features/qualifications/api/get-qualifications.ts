import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { qualificationPageSchema, type QualificationPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationKeys, type QualificationListParams } from './qualification-keys';

export function getQualifications(params: QualificationListParams, signal?: AbortSignal): Promise<QualificationPage> {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined && value !== '') search.set(key, String(value));
  return apiRequest(`/qualifications?${search}`, { schema: qualificationPageSchema, signal });
}

export function useQualifications(params: QualificationListParams) {
  return useQuery({
    queryKey: qualificationKeys.list(params),
    queryFn: ({ signal }) => getQualifications(params, signal),
    placeholderData: keepPreviousData,
  });
}
