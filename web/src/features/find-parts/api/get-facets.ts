import { useQuery } from '@tanstack/react-query';
import { searchFacetsSchema, type SearchFacets } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { findPartsKeys } from './find-parts-keys';

export function getSearchFacets(signal?: AbortSignal): Promise<SearchFacets> {
  return apiRequest('/search/facets', { schema: searchFacetsSchema, signal });
}

/** The filters' choices change only with the catalogue: kept for five minutes. */
export function useSearchFacets() {
  return useQuery({ queryKey: findPartsKeys.facets(), queryFn: ({ signal }) => getSearchFacets(signal), staleTime: 5 * 60_000 });
}
