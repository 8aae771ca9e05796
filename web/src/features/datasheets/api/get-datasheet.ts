import { queryOptions, useQuery } from '@tanstack/react-query';
import { datasheetSchema, type Datasheet } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { datasheetKeys } from './datasheet-keys';

export function getDatasheet(id: number, signal?: AbortSignal): Promise<Datasheet> {
  return apiRequest(`/datasheets/${id}`, { schema: datasheetSchema, signal });
}

export const datasheetQueryOptions = (id: number) => queryOptions({ queryKey: datasheetKeys.detail(id), queryFn: ({ signal }) => getDatasheet(id, signal) });

export function useDatasheet(id: number | null) {
  return useQuery({ ...datasheetQueryOptions(id ?? 0), enabled: id !== null });
}
