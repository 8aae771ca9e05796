import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { housePartPageSchema, type HousePartPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { housePartKeys, type HousePartListParams } from './house-part-keys';

export function getHouseParts(params: HousePartListParams, signal?: AbortSignal): Promise<HousePartPage> {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined && value !== '') search.set(key, String(value));
  return apiRequest(`/house-parts?${search}`, { schema: housePartPageSchema, signal });
}

export function useHouseParts(params: HousePartListParams) {
  return useQuery({
    queryKey: housePartKeys.list(params),
    queryFn: ({ signal }) => getHouseParts(params, signal),
    placeholderData: keepPreviousData,
  });
}
