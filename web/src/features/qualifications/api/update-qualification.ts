import { useMutation } from '@tanstack/react-query';
import { qualificationSchema, type Qualification, type UpdateQualificationRequest } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { useCaseChanged } from './use-case-changed';

/** The preparer's notes on a draft; `version` refuses an edit on a case that changed meanwhile (409). */
export function updateQualification({ id, request }: { id: number; request: UpdateQualificationRequest }): Promise<Qualification> {
  return apiRequest(`/qualifications/${id}`, { method: 'PATCH', body: request, schema: qualificationSchema });
}

export function useUpdateQualification() {
  const changed = useCaseChanged();
  return useMutation({ mutationFn: updateQualification, onSuccess: (result) => changed(result) });
}
