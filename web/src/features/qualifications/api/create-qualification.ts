import { useMutation } from '@tanstack/react-query';
import { qualificationSchema, type CreateQualificationRequest, type Qualification } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { useCaseChanged } from './use-case-changed';

/** Opens a case for a house part and a vendor part; the server evaluates it against the current spec and card. */
export function createQualification(request: CreateQualificationRequest): Promise<Qualification> {
  return apiRequest('/qualifications', { method: 'POST', body: request, schema: qualificationSchema });
}

export function useCreateQualification() {
  const changed = useCaseChanged();
  return useMutation({ mutationFn: createQualification, onSuccess: (created) => changed(created) });
}
