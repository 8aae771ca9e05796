import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { boardPageSchema, type BoardPage } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { boardKeys, type BoardParams } from './board-keys';

export function getBoard(params: BoardParams, signal?: AbortSignal): Promise<BoardPage> {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined && value !== '') search.set(key, String(value));
  return apiRequest(`/qualification-views/board?${search}`, { schema: boardPageSchema, signal });
}

export function useBoard(params: BoardParams) {
  return useQuery({ queryKey: boardKeys.page(params), queryFn: ({ signal }) => getBoard(params, signal), placeholderData: keepPreviousData });
}
