import { Fragment, createElement, useCallback, type ReactNode } from 'react';
import type { MRT_PaginationState, MRT_RowData, MRT_SortingState, MRT_TableOptions, MRT_Updater } from 'mantine-react-table';
import { useSearchParams } from 'react-router';
import { describeError } from './api-client';

/** Values to write into the address; null, undefined and '' remove the parameter. */
export type ListChanges = Record<string, string | number | null | undefined>;

export interface ListState {
  search: URLSearchParams;
  /** Writes parameters (replacing the history entry); any change but paging goes back to page 1. */
  set(changes: ListChanges, resetPage?: boolean): void;
  pagination: MRT_PaginationState;
  sorting: MRT_SortingState;
  /** The sort as the API takes it (`col,-other`). */
  sort: string;
  onPaginationChange(updater: MRT_Updater<MRT_PaginationState>): void;
  onSortingChange(updater: MRT_Updater<MRT_SortingState>): void;
}

/**
 * A server-paged list whose page, size, sort and filters live in the address, so back,
 * reload and a shared link show the same rows. Sort is `col,-other` (a leading minus for
 * descending); only the columns in `sortable` are sent.
 */
export function useListState({
  defaultSort,
  sortable,
  defaultPageSize = 50,
}: {
  defaultSort: string;
  sortable: ReadonlySet<string>;
  defaultPageSize?: number;
}): ListState {
  const [search, setSearch] = useSearchParams();
  const set = useCallback(
    (changes: ListChanges, resetPage = true) =>
      setSearch(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v === null || v === undefined || v === '') next.delete(k);
            else next.set(k, String(v));
          }
          if (resetPage && !('page' in changes)) next.delete('page');
          return next;
        },
        { replace: true },
      ),
    [setSearch],
  );
  const pageIndex = Number(search.get('page') ?? 0);
  const pageSize = Number(search.get('size') ?? defaultPageSize);
  const pagination: MRT_PaginationState = {
    pageIndex: Number.isInteger(pageIndex) && pageIndex >= 0 ? pageIndex : 0,
    pageSize: Number.isInteger(pageSize) && pageSize > 0 ? pageSize : defaultPageSize,
  };
  const sort = search.get('sort') ?? defaultSort;
  const sorting: MRT_SortingState = sort
    .split(',')
    .filter(Boolean)
    .map((s) => ({ id: s.replace(/^-/, ''), desc: s.startsWith('-') }));
  return {
    search,
    set,
    pagination,
    sorting,
    sort,
    onPaginationChange(updater) {
      const next = typeof updater === 'function' ? updater(pagination) : updater;
      set({ page: next.pageIndex || null, size: next.pageSize === defaultPageSize ? null : next.pageSize }, false);
    },
    onSortingChange(updater) {
      const next = (typeof updater === 'function' ? updater(sorting) : updater).filter((s) => sortable.has(s.id));
      set({ sort: next.map((s) => `${s.desc ? '-' : ''}${s.id}`).join(',') || null });
    },
  };
}

interface PageQuery<T> {
  data?: { items: T[]; total: number };
  isPending: boolean;
  isFetching: boolean;
  isError: boolean;
  error: unknown;
}

/**
 * The mantine-react-table options of a list paged, sorted and filtered by the server.
 * `empty` is what an empty list says; while the list failed to load the error banner says
 * it all, and the body stays blank rather than claiming there is nothing.
 */
export function serverTableOptions<T extends MRT_RowData>(
  list: PageQuery<T>,
  state: ListState,
  empty: () => ReactNode,
): Partial<MRT_TableOptions<T>> & { data: T[] } {
  return {
    // An empty fragment, not null: the table shows its own "no records" text for null.
    renderEmptyRowsFallback: () => (list.isError ? createElement(Fragment) : empty()),
    data: list.data?.items ?? [],
    rowCount: list.data?.total ?? 0,
    manualPagination: true,
    manualSorting: true,
    manualFiltering: true,
    enableColumnFilters: false,
    enableGlobalFilter: false,
    state: {
      pagination: state.pagination,
      sorting: state.sorting,
      isLoading: list.isPending,
      showProgressBars: list.isFetching && !list.isPending,
      showAlertBanner: list.isError,
    },
    onPaginationChange: state.onPaginationChange,
    onSortingChange: state.onSortingChange,
    mantineToolbarAlertBannerProps: list.isError ? { color: 'red', children: describeError(list.error) } : undefined,
  };
}
