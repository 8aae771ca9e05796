import { queryRoots } from '@/lib/query-keys';

export interface HousePartListParams {
  pageIndex: number;
  pageSize: number;
  sort: string;
  q?: string;
  status?: string;
}

export const housePartKeys = {
  all: queryRoots.houseParts,
  lists: () => [...housePartKeys.all, 'list'] as const,
  list: (params: HousePartListParams) => [...housePartKeys.lists(), params] as const,
  detail: (id: number) => [...housePartKeys.all, 'detail', id] as const,
  spec: (id: number) => [...housePartKeys.detail(id), 'spec'] as const,
  specVersion: (id: number, version: number) => [...housePartKeys.detail(id), 'spec', version] as const,
  specVersions: (id: number) => [...housePartKeys.detail(id), 'spec-versions'] as const,
  sources: (id: number) => [...housePartKeys.detail(id), 'sources'] as const,
  vendorPartSearch: (text: string) => [...housePartKeys.all, 'vendor-part-search', text] as const,
};
