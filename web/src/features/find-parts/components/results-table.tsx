import {
  ActionIcon,
  Alert,
  Anchor,
  Button,
  Center,
  Checkbox,
  Group,
  Loader,
  Pagination,
  Paper,
  Select,
  Stack,
  Table,
  Text,
  Tooltip,
  UnstyledButton,
  VisuallyHidden,
} from '@mantine/core';
import { notifications } from '@mantine/notifications';
import {
  IconArrowDown,
  IconArrowUp,
  IconArrowsSort,
  IconDownload,
  IconFileCode,
  IconFileTypePdf,
  IconInfoCircle,
  IconPlugConnected,
} from '@tabler/icons-react';
import { formatPercent, formatQuantity, type SearchItem, type SearchPage } from '@shuntwise/contracts';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Quantity } from '@/components/quantity';
import { describeError, downloadFile } from '@/lib/api-client';
import { downloadPartModel } from '../api/get-part-model';
import { PAGE_SIZES, SORT_CHOICES } from '../utils/search-state';
import { ClearanceList } from './clearance-list';

/** At most this many parts are checked side by side. */
export const MAX_COMPARED = 3;

export interface ResultsTableProps {
  page: SearchPage | undefined;
  loading: boolean;
  fetching: boolean;
  error: unknown;
  sort: string;
  onSort: (sort: string) => void;
  onPage: (pageIndex: number, pageSize: number) => void;
  chosenIds: readonly number[];
  onToggleChosen: (item: SearchItem) => void;
  onCheck: (item: SearchItem) => void;
  /** Engineers and admins may open the catalogue pages; designers see names only. */
  linkCatalogue: boolean;
  includeNotCleared: boolean;
  /** Shown under a part's clearances (e.g. "ask for qualification"). */
  renderPartAction?: (item: SearchItem) => ReactNode;
  /** Saves every matching part as CSV (with the circuit check's columns when it ran). */
  onExport?: () => void;
  exporting?: boolean;
}

function SortHeader({
  field,
  sort,
  onSort,
  children,
  align = 'left',
}: {
  field: string;
  sort: string;
  onSort: (s: string) => void;
  children: ReactNode;
  align?: 'left' | 'right';
}) {
  const active = sort.replace(/^-/, '') === field;
  const desc = sort.startsWith('-');
  const Icon = !active ? IconArrowsSort : desc ? IconArrowDown : IconArrowUp;
  return (
    <Table.Th ta={align} aria-sort={active ? (desc ? 'descending' : 'ascending') : 'none'} style={{ whiteSpace: 'nowrap' }}>
      <UnstyledButton onClick={() => onSort(active && !desc ? `-${field}` : field)} fz="sm" fw={600}>
        <Group gap={4} wrap="nowrap" justify={align === 'right' ? 'flex-end' : 'flex-start'}>
          {children}
          <Icon size={13} stroke={1.6} opacity={active ? 1 : 0.45} />
        </Group>
      </UnstyledButton>
    </Table.Th>
  );
}

function VzCell({ item }: { item: SearchItem }) {
  const card = item.card;
  if (!card)
    return (
      <Text fz="xs" c="dimmed">
        no rating card
      </Text>
    );
  return (
    <Stack gap={0} align="flex-end">
      <Group gap={4} wrap="nowrap" fz="sm">
        <Text span fz="xs" c="dimmed">
          <Quantity value={card.vzMin} kind="voltage" />
        </Text>
        <Text span fz="sm" fw={600}>
          <Quantity value={card.vzNom} kind="voltage" />
        </Text>
        <Text span fz="xs" c="dimmed">
          <Quantity value={card.vzMax} kind="voltage" />
        </Text>
      </Group>
      <Text fz="xs" c="dimmed">
        at <Quantity value={card.izt} kind="current" />
      </Text>
    </Stack>
  );
}

