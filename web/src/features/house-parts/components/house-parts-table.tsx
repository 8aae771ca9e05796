import 'mantine-react-table/styles.css';

import { useEffect, useMemo, useState } from 'react';
import { Anchor, Badge, Group, Select, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { IconSearch } from '@tabler/icons-react';
import { HOUSE_PART_STATUSES, type HousePart } from '@shuntwise/contracts';
import { MantineReactTable, useMantineReactTable, type MRT_ColumnDef } from 'mantine-react-table';
import { Link } from 'react-router';
import { denseTableOptions } from '@/lib/data-table';
import { serverTableOptions, useListState } from '@/lib/list-state';
import { formatDateTime } from '@/lib/format-date';
import { useHouseParts } from '../api/get-house-parts';
import { HousePartStatusBadge, STATUS_LABEL } from './house-part-status';

const SORTABLE = new Set(['partNumber', 'status', 'updatedAt', 'createdAt']);

/** House parts, paged, sorted and filtered by the server; the state lives in the address. */
export function HousePartsTable() {
  const listState = useListState({ defaultSort: 'partNumber', sortable: SORTABLE });
  const { search, set, pagination } = listState;
  const [qText, setQText] = useState(search.get('q') ?? '');
  const [q] = useDebouncedValue(qText.trim(), 250);
  const status = search.get('status') ?? '';

  useEffect(() => {
    if ((search.get('q') ?? '') !== q) set({ q });
  }, [q, search, set]);

  const list = useHouseParts({
    pageIndex: pagination.pageIndex,
    pageSize: pagination.pageSize,
    sort: listState.sort,
    q: search.get('q') || undefined,
    status: status || undefined,
  });

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
      {
        accessorKey: 'description',
        header: 'Description',
        enableSorting: false,
        Cell: ({ row }) => (
          <Text fz="sm" lineClamp={1}>
            {row.original.description}
          </Text>
        ),
      },
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
    ...serverTableOptions(list, listState, () => (
      <Text c="dimmed" ta="center" py="lg" fz="sm">
        {q || status ? 'No house part matches.' : 'No house parts yet: create the first one.'}
      </Text>
    )),
    getRowId: (p) => String(p.id),
    renderTopToolbarCustomActions: () => (
      <Group gap="xs" align="flex-end" role="search" aria-label="Filter house parts">
        <TextInput
          size="xs"
          w={240}
          label="Number or description"
          leftSection={<IconSearch size={14} />}
          value={qText}
          onChange={(e) => setQText(e.currentTarget.value)}
        />
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
