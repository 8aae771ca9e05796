import { useMutation, useQueryClient } from '@tanstack/react-query';
import { qualificationRequestSchema, type CreateQualificationRequestRequest, type QualificationRequest } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationRequestKeys } from './qualification-request-keys';

/** Asks for a vendor part to be qualified; the engineers are mailed. */
export function createQualificationRequest(request: CreateQualificationRequestRequest): Promise<QualificationRequest> {
  return apiRequest('/qualification-requests', { method: 'POST', body: request, schema: qualificationRequestSchema });
}

export function useCreateQualificationRequest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createQualificationRequest,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: qualificationRequestKeys.lists() }),
  });
}
