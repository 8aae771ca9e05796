import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { qualificationRequestPageSchema, type QualificationRequestPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationRequestKeys, type QualificationRequestListParams } from './qualification-request-keys';

export function getQualificationRequests(params: QualificationRequestListParams, signal?: AbortSignal): Promise<QualificationRequestPage> {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined) search.set(key, String(value));
  return apiRequest(`/qualification-requests?${search}`, { schema: qualificationRequestPageSchema, signal });
}

export function useQualificationRequests(params: QualificationRequestListParams) {
  return useQuery({
    queryKey: qualificationRequestKeys.list(params),
    queryFn: ({ signal }) => getQualificationRequests(params, signal),
    placeholderData: keepPreviousData,
  });
}

/** The caller's own requests, every state: the Find parts panel and the ask buttons share this one query. */
export const MY_REQUESTS: QualificationRequestListParams = { status: 'all', mine: true, pageIndex: 0, pageSize: 200 };

export function useMyQualificationRequests() {
  return useQualificationRequests(MY_REQUESTS);
}
