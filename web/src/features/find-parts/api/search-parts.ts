import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { searchPageSchema, type SearchPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { findPartsKeys, type SearchParams } from './find-parts-keys';

export function searchQueryString(params: SearchParams): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === '' || value === false || (typeof value === 'number' && Number.isNaN(value))) continue;
    search.set(key, String(value));
  }
  return search.toString();
}

export function searchParts(params: SearchParams, signal?: AbortSignal): Promise<SearchPage> {
  return apiRequest(`/search?${searchQueryString(params)}`, { schema: searchPageSchema, signal });
}

export const searchPartsQueryOptions = (params: SearchParams) =>
  queryOptions({
    queryKey: findPartsKeys.search(params),
    queryFn: ({ signal }) => searchParts(params, signal),
    // The table keeps the last page on screen while the next one loads.
    placeholderData: keepPreviousData,
  });

export function useSearchParts(params: SearchParams) {
  return useQuery(searchPartsQueryOptions(params));
}
