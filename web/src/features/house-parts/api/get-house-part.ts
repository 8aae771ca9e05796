import { queryOptions, useQuery } from '@tanstack/react-query';
import { housePartSchema, type HousePart } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { housePartKeys } from './house-part-keys';

export function getHousePart(id: number, signal?: AbortSignal): Promise<HousePart> {
  return apiRequest(`/house-parts/${id}`, { schema: housePartSchema, signal });
}

export const housePartQueryOptions = (id: number) => queryOptions({ queryKey: housePartKeys.detail(id), queryFn: ({ signal }) => getHousePart(id, signal) });

export function useHousePart(id: number) {
  return useQuery(housePartQueryOptions(id));
}
