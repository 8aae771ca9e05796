import { Fragment, useEffect, useMemo, useState, type ReactNode } from 'react';
import {
  Alert,
  Anchor,
  Badge,
  Button,
  Center,
  Checkbox,
  Group,
  Loader,
  MultiSelect,
  NumberInput,
  Pagination,
  Paper,
  Select,
  Stack,
  Table,
  Text,
  TextInput,
  Tooltip,
  UnstyledButton,
} from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { IconChartLine, IconSearch } from '@tabler/icons-react';
import { BOARD_STATES, type BoardRow, type BoardSource, type BoardState } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { QualificationStateBadge, stateColor, stateLabel } from '@/components/qualification-state-badge';
import { VerdictBadge } from '@/components/verdict-badge';
import { describeError } from '@/lib/api-client';
import { useListState } from '@/lib/list-state';
import { useSession } from '@/lib/session';
import { useBoard } from '../api/get-board';

const PAGE_SIZE = 25;
const NO_SORT: ReadonlySet<string> = new Set();
const STATE_OPTIONS = BOARD_STATES.map((s) => ({ value: s, label: stateLabel(s) }));

export interface BoardTableProps {
  /** What a source row offers besides its links (the route puts the "open a case" button here). */
  renderSourceAction?: (row: BoardRow, source: BoardSource) => ReactNode;
}

function age(days: number): string {
  if (days === 0) return 'today';
  if (days === 1) return '1 day';
  return `${days} days`;
}

/**
 * House parts with every source and the state of its latest case, at a glance. Filters
 * (state, engineer, age, re-check, text) are the server's and live in the address.
 */
