import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { waiverListSchema, waiverSchema, type CreateWaiverRequest, type Waiver } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationKeys } from './qualification-keys';

const waiverKey = (id: number) => [...qualificationKeys.detail(id), 'waivers'] as const;

/** `GET /qualifications/:id/waivers` (engineers, admins). */
export function useWaivers(qualificationId: number, enabled: boolean) {
  return useQuery({
    queryKey: waiverKey(qualificationId),
    queryFn: ({ signal }) => apiRequest(`/qualifications/${qualificationId}/waivers`, { schema: waiverListSchema, signal }),
    enabled,
  });
}

/** Prepare, approve or refuse a waiver; the case (its allowed actions and trail) is read again afterwards. */
export function useWaiverStep(qualificationId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (
      step: { kind: 'create'; body: CreateWaiverRequest } | { kind: 'approve' | 'refuse'; waiverId: number; body: Record<string, unknown> },
    ): Promise<Waiver> =>
      step.kind === 'create'
        ? apiRequest(`/qualifications/${qualificationId}/waivers`, { method: 'POST', body: step.body, schema: waiverSchema })
        : apiRequest(`/qualifications/${qualificationId}/waivers/${step.waiverId}/${step.kind}`, { method: 'POST', body: step.body, schema: waiverSchema }),
    onSuccess: () => client.invalidateQueries({ queryKey: qualificationKeys.detail(qualificationId) }),
  });
}
