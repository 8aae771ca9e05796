import { useMutation } from '@tanstack/react-query';
import { qualificationSchema, type Qualification } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { useCaseChanged } from './use-case-changed';

export function commentOnQualification({ id, text }: { id: number; text: string }): Promise<Qualification> {
  return apiRequest(`/qualifications/${id}/comments`, { method: 'POST', body: { text }, schema: qualificationSchema });
}

export function useCommentOnQualification() {
  const changed = useCaseChanged();
  return useMutation({ mutationFn: commentOnQualification, onSuccess: (result) => changed(result) });
}
