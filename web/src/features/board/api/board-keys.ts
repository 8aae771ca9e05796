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
  all: ['board'] as const,
  page: (params: BoardParams) => [...boardKeys.all, params] as const,
};
