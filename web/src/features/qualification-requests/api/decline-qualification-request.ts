import { useMutation, useQueryClient } from '@tanstack/react-query';
import { qualificationRequestSchema, type DeclineQualificationRequest, type QualificationRequest } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationRequestKeys } from './qualification-request-keys';

export interface DeclineInput {
  id: number;
  body: DeclineQualificationRequest;
}

/** Declines a request with a reply; the requester is mailed it. */
export function declineQualificationRequest({ id, body }: DeclineInput): Promise<QualificationRequest> {
  return apiRequest(`/qualification-requests/${id}/decline`, { method: 'POST', body, schema: qualificationRequestSchema });
}

export function useDeclineQualificationRequest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: declineQualificationRequest,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: qualificationRequestKeys.lists() }),
  });
}
