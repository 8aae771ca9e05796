import { useMutation } from '@tanstack/react-query';
import { qualificationSchema, type Qualification, type QualificationAction } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { useCaseChanged } from './use-case-changed';

export interface ActionInput {
  id: number;
  action: QualificationAction;
  /** The body the action's contracts schema takes (version, reason, conditions, note). */
  body: Record<string, unknown>;
}

/** `POST /qualifications/:id/<action>`: answers the case as it is afterwards (a re-check answers the new case). */
export function actOnQualification({ id, action, body }: ActionInput): Promise<Qualification> {
  return apiRequest(`/qualifications/${id}/${action}`, { method: 'POST', body, schema: qualificationSchema });
}

export function useQualificationAction() {
  const changed = useCaseChanged();
  return useMutation({ mutationFn: actOnQualification, onSuccess: (result) => changed(result) });
}
