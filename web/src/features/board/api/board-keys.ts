import { queryRoots } from '@/lib/query-keys';

export interface BoardParams {
  pageIndex: number;
  pageSize: number;
  q?: string;
  /** Comma list of board states. */
  state?: string;
  engineerId?: number;
  minAgeDays?: number;
  needsRecheck?: boolean;
}

export const boardKeys = {
  all: queryRoots.board,
  page: (params: BoardParams) => [...boardKeys.all, params] as const,
};
