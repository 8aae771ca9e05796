import { queryRoots } from '@/lib/query-keys';

export interface SourcesParams {
  q?: string;
  /** Only the house parts the signed-in buyer follows. */
  mine?: boolean;
  /** One house part only (the link in a buyer's mail). */
  housePartId?: number;
}

export const sourcesKeys = {
  all: queryRoots.sources,
  view: (params: SourcesParams) => [...sourcesKeys.all, 'view', params] as const,
  followed: () => [...sourcesKeys.all, 'followed'] as const,
};
