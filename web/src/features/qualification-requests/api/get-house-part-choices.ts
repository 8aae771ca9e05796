import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { housePartPageSchema, type HousePartPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { qualificationRequestKeys } from './qualification-request-keys';

/** House parts to choose from by number or description (the first 50 that match). */
export function getHousePartChoices(q: string, signal?: AbortSignal): Promise<HousePartPage> {
  const search = new URLSearchParams({ pageSize: '50', sort: 'partNumber' });
  if (q) search.set('q', q);
  return apiRequest(`/house-parts?${search}`, { schema: housePartPageSchema, signal });
}

export function useHousePartChoices(q: string, enabled = true) {
  return useQuery({
    queryKey: qualificationRequestKeys.housePartChoices(q),
    queryFn: ({ signal }) => getHousePartChoices(q, signal),
    placeholderData: keepPreviousData,
    staleTime: 60_000,
    enabled,
  });
}
