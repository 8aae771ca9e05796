import { queryRoots } from '@/lib/query-keys';

export interface QualificationListParams {
  pageIndex: number;
  pageSize: number;
  sort: string;
  state?: string;
  engineerId?: number;
  needsRecheck?: boolean;
  housePartId?: number;
  vendorPartId?: number;
  /** false lists every revision; the API's default is the latest only. */
  latest?: boolean;
}

export const qualificationKeys = {
  all: queryRoots.qualifications,
  lists: () => [...qualificationKeys.all, 'list'] as const,
  list: (params: QualificationListParams) => [...qualificationKeys.lists(), params] as const,
  detail: (id: number) => [...qualificationKeys.all, 'detail', id] as const,
};