export function BoardTable({ renderSourceAction }: BoardTableProps) {
  const session = useSession();
  const list = useListState({ defaultSort: '', sortable: NO_SORT, defaultPageSize: PAGE_SIZE });
  const { search, set } = list;
  const [qText, setQText] = useState(search.get('q') ?? '');
  const [q] = useDebouncedValue(qText.trim(), 250);
  const states = (search.get('state') ?? '').split(',').filter(Boolean) as BoardState[];
  const engineer = search.get('engineer');
  const minAge = search.get('minAge');
  const recheck = search.get('recheck') === '1';
  const page = list.pagination.pageIndex;

  useEffect(() => {
    if ((search.get('q') ?? '') !== q) set({ q });
  }, [q, search, set]);

  // One request: its counts ignore the state filter on the server, so a state left out still shows how many it has.
  const board = useBoard({
    q: search.get('q') || undefined,
    engineerId: engineer ? Number(engineer) : undefined,
    minAgeDays: minAge ? Number(minAge) : undefined,
    needsRecheck: recheck ? true : undefined,
    pageIndex: page,
    pageSize: PAGE_SIZE,
    state: states.join(',') || undefined,
  });

  // Engineers to filter by, from the server (everyone, not only those on pages seen); the viewer marked.
  const engineerOptions = useMemo(
    () =>
      (board.data?.engineers ?? []).map((e) => ({
        value: String(e.id),
        label: session?.user.id === e.id ? `${e.name} (me)` : e.name,
      })),
    [board.data?.engineers, session?.user.id],
  );

  const toggleState = (state: BoardState) => {
    const next = states.includes(state) ? states.filter((s) => s !== state) : [...states, state];
    set({ state: next.join(',') });
  };

  const counts = board.data?.counts;
  const filtered = states.length > 0 || engineer || minAge || recheck || q;
  const pages = board.data ? Math.max(1, Math.ceil(board.data.total / PAGE_SIZE)) : 1;

  return (
    <Stack gap="sm">
      <Paper p="xs">
        <Stack gap="xs">
          <Group gap="sm" align="flex-end" role="search" aria-label="Filter the board" wrap="wrap">
            <TextInput
              size="xs"
              w={220}
              label="House part"
              placeholder="number or description"
              leftSection={<IconSearch size={14} />}
              value={qText}
              onChange={(e) => setQText(e.currentTarget.value)}
            />
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
            <Select
              size="xs"
              w={200}
              label="Engineer"
              placeholder="anyone"
              data={engineerOptions}
              value={engineer}
              onChange={(v) => set({ engineer: v })}
              clearable
            />
            <NumberInput
              size="xs"
              w={150}
              label="Unchanged for at least"
              rightSection={
                <Text fz="xs" c="dimmed">
                  days
                </Text>
              }
              rightSectionWidth={40}
              min={0}
              max={36500}
              allowDecimal={false}
              value={minAge ?? ''}
              onChange={(v) => set({ minAge: v === '' ? null : String(v) })}
            />
            <Checkbox size="xs" label="Needs re-check" checked={recheck} onChange={(e) => set({ recheck: e.currentTarget.checked ? '1' : null })} />
          </Group>
          <Group gap={6} aria-label="Sources by state">
            {counts &&
              BOARD_STATES.map((s) => (
                <UnstyledButton key={s} onClick={() => toggleState(s)} aria-pressed={states.includes(s)} aria-label={`${stateLabel(s)}: ${counts[s] ?? 0}`}>
                  <Badge size="md" color={stateColor(s)} variant={states.includes(s) ? 'filled' : 'light'} style={{ cursor: 'pointer' }}>
                    {stateLabel(s)} {counts[s] ?? 0}
                  </Badge>
                </UnstyledButton>
              ))}
            {filtered && (
              <Button
                size="compact-xs"
                variant="subtle"
                onClick={() => {
                  // The text clears through its debounce, like typing would.
                  setQText('');
                  set({ state: null, engineer: null, minAge: null, recheck: null });
                }}
              >
                Clear the filters
              </Button>
            )}
          </Group>
        </Stack>
      </Paper>

      {board.isPending && (
        <Center py="xl">
          <Loader aria-label="Loading the board" />
        </Center>
      )}
      {board.isError && (
        <Alert color="red" role="alert" title="The board could not be loaded">
          {describeError(board.error)}{' '}
          <Button size="compact-xs" variant="default" onClick={() => void board.refetch()}>
            Try again
          </Button>
        </Alert>
      )}
      {board.data && board.data.items.length === 0 && (
        <Text c="dimmed" ta="center" py="lg" fz="sm">
          {filtered ? 'No source matches these filters.' : 'No house part yet: create one and link its sources first.'}
        </Text>
      )}
      {board.data && board.data.items.length > 0 && (
        <Table.ScrollContainer minWidth={980} type="native">
          <Table aria-label="Board" style={{ opacity: board.isPlaceholderData ? 0.6 : 1 }}>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>House part</Table.Th>
                <Table.Th>Source</Table.Th>
                <Table.Th>State</Table.Th>
                <Table.Th>Verdict</Table.Th>
                <Table.Th>Case</Table.Th>
                <Table.Th>Prepared → decided by</Table.Th>
                <Table.Th title="Days since the case last changed">Age</Table.Th>
                <Table.Th />
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {board.data.items.map((row) => {
                const span = Math.max(1, row.sources.length);
                const head = (
                  <Table.Td rowSpan={span} style={{ verticalAlign: 'top', borderRight: '1px solid var(--table-border-color)' }}>
                    <Stack gap={2}>
                      <Group gap={6} wrap="nowrap">
                        <Anchor component={Link} to={`/house-parts/${row.housePart.id}`} fz="sm" fw={600} style={{ whiteSpace: 'nowrap' }}>
                          {row.housePart.partNumber}
                        </Anchor>
                        {row.housePart.specVersion === null && (
                          <Badge size="xs" color="gray" variant="outline">
                            no spec
                          </Badge>
                        )}
                      </Group>
                      <Text fz="xs" c="dimmed" lineClamp={2} miw={150} maw={210}>
                        {row.housePart.description}
                      </Text>
                      {row.housePart.specVersion !== null && row.sources.length > 0 && (
                        <Anchor component={Link} to={`/compare/${row.housePart.id}`} fz="xs" aria-label={`Compare the sources of ${row.housePart.partNumber}`}>
                          <Group gap={2} component="span">
                            <IconChartLine size={12} /> Compare
                          </Group>
                        </Anchor>
                      )}
                    </Stack>
                  </Table.Td>
                );
                if (row.sources.length === 0) {
                  return (
                    <Table.Tr key={row.housePart.id}>
                      {head}
                      <Table.Td colSpan={7}>
                        <Text fz="sm" c="dimmed">
                          No source linked yet.
                        </Text>
                      </Table.Td>
                    </Table.Tr>
                  );
                }
                return (
                  <Fragment key={row.housePart.id}>
                    {row.sources.map((s, i) => {
                      const c = s.latestCase;
                      return (
                        <Table.Tr key={s.vendorPart.id} data-source={`${row.housePart.partNumber}/${s.vendorPart.mpn}`}>
                          {i === 0 && head}
                          <Table.Td>
                            <Group gap={6} wrap="nowrap">
                              <Anchor
                                component={Link}
                                to={`/vendor-parts/${s.vendorPart.id}`}
                                fz="sm"
                                fw={s.role === 'approved' ? 600 : 400}
                                style={{ whiteSpace: 'nowrap' }}
                              >
                                {s.vendorPart.mpn}
                              </Anchor>
                              {s.role === 'approved' && (
                                <Badge size="xs" variant="outline" color="dark" miw="max-content">
                                  approved
                                </Badge>
                              )}
                              <Text span fz="xs" c="dimmed" truncate maw={120} title={s.vendorPart.manufacturer}>
                                {s.vendorPart.manufacturer}
                              </Text>
                            </Group>
                          </Table.Td>
                          <Table.Td>
                            <Group gap={4} wrap="nowrap">
                              <QualificationStateBadge state={s.state} />
                              {c?.needsRecheck && (
                                <Tooltip label="The catalogue changed after this case was evaluated">
                                  <Badge size="xs" color="orange" variant="outline">
                                    re-check
                                  </Badge>
                                </Tooltip>
                              )}
                            </Group>
                          </Table.Td>
                          <Table.Td>
                            {c ? (
                              <VerdictBadge verdict={c.overall} size="xs" />
                            ) : (
                              <Text fz="xs" c="dimmed">
                                –
                              </Text>
                            )}
                          </Table.Td>
                          <Table.Td>
                            {c ? (
                              <Anchor component={Link} to={`/qualifications/${c.id}`} fz="sm">
                                #{c.id}
                                {c.revision > 1 ? ` (rev. ${c.revision})` : ''}
                              </Anchor>
                            ) : (
                              <Text fz="xs" c="dimmed">
                                –
                              </Text>
                            )}
                          </Table.Td>
                          <Table.Td>
                            <Text
                              fz="xs"
                              style={{ whiteSpace: 'nowrap' }}
                              title={c ? `prepared by ${c.preparedBy.name}${c.decidedBy ? `, decided by ${c.decidedBy.name}` : ''}` : undefined}
                            >
                              {c ? `${c.preparedBy.name}${c.decidedBy ? ` → ${c.decidedBy.name}` : ''}` : '–'}
                            </Text>
                          </Table.Td>
                          <Table.Td>
                            <Text fz="xs" style={{ whiteSpace: 'nowrap' }}>
                              {c ? age(c.ageDays) : '–'}
                            </Text>
                          </Table.Td>
                          <Table.Td>{renderSourceAction?.(row, s)}</Table.Td>
                        </Table.Tr>
                      );
                    })}
                  </Fragment>
                );
              })}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
      {board.data && pages > 1 && (
        <Group justify="space-between">
          <Text fz="xs" c="dimmed">
            {board.data.total} house parts
          </Text>
          <Pagination
            size="sm"
            total={pages}
            value={page + 1}
            onChange={(p) => list.onPaginationChange({ pageIndex: p - 1, pageSize: PAGE_SIZE })}
            getControlProps={(control) => ({ 'aria-label': `${control} page` })}
            getItemProps={(p) => ({ 'aria-label': `Page ${p}` })}
          />
        </Group>
      )}
    </Stack>
  );
}
