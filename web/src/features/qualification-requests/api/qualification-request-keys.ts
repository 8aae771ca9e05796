import { queryRoots } from '@/lib/query-keys';

export interface QualificationRequestListParams {
  /** open: waiting for an engineer; all: every state. */
  status: 'open' | 'all';
  /** Only the caller's own (the API does this for designers anyway). */
  mine?: boolean;
  pageIndex: number;
  pageSize: number;
}

/** Query keys of the qualification-request feature; every variable of a query is in its key. */
export const qualificationRequestKeys = {
  all: queryRoots.qualificationRequests,
  lists: () => [...qualificationRequestKeys.all, 'list'] as const,
  list: (params: QualificationRequestListParams) => [...qualificationRequestKeys.lists(), params] as const,
  housePartChoices: (q: string) => [...qualificationRequestKeys.all, 'house-part-choices', q] as const,
};
