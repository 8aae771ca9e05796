import 'mantine-react-table/styles.css';

import { useEffect, useMemo, useState } from 'react';
import { Anchor, Badge, Button, Group, MultiSelect, Select, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { IconFilterOff, IconSearch } from '@tabler/icons-react';
import type { VendorPart } from '@shuntwise/contracts';
import { MantineReactTable, useMantineReactTable, type MRT_ColumnDef } from 'mantine-react-table';
import { Link } from 'react-router';
import { Quantity } from '@/components/quantity';
import { QuantityInput } from '@/components/quantity-input';
import { denseTableOptions } from '@/lib/data-table';
import { serverTableOptions, useListState } from '@/lib/list-state';
import { formatDateTime, formatShortDate } from '@/lib/format-date';
import { useManufacturers } from '../api/get-manufacturers';
import { useVendorParts } from '../api/get-vendor-parts';
import type { VendorPartListParams } from '../api/vendor-part-keys';

const SORTABLE = new Set(['mpn', 'manufacturer', 'package', 'vzNom', 'izt', 'pdMax', 'updatedAt']);
const PAGE_SIZES = ['25', '50', '100', '200'];

function numberParam(value: string | null): number | undefined {
  if (value === null || value === '') return undefined;
  const n = Number(value);
  return Number.isFinite(n) ? n : undefined;
}

export function VendorPartsTable() {
  const listState = useListState({ defaultSort: 'mpn', sortable: SORTABLE });
  const { search, set, pagination } = listState;
  const manufacturers = useManufacturers();
  const [mpnText, setMpnText] = useState(search.get('mpn') ?? '');
  const [mpn] = useDebouncedValue(mpnText.trim(), 250);
  const [packageText, setPackageText] = useState(search.get('package') ?? '');
  const [pkg] = useDebouncedValue(packageText.trim(), 250);
  const [vzMin, setVzMin] = useState<number | null>(numberParam(search.get('vzNomMin')) ?? null);
  const [vzMax, setVzMax] = useState<number | null>(numberParam(search.get('vzNomMax')) ?? null);

  const manufacturerFilter = (search.get('manufacturer') ?? '').split(',').filter(Boolean);
  const hasCard = search.get('hasCard') ?? '';

  // Typed filters follow the text after a pause; an unreadable voltage is not sent.
  const vzMinOk = vzMin === null || !Number.isNaN(vzMin);
  const vzMaxOk = vzMax === null || !Number.isNaN(vzMax);
  const rangeError = vzMin !== null && vzMax !== null && vzMinOk && vzMaxOk && vzMin > vzMax ? 'The lower VZ is above the upper one' : undefined;
  const [debouncedRange] = useDebouncedValue([vzMinOk ? vzMin : null, vzMaxOk ? vzMax : null] as const, 300);

  // Typed filters reach the address (and so the query) after a pause, back on the first page.
  const urlVzMin = rangeError ? undefined : (debouncedRange[0] ?? undefined);
  const urlVzMax = rangeError ? undefined : (debouncedRange[1] ?? undefined);
  useEffect(() => {
    const same =
      (search.get('mpn') ?? '') === mpn &&
      (search.get('package') ?? '') === pkg &&
      numberParam(search.get('vzNomMin')) === urlVzMin &&
      numberParam(search.get('vzNomMax')) === urlVzMax;
    if (!same) set({ mpn, package: pkg, vzNomMin: urlVzMin, vzNomMax: urlVzMax });
  }, [mpn, pkg, urlVzMin, urlVzMax, search, set]);

  const params: VendorPartListParams = {
    pageIndex: pagination.pageIndex,
    pageSize: pagination.pageSize,
    sort: listState.sort,
    mpn: search.get('mpn') || undefined,
    manufacturer: manufacturerFilter.length ? manufacturerFilter.join(',') : undefined,
    package: search.get('package') || undefined,
    vzNomMin: numberParam(search.get('vzNomMin')),
    vzNomMax: numberParam(search.get('vzNomMax')),
    hasCard: hasCard === '' ? undefined : hasCard === 'true',
  };
  const list = useVendorParts(params);

  const columns = useMemo<MRT_ColumnDef<VendorPart>[]>(
    () => [
      {
        accessorKey: 'mpn',
        header: 'Part number',
        Cell: ({ row }) => (
          <Anchor component={Link} to={`/vendor-parts/${row.original.id}`} fz="sm" fw={500}>
            {row.original.mpn}
          </Anchor>
        ),
      },
      { accessorKey: 'manufacturer', header: 'Manufacturer' },
      { accessorKey: 'package', header: 'Package', Cell: ({ row }) => row.original.package ?? '–' },
      {
        id: 'vzNom',
        accessorFn: (p) => p.card?.vzNom ?? null,
        header: 'VZ nom',
        mantineTableHeadCellProps: { align: 'right' },
        mantineTableBodyCellProps: { align: 'right' },
        Cell: ({ row }) => <Quantity value={row.original.card?.vzNom} kind="voltage" />,
      },
      {
        id: 'izt',
        accessorFn: (p) => p.card?.izt ?? null,
        header: 'at IZT',
        mantineTableHeadCellProps: { align: 'right' },
        mantineTableBodyCellProps: { align: 'right' },
        Cell: ({ row }) => <Quantity value={row.original.card?.izt} kind="current" />,
      },
      {
        id: 'pdMax',
        accessorFn: (p) => p.card?.pdMax ?? null,
        header: 'PD max',
        mantineTableHeadCellProps: { align: 'right' },
        mantineTableBodyCellProps: { align: 'right' },
        Cell: ({ row }) => <Quantity value={row.original.card?.pdMax} kind="power" />,
      },
      {
        id: 'card',
        accessorFn: (p) => p.card?.version ?? null,
        header: 'Card',
        enableSorting: false,
        Cell: ({ row }) =>
          row.original.card ? (
            <Badge size="xs" variant="outline">
              v{row.original.card.version}
            </Badge>
          ) : (
            <Badge size="xs" color="gray">
              none
            </Badge>
          ),
      },
      {
        accessorKey: 'lifecycleNote',
        header: 'Lifecycle',
        enableSorting: false,
        Cell: ({ row }) => (
          <Text fz="sm" maw={200} truncate title={row.original.lifecycleNote ?? undefined}>
            {row.original.lifecycleNote ?? ''}
          </Text>
        ),
      },
      {
        accessorKey: 'updatedAt',
        header: 'Updated',
        Cell: ({ row }) => <span title={formatDateTime(row.original.updatedAt)}>{formatShortDate(row.original.updatedAt)}</span>,
      },
    ],
    [],
  );

  const anyFilter = mpnText || packageText || vzMin !== null || vzMax !== null || manufacturerFilter.length > 0 || hasCard;
  const table = useMantineReactTable({
    ...denseTableOptions<VendorPart>(),
    columns,
    ...serverTableOptions(list, listState, () => (
      <Text c="dimmed" ta="center" py="lg" fz="sm">
        {anyFilter ? 'No vendor part matches these filters.' : 'No vendor parts yet: upload a datasheet or import a CSV.'}
      </Text>
    )),
    getRowId: (p) => String(p.id),
    enableMultiSort: true,
    isMultiSortEvent: (e) => (e as MouseEvent).shiftKey,
    mantinePaginationProps: { rowsPerPageOptions: PAGE_SIZES },
    renderTopToolbarCustomActions: () => (
      <Group gap="xs" align="flex-end" wrap="wrap" role="search" aria-label="Filter vendor parts">
        <TextInput
          size="xs"
          w={150}
          label="Part number starts"
          leftSection={<IconSearch size={14} />}
          value={mpnText}
          onChange={(e) => setMpnText(e.currentTarget.value)}
        />
        <MultiSelect
          size="xs"
          w={220}
          label="Manufacturer"
          placeholder={manufacturerFilter.length ? undefined : 'any'}
          data={(manufacturers.data ?? []).map((m) => ({ value: m.name, label: `${m.name} (${m.vendorPartCount})` }))}
          value={manufacturerFilter}
          onChange={(names) => set({ manufacturer: names.join(',') })}
          searchable
          clearable
          maxValues={10}
        />
        <TextInput size="xs" w={100} label="Package" placeholder="any" value={packageText} onChange={(e) => setPackageText(e.currentTarget.value)} />
        <QuantityInput size="xs" w={96} label="VZ from" kind="voltage" unit="V" value={vzMin} onChange={setVzMin} error={rangeError} />
        <QuantityInput size="xs" w={96} label="VZ to" kind="voltage" unit="V" value={vzMax} onChange={setVzMax} />
        <Select
          size="xs"
          w={110}
          label="Card"
          data={[
            { value: '', label: 'any' },
            { value: 'true', label: 'with card' },
            { value: 'false', label: 'without' },
          ]}
          value={hasCard}
          onChange={(v) => set({ hasCard: v ?? '' })}
          allowDeselect={false}
        />
        {anyFilter && (
          <Button
            size="xs"
            variant="subtle"
            leftSection={<IconFilterOff size={14} />}
            onClick={() => {
              setMpnText('');
              setPackageText('');
              setVzMin(null);
              setVzMax(null);
              set({ manufacturer: null, hasCard: null });
            }}
          >
            Clear
          </Button>
        )}
      </Group>
    ),
  });

  return <MantineReactTable table={table} />;
}
