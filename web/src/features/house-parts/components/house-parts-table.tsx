import 'mantine-react-table/styles.css';

import { useCallback, useEffect, useMemo, useState } from 'react';
import { Anchor, Badge, Group, Select, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { IconSearch } from '@tabler/icons-react';
import { HOUSE_PART_STATUSES, type HousePart } from '@shuntwise/contracts';
import { MantineReactTable, useMantineReactTable, type MRT_ColumnDef, type MRT_PaginationState, type MRT_SortingState } from 'mantine-react-table';
import { Link, useSearchParams } from 'react-router';
import { describeError } from '@/lib/api-client';
import { denseTableOptions } from '@/lib/data-table';
import { formatDateTime } from '@/lib/format-date';
import { useHouseParts } from '../api/get-house-parts';
import { HousePartStatusBadge, STATUS_LABEL } from './house-part-status';

const SORTABLE = new Set(['partNumber', 'status', 'updatedAt', 'createdAt']);

/** House parts, paged, sorted and filtered by the server; the state lives in the address. */
export function HousePartsTable() {
  const [search, setSearch] = useSearchParams();
  const [qText, setQText] = useState(search.get('q') ?? '');
  const [q] = useDebouncedValue(qText.trim(), 250);
  const status = search.get('status') ?? '';
  const pagination: MRT_PaginationState = { pageIndex: Number(search.get('page') ?? 0) || 0, pageSize: Number(search.get('size') ?? 50) || 50 };
  const sortText = search.get('sort') ?? 'partNumber';
  const sorting: MRT_SortingState = sortText
    .split(',')
    .filter(Boolean)
    .map((s) => ({ id: s.replace(/^-/, ''), desc: s.startsWith('-') }));

  const set = useCallback(
    (changes: Record<string, string | number | null>, resetPage = true) =>
      setSearch(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v === null || v === '') next.delete(k);
            else next.set(k, String(v));
          }
          if (resetPage && !('page' in changes)) next.delete('page');
          return next;
        },
        { replace: true },
      ),
    [setSearch],
  );

  useEffect(() => {
    if ((search.get('q') ?? '') !== q) set({ q });
  }, [q, search, set]);

  const list = useHouseParts({ pageIndex: pagination.pageIndex, pageSize: pagination.pageSize, sort: sortText, q: search.get('q') || undefined, status: status || undefined });

  const columns = useMemo<MRT_ColumnDef<HousePart>[]>(
    () => [
      {
        accessorKey: 'partNumber',
        header: 'House part',
        Cell: ({ row }) => (
          <Anchor component={Link} to={`/house-parts/${row.original.id}`} fz="sm" fw={500}>
            {row.original.partNumber}
          </Anchor>
        ),
      },
      { accessorKey: 'description', header: 'Description', enableSorting: false, Cell: ({ row }) => <Text fz="sm" lineClamp={1}>{row.original.description}</Text> },
      { accessorKey: 'status', header: 'Status', Cell: ({ row }) => <HousePartStatusBadge status={row.original.status} /> },
      {
        accessorKey: 'specVersion',
        header: 'Spec',
        enableSorting: false,
        Cell: ({ row }) =>
          row.original.specVersion ? (
            <Badge size="xs" variant="outline">
              v{row.original.specVersion}
            </Badge>
          ) : (
            <Badge size="xs" color="gray">
              none
            </Badge>
          ),
      },
      { accessorKey: 'sourceCount', header: 'Sources', enableSorting: false, mantineTableBodyCellProps: { align: 'right' } },
      { accessorKey: 'updatedAt', header: 'Updated', Cell: ({ row }) => formatDateTime(row.original.updatedAt) },
    ],
    [],
  );

  const table = useMantineReactTable({
    ...denseTableOptions<HousePart>(),
    columns,
    data: list.data?.items ?? [],
    rowCount: list.data?.total ?? 0,
    getRowId: (p) => String(p.id),
    manualPagination: true,
    manualSorting: true,
    manualFiltering: true,
    enableColumnFilters: false,
    enableGlobalFilter: false,
    state: { pagination, sorting, isLoading: list.isPending, showProgressBars: list.isFetching && !list.isPending, showAlertBanner: list.isError },
    onPaginationChange: (updater) => {
      const next = typeof updater === 'function' ? updater(pagination) : updater;
      set({ page: next.pageIndex || null, size: next.pageSize === 50 ? null : next.pageSize }, false);
    },
    onSortingChange: (updater) => {
      const next = (typeof updater === 'function' ? updater(sorting) : updater).filter((s) => SORTABLE.has(s.id));
      set({ sort: next.map((s) => `${s.desc ? '-' : ''}${s.id}`).join(',') || null });
    },
    mantineToolbarAlertBannerProps: list.isError ? { color: 'red', children: describeError(list.error) } : undefined,
    renderEmptyRowsFallback: () => (
      <Text c="dimmed" ta="center" py="lg" fz="sm">
        {q || status ? 'No house part matches.' : 'No house parts yet: create the first one.'}
      </Text>
    ),
    renderTopToolbarCustomActions: () => (
      <Group gap="xs" align="flex-end" role="search" aria-label="Filter house parts">
        <TextInput size="xs" w={240} label="Number or description" leftSection={<IconSearch size={14} />} value={qText} onChange={(e) => setQText(e.currentTarget.value)} />
        <Select
          size="xs"
          w={180}
          label="Status"
          data={[{ value: '', label: 'any' }, ...HOUSE_PART_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))]}
          value={status}
          onChange={(v) => set({ status: v ?? '' })}
          allowDeselect={false}
        />
      </Group>
    ),
  });

  return <MantineReactTable table={table} />;
}
