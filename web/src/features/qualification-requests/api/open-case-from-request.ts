import { useMutation, useQueryClient } from '@tanstack/react-query';
import { qualificationRequestSchema, type OpenCaseFromRequest, type QualificationRequest } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';
import { qualificationRequestKeys } from './qualification-request-keys';

export interface OpenCaseInput {
  id: number;
  body: OpenCaseFromRequest;
}

/** Opens a qualification case from a request; the answer is the request, taken up, pointing at the case. */
export function openCaseFromRequest({ id, body }: OpenCaseInput): Promise<QualificationRequest> {
  return apiRequest(`/qualification-requests/${id}/open-case`, { method: 'POST', body, schema: qualificationRequestSchema });
}

export function useOpenCaseFromRequest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: openCaseFromRequest,
    // A new case: the lists and read models that show cases are stale too.
    onSuccess: () => invalidateKeys(queryClient, [qualificationRequestKeys.all, ...staleAfter.caseOpened()]),
  });
}
