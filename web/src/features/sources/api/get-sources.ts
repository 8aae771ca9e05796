import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { sourcesViewSchema, type SourcesView } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { sourcesKeys, type SourcesParams } from './sources-keys';

export function sourcesSearch(params: SourcesParams): string {
  const search = new URLSearchParams();
  if (params.q) search.set('q', params.q);
  if (params.mine) search.set('mine', 'true');
  if (params.housePartId) search.set('housePartId', String(params.housePartId));
  const text = search.toString();
  return text ? `?${text}` : '';
}

/** Per house part, every source with where it stands for procurement. */
export function getSources(params: SourcesParams, signal?: AbortSignal): Promise<SourcesView> {
  return apiRequest(`/qualification-views/sources${sourcesSearch(params)}`, { schema: sourcesViewSchema, signal });
}

export function useSourcesView(params: SourcesParams) {
  return useQuery({ queryKey: sourcesKeys.view(params), queryFn: ({ signal }) => getSources(params, signal), placeholderData: keepPreviousData });
}

/** The house parts the signed-in buyer follows (their ids), read from the same view filtered to "mine". */
export function useFollowed(enabled: boolean) {
  return useQuery({
    queryKey: sourcesKeys.followed(),
    queryFn: async ({ signal }) => new Set((await getSources({ mine: true }, signal)).items.map((i) => i.housePart.id)) as ReadonlySet<number>,
    enabled,
  });
}