/** One page of results, with what a designer chooses by, and the way into the circuit check. */
export function ResultsTable({
  page,
  loading,
  fetching,
  error,
  sort,
  onSort,
  onPage,
  chosenIds,
  onToggleChosen,
  onCheck,
  linkCatalogue,
  includeNotCleared,
  renderPartAction,
  onExport,
  exporting = false,
}: ResultsTableProps) {
  const items = page?.items ?? [];
  const total = page?.total ?? 0;
  const pageSize = page?.pageSize ?? 25;
  const pageIndex = page?.pageIndex ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(total, (pageIndex + 1) * pageSize);

  return (
    <Paper p={0} mb="md">
      <Group justify="space-between" px="sm" py="xs" wrap="wrap" gap="xs">
        <Group gap="xs">
          <Text fz="sm" fw={500} aria-live="polite" data-testid="result-count">
            {loading ? 'Searching…' : `${total} ${includeNotCleared ? 'catalogue' : 'usable'} part${total === 1 ? '' : 's'}`}
          </Text>
          {fetching && !loading && <Loader size="xs" aria-label="Updating" />}
          {page && page.text.mode !== 'none' && (
            <Text fz="xs" c="dimmed">
              · text {page.text.mode === 'fuzzy' ? 'matched with typos allowed' : 'matched by leading letters'} over {page.text.candidates} parts
            </Text>
          )}
        </Group>
        <Group gap="xs">
          <Select
            size="xs"
            w={200}
            aria-label="Sort by"
            data={SORT_CHOICES}
            value={SORT_CHOICES.some((c) => c.value === sort) ? sort : null}
            placeholder="Sorted by a column"
            onChange={(v) => v && onSort(v)}
            allowDeselect={false}
          />
          <Text fz="xs" c="dimmed">
            {chosenIds.length}/{MAX_COMPARED} chosen to compare
          </Text>
          {onExport && (
            <Button size="xs" variant="default" leftSection={<IconDownload size={14} />} onClick={onExport} loading={exporting} disabled={total === 0}>
              Export CSV
            </Button>
          )}
        </Group>
      </Group>
      {page?.text.note && (
        <Alert mx="sm" mb="xs" color="blue" icon={<IconInfoCircle size={16} />} py={6}>
          <Text fz="xs">{page.text.note}</Text>
        </Alert>
      )}
      {error != null && (
        <Alert mx="sm" mb="xs" color="red" role="alert" title="The search failed">
          {describeError(error)}
        </Alert>
      )}
      <Table.ScrollContainer minWidth={1000}>
        <Table aria-label="Search results" withTableBorder={false} verticalSpacing={6}>
          <Table.Thead>
            <Table.Tr>
              <Table.Th w={36}>
                <VisuallyHidden>Compare</VisuallyHidden>
              </Table.Th>
              <SortHeader field="mpn" sort={sort} onSort={onSort}>
                Part
              </SortHeader>
              <SortHeader field="package" sort={sort} onSort={onSort}>
                Package
              </SortHeader>
              <SortHeader field="vzNom" sort={sort} onSort={onSort} align="right">
                VZ min · nom · max
              </SortHeader>
              <Table.Th ta="right" style={{ whiteSpace: 'nowrap' }}>
                Tol.
              </Table.Th>
              <Table.Th ta="right" style={{ whiteSpace: 'nowrap' }}>
                ZZT
              </Table.Th>
              <SortHeader field="pdMax" sort={sort} onSort={onSort} align="right">
                PD max
              </SortHeader>
              <Table.Th ta="right" style={{ whiteSpace: 'nowrap' }}>
                αVZ
              </Table.Th>
              <Table.Th>May be designed in</Table.Th>
              <Table.Th w={120} />
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {loading && (
              <Table.Tr>
                <Table.Td colSpan={10}>
                  <Center py="lg">
                    <Loader size="sm" />
                  </Center>
                </Table.Td>
              </Table.Tr>
            )}
            {!loading && !error && items.length === 0 && (
              <Table.Tr>
                <Table.Td colSpan={10}>
                  <Text c="dimmed" ta="center" py="lg" fz="sm">
                    {includeNotCleared
                      ? 'No catalogue part matches these filters.'
                      : 'No usable part matches these filters. Widen them, or include parts not cleared to see the whole catalogue.'}
                  </Text>
                </Table.Td>
              </Table.Tr>
            )}
            {items.map((item) => {
              const chosen = chosenIds.includes(item.vendorPart.id);
              const full = chosenIds.length >= MAX_COMPARED && !chosen;
              const label = `${item.vendorPart.mpn} (${item.vendorPart.manufacturer})`;
              return (
                <Table.Tr
                  key={item.vendorPart.id}
                  bg={chosen ? 'var(--mantine-primary-color-light)' : undefined}
                  aria-label={item.vendorPart.mpn}
                  style={item.cleared ? undefined : { opacity: 0.8 }}
                >
                  <Table.Td>
                    <Tooltip
                      label={
                        !item.card ? 'No rating card: nothing to check' : full ? `Compare at most ${MAX_COMPARED} parts` : `Compare ${item.vendorPart.mpn}`
                      }
                      withArrow
                    >
                      <span>
                        <Checkbox
                          aria-label={`Compare ${item.vendorPart.mpn}`}
                          checked={chosen}
                          disabled={!item.card || full}
                          onChange={() => onToggleChosen(item)}
                        />
                      </span>
                    </Tooltip>
                  </Table.Td>
                  <Table.Td>
                    <Stack gap={0}>
                      {linkCatalogue ? (
                        <Anchor component={Link} to={`/vendor-parts/${item.vendorPart.id}`} fz="sm" fw={600}>
                          {item.vendorPart.mpn}
                        </Anchor>
                      ) : (
                        <Text fz="sm" fw={600}>
                          {item.vendorPart.mpn}
                        </Text>
                      )}
                      <Text fz="xs" c="dimmed">
                        {item.vendorPart.manufacturer}
                      </Text>
                      {item.vendorPart.lifecycleNote && !/^active$/i.test(item.vendorPart.lifecycleNote) && (
                        <Text fz="xs" c="orange.7" lineClamp={2} title={item.vendorPart.lifecycleNote}>
                          {item.vendorPart.lifecycleNote}
                        </Text>
                      )}
                    </Stack>
                  </Table.Td>
                  <Table.Td fz="sm">{item.vendorPart.package ?? '–'}</Table.Td>
                  <Table.Td ta="right">
                    <VzCell item={item} />
                  </Table.Td>
                  <Table.Td ta="right" fz="sm" style={{ whiteSpace: 'nowrap' }}>
                    {item.card?.tolerance != null ? `±${formatPercent(item.card.tolerance, { digits: 2 })}` : '–'}
                  </Table.Td>
                  <Table.Td ta="right" fz="sm">
                    <Quantity value={item.card?.zzt} kind="resistance" />
                  </Table.Td>
                  <Table.Td ta="right" fz="sm">
                    <Quantity value={item.card?.pdMax} kind="power" />
                  </Table.Td>
                  <Table.Td ta="right" fz="sm">
                    <span style={{ whiteSpace: 'nowrap', fontVariantNumeric: 'tabular-nums' }}>{formatQuantity(item.card?.tc, 'tempCoVoltage')}</span>
                  </Table.Td>
                  <Table.Td maw={360}>
                    <ClearanceList item={item} linkHouseParts={linkCatalogue} />
                    {renderPartAction?.(item)}
                  </Table.Td>
                  <Table.Td>
                    <Group gap={4} wrap="nowrap" justify="flex-end">
                      <Button
                        size="compact-xs"
                        variant="light"
                        leftSection={<IconPlugConnected size={13} />}
                        disabled={!item.card}
                        onClick={() => onCheck(item)}
                        aria-label={`Check ${label} in my circuit`}
                      >
                        Check
                      </Button>
                      {item.card && (
                        <Tooltip label="Download the SPICE .model" withArrow>
                          <ActionIcon
                            variant="subtle"
                            color="gray"
                            aria-label={`SPICE model of ${item.vendorPart.mpn}`}
                            onClick={() =>
                              downloadPartModel(item.vendorPart.id, item.vendorPart.mpn).catch((e) =>
                                notifications.show({ color: 'red', title: 'The SPICE model could not be downloaded', message: describeError(e) }),
                              )
                            }
                          >
                            <IconFileCode size={16} />
                          </ActionIcon>
                        </Tooltip>
                      )}
                      {item.datasheetId !== null && (
                        <Tooltip label="Download the datasheet" withArrow>
                          <ActionIcon
                            variant="subtle"
                            color="gray"
                            aria-label={`Datasheet of ${item.vendorPart.mpn}`}
                            onClick={() =>
                              downloadFile(`/datasheets/${item.datasheetId}/file`, `${item.vendorPart.mpn}.pdf`).catch((e) =>
                                notifications.show({ color: 'red', title: 'The datasheet could not be downloaded', message: describeError(e) }),
                              )
                            }
                          >
                            <IconFileTypePdf size={16} />
                          </ActionIcon>
                        </Tooltip>
                      )}
                    </Group>
                  </Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
      <Group justify="space-between" px="sm" py="xs" wrap="wrap">
        <Text fz="xs" c="dimmed">
          {total > 0 ? `${first}–${last} of ${total}` : ''}
        </Text>
        <Group gap="sm">
          <Select
            size="xs"
            w={90}
            aria-label="Rows per page"
            data={PAGE_SIZES}
            value={String(pageSize)}
            onChange={(v) => v && onPage(0, Number(v))}
            allowDeselect={false}
          />
          <Pagination
            size="sm"
            total={pages}
            value={pageIndex + 1}
            onChange={(p) => onPage(p - 1, pageSize)}
            getControlProps={(control) => ({ 'aria-label': `${control} page` })}
            getItemProps={(p) => ({ 'aria-label': `Page ${p}` })}
          />
        </Group>
      </Group>
    </Paper>
  );
}
