import { queryOptions, useQuery } from '@tanstack/react-query';
import { qualificationSchema, type Qualification } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationKeys } from './qualification-keys';

export function getQualification(id: number, signal?: AbortSignal): Promise<Qualification> {
  return apiRequest(`/qualifications/${id}`, { schema: qualificationSchema, signal });
}

export const qualificationQueryOptions = (id: number) =>
  queryOptions({ queryKey: qualificationKeys.detail(id), queryFn: ({ signal }) => getQualification(id, signal), enabled: id > 0 });

export function useQualification(id: number) {
  return useQuery(qualificationQueryOptions(id));
}
