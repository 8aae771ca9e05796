import 'mantine-react-table/styles.css';

import { useMemo } from 'react';
import { Anchor, Badge, Checkbox, Group, MultiSelect, Stack, Text } from '@mantine/core';
import { QUALIFICATION_STATES, type QualificationSummary } from '@shuntwise/contracts';
import { MantineReactTable, useMantineReactTable, type MRT_ColumnDef } from 'mantine-react-table';
import { Link } from 'react-router';
import { QualificationStateBadge, stateLabel } from '@/components/qualification-state-badge';
import { VerdictBadge } from '@/components/verdict-badge';
import { denseTableOptions } from '@/lib/data-table';
import { serverTableOptions, useListState } from '@/lib/list-state';
import { formatDateTime } from '@/lib/format-date';
import { useSession } from '@/lib/session';
import { useQualifications } from '../api/get-qualifications';

const SORTABLE = new Set(['updatedAt', 'createdAt', 'state', 'id']);
const STATE_OPTIONS = QUALIFICATION_STATES.map((s) => ({ value: s, label: stateLabel(s) }));

/** Qualification cases, paged, sorted and filtered by the server; the filters live in the address. */
export function QualificationsTable() {
  const session = useSession();
  const listState = useListState({ defaultSort: '-updatedAt', sortable: SORTABLE });
  const { search, set, pagination } = listState;
  const states = (search.get('state') ?? '').split(',').filter(Boolean);
  const mine = search.get('mine') === '1';
  const recheck = search.get('recheck') === '1';
  const all = search.get('revisions') === 'all';

  const list = useQualifications({
    pageIndex: pagination.pageIndex,
    pageSize: pagination.pageSize,
    sort: listState.sort,
    state: states.join(',') || undefined,
    engineerId: mine ? session?.user.id : undefined,
    needsRecheck: recheck ? true : undefined,
    latest: all ? false : undefined,
  });

  const columns = useMemo<MRT_ColumnDef<QualificationSummary>[]>(
    () => [
      {
        accessorKey: 'id',
        header: 'Case',
        Cell: ({ row }) => (
          <Anchor component={Link} to={`/qualifications/${row.original.id}`} fz="sm" fw={500}>
            #{row.original.id}
          </Anchor>
        ),
      },
      {
        id: 'source',
        header: 'Source',
        enableSorting: false,
        Cell: ({ row }) => (
          <Stack gap={0}>
            <Anchor component={Link} to={`/qualifications/${row.original.id}`} fz="sm">
              {row.original.vendorPart.mpn}
            </Anchor>
            <Text fz="xs" c="dimmed">
              {row.original.vendorPart.manufacturer}
            </Text>
          </Stack>
        ),
      },
      {
        id: 'housePart',
        header: 'House part',
        enableSorting: false,
        Cell: ({ row }) => (
          <Anchor component={Link} to={`/house-parts/${row.original.housePart.id}`} fz="sm">
            {row.original.housePart.partNumber}
          </Anchor>
        ),
      },
      {
        accessorKey: 'state',
        header: 'State',
        Cell: ({ row }) => (
          <Group gap={4} wrap="nowrap">
            <QualificationStateBadge state={row.original.state} />
            {row.original.needsRecheck && (
              <Badge size="xs" color="orange" variant="outline" title={row.original.recheckReasons.map((r) => r.detail).join('; ')}>
                re-check
              </Badge>
            )}
          </Group>
        ),
      },
      { accessorKey: 'overall', header: 'Verdict', enableSorting: false, Cell: ({ row }) => <VerdictBadge verdict={row.original.overall} /> },
      { accessorKey: 'revision', header: 'Rev.', enableSorting: false, mantineTableBodyCellProps: { align: 'right' } },
      { id: 'preparedBy', header: 'Prepared by', enableSorting: false, Cell: ({ row }) => row.original.preparedBy.name },
      {
        id: 'decidedBy',
        header: 'Decided by',
        enableSorting: false,
        Cell: ({ row }) =>
          row.original.revocation?.by.name ??
          row.original.decision?.by.name ??
          (row.original.reviewer ? <Text fz="sm" c="dimmed">{`asked: ${row.original.reviewer.name}`}</Text> : '–'),
      },
      { accessorKey: 'updatedAt', header: 'Changed', Cell: ({ row }) => formatDateTime(row.original.updatedAt) },
    ],
    [],
  );

  const filtered = states.length > 0 || mine || recheck;
  const table = useMantineReactTable({
    ...denseTableOptions<QualificationSummary>(),
    columns,
    ...serverTableOptions(list, listState, () => (
      <Text c="dimmed" ta="center" py="lg" fz="sm">
        {filtered ? 'No case matches these filters.' : 'No qualification case yet: open one from the Board for a source of a house part.'}
      </Text>
    )),
    getRowId: (q) => String(q.id),
    renderTopToolbarCustomActions: () => (
      <Group gap="sm" align="flex-end" role="search" aria-label="Filter cases">
        <MultiSelect
          size="xs"
          w={300}
          label="State"
          placeholder={states.length ? undefined : 'any'}
          data={STATE_OPTIONS}
          value={states}
          onChange={(v) => set({ state: v.join(',') })}
          clearable
        />
        {session?.user.role === 'engineer' && (
          <Checkbox size="xs" label="Mine (prepared or decided)" checked={mine} onChange={(e) => set({ mine: e.currentTarget.checked ? '1' : null })} />
        )}
        <Checkbox size="xs" label="Needs re-check" checked={recheck} onChange={(e) => set({ recheck: e.currentTarget.checked ? '1' : null })} />
        <Checkbox size="xs" label="Every revision" checked={all} onChange={(e) => set({ revisions: e.currentTarget.checked ? 'all' : null })} />
      </Group>
    ),
  });

  return <MantineReactTable table={table} />;
}
