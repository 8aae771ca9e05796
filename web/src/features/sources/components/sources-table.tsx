import { Fragment, useState } from 'react';
import { Alert, Anchor, Badge, Button, Center, Group, Loader, Paper, SegmentedControl, Stack, Table, Text, TextInput, Tooltip } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { notifications } from '@mantine/notifications';
import { IconBell, IconBellOff, IconDownload, IconSearch } from '@tabler/icons-react';
import { Link, useSearchParams } from 'react-router';
import { DecisionRecordButton } from '@/components/decision-record-button';
import { stateLabel, QualificationStateBadge } from '@/components/qualification-state-badge';
import { WaiverBadges } from '@/components/waiver-badges';
import { describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useSession } from '@/lib/session';
import { useExportSources } from '../api/export-sources';
import { useSetFollowing } from '../api/follow-house-part';
import { useFollowed, useSourcesView } from '../api/get-sources';

/**
 * Procurement's view: per house part every source with where it stands, on what
 * conditions, since when and who decided; a CSV of the same rows; and, for buyers, which
 * house parts they follow (they are mailed when a source of one is cleared or revoked).
 */
export function SourcesTable() {
  const session = useSession();
  const role = session?.user.role;
  const buyer = role === 'buyer';
  // Engineers and admins may open the catalogue and the cases; buyers read names only.
  const linked = role === 'engineer' || role === 'admin';
  const [search, setSearch] = useSearchParams();
  // The mail's link names one house part; that view shows it whether followed or not.
  const only = Number(search.get('housePartId')) || undefined;
  const [scope, setScope] = useState<'mine' | 'all'>(buyer ? 'mine' : 'all');
  const [qText, setQText] = useState(search.get('q') ?? '');
  const [q] = useDebouncedValue(qText.trim(), 250);
  const params = only ? { housePartId: only } : { q: q || undefined, mine: scope === 'mine' ? true : undefined };
  const showAll = () =>
    setSearch(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.delete('housePartId');
        return next;
      },
      { replace: true },
    );
  const view = useSourcesView(params);
  const followed = useFollowed(buyer);
  const follow = useSetFollowing();
  const exporter = useExportSources();

  const toggleFollow = (housePartId: number, partNumber: string, now: boolean) =>
    follow.mutate(
      { housePartId, userId: session!.user.id, follow: !now },
      {
        onSuccess: () =>
          notifications.show({
            color: 'verdigris',
            title: now ? `No longer following ${partNumber}` : `Following ${partNumber}`,
            message: now ? 'You will not be mailed about its sources any more.' : 'You will be mailed when a source of it is cleared or revoked.',
          }),
        onError: (error) => notifications.show({ color: 'red', title: 'Not changed', message: describeError(error) }),
      },
    );

  const runExport = () =>
    exporter.mutate(params, {
      onSuccess: (name) => notifications.show({ color: 'verdigris', title: 'Export ready', message: `${name} was downloaded.` }),
      onError: (error) => notifications.show({ color: 'red', title: 'Export failed', message: describeError(error) }),
    });

  const items = view.data?.items ?? [];
  const sourceCount = items.reduce((n, i) => n + i.sources.length, 0);
  const clearedCount = items.reduce((n, i) => n + i.sources.filter((s) => s.standing === 'cleared' || s.standing === 'cleared-with-conditions').length, 0);

  return (
    <Stack gap="sm">
      <Paper p="xs">
        <Group justify="space-between" align="flex-end" wrap="wrap" gap="sm">
          <Group gap="sm" align="flex-end" role="search" aria-label="Filter sources">
            <TextInput
              size="xs"
              w={240}
              label="House part"
              placeholder="number or description"
              leftSection={<IconSearch size={14} />}
              value={qText}
              onChange={(e) => {
                setQText(e.currentTarget.value);
                if (only) showAll();
              }}
            />
            {only && (
              <Button size="xs" variant="light" onClick={showAll}>
                Showing one house part — show all
              </Button>
            )}
            {buyer && !only && (
              <SegmentedControl
                size="xs"
                value={scope}
                onChange={(v) => setScope(v as 'mine' | 'all')}
                data={[
                  { value: 'mine', label: 'House parts I follow' },
                  { value: 'all', label: 'All house parts' },
                ]}
                aria-label="Which house parts"
              />
            )}
          </Group>
          <Group gap="sm" align="center">
            {view.data && (
              <Text fz="xs" c="dimmed">
                {items.length} house parts · {sourceCount} sources · {clearedCount} cleared
              </Text>
            )}
            <Button size="xs" variant="default" leftSection={<IconDownload size={14} />} onClick={runExport} loading={exporter.isPending}>
              Export CSV
            </Button>
          </Group>
        </Group>
      </Paper>

      {view.isPending && (
        <Center py="xl">
          <Loader aria-label="Loading the sources" />
        </Center>
      )}
      {view.isError && (
        <Alert color="red" role="alert" title="The sources could not be loaded">
          {describeError(view.error)}{' '}
          <Button size="compact-xs" variant="default" onClick={() => void view.refetch()}>
            Try again
          </Button>
        </Alert>
      )}
      {view.data && items.length === 0 && (
        <Text c="dimmed" ta="center" py="lg" fz="sm">
          {q
            ? 'No house part matches.'
            : scope === 'mine'
              ? 'You follow no house part yet. Show all house parts and follow the ones you buy for.'
              : 'No house part yet.'}
        </Text>
      )}
      {items.length > 0 && (
        <Table.ScrollContainer minWidth={740} type="native">
          <Table aria-label="Sources" style={{ opacity: view.isPlaceholderData ? 0.6 : 1 }}>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>House part</Table.Th>
                <Table.Th>Source</Table.Th>
                <Table.Th>Package</Table.Th>
                <Table.Th>Role</Table.Th>
                <Table.Th>Standing</Table.Th>
                <Table.Th>Conditions or reason</Table.Th>
                <Table.Th>Decided</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {items.map((item) => {
                const hp = item.housePart;
                const following = followed.data?.has(hp.id) ?? false;
                const head = (
                  <Table.Td rowSpan={Math.max(1, item.sources.length)} style={{ verticalAlign: 'top', borderRight: '1px solid var(--table-border-color)' }}>
                    <Stack gap={2} maw={240}>
                      {linked ? (
                        <Anchor component={Link} to={`/house-parts/${hp.id}`} fz="sm" fw={600}>
                          {hp.partNumber}
                        </Anchor>
                      ) : (
                        <Text fz="sm" fw={600}>
                          {hp.partNumber}
                        </Text>
                      )}
                      <Text fz="xs" c="dimmed" lineClamp={2}>
                        {hp.description}
                      </Text>
                      {hp.status !== 'active' && (
                        <Badge size="xs" color="gray" variant="outline">
                          {hp.status.replace(/-/g, ' ')}
                        </Badge>
                      )}
                      {buyer && followed.data && (
                        <Button
                          size="compact-xs"
                          variant={following ? 'light' : 'subtle'}
                          color={following ? 'verdigris' : 'gray'}
                          leftSection={following ? <IconBell size={12} /> : <IconBellOff size={12} />}
                          onClick={() => toggleFollow(hp.id, hp.partNumber, following)}
                          loading={follow.isPending && follow.variables?.housePartId === hp.id}
                          aria-pressed={following}
                          aria-label={`${following ? 'Stop following' : 'Follow'} ${hp.partNumber}`}
                          w="fit-content"
                        >
                          {following ? 'Following' : 'Follow'}
                        </Button>
                      )}
                    </Stack>
                  </Table.Td>
                );
                if (item.sources.length === 0) {
                  return (
                    <Table.Tr key={hp.id}>
                      {head}
                      <Table.Td colSpan={6}>
                        <Text fz="sm" c="dimmed">
                          No source linked.
                        </Text>
                      </Table.Td>
                    </Table.Tr>
                  );
                }
                return (
                  <Fragment key={hp.id}>
                    {item.sources.map((s, i) => (
                      <Table.Tr key={s.vendorPart.id} data-source={`${hp.partNumber}/${s.vendorPart.mpn}`}>
                        {i === 0 && head}
                        <Table.Td>
                          {linked ? (
                            <Anchor component={Link} to={`/vendor-parts/${s.vendorPart.id}`} fz="sm">
                              {s.vendorPart.mpn}
                            </Anchor>
                          ) : (
                            <Text span fz="sm">
                              {s.vendorPart.mpn}
                            </Text>
                          )}
                          <Text fz="xs" c="dimmed">
                            {s.vendorPart.manufacturer}
                          </Text>
                        </Table.Td>
                        <Table.Td>
                          <Text fz="xs">{s.vendorPart.package ?? '–'}</Text>
                        </Table.Td>
                        <Table.Td>
                          <Text fz="xs" fw={s.role === 'approved' ? 600 : 400}>
                            {s.role}
                          </Text>
                        </Table.Td>
                        <Table.Td>
                          <Group gap={4} wrap="nowrap">
                            <QualificationStateBadge state={s.standing} />
                            <WaiverBadges waivers={s.waivers} />
                            {s.needsRecheck && (
                              <Tooltip label="The catalogue changed after this decision; an engineer will re-check it">
                                <Badge size="xs" color="orange" variant="outline">
                                  re-check due
                                </Badge>
                              </Tooltip>
                            )}
                          </Group>
                          {s.openCase && (
                            <Text fz="xs" c="dimmed">
                              newer case #{s.openCase.id}: {stateLabel(s.openCase.state).toLowerCase()}
                            </Text>
                          )}
                        </Table.Td>
                        <Table.Td maw={260}>
                          <Text fz="xs" style={{ whiteSpace: 'pre-wrap' }}>
                            {s.conditions ?? ''}
                          </Text>
                        </Table.Td>
                        {/* Since, by whom and the case in one cell: the table fits 1024 px beside the navigation. */}
                        <Table.Td>
                          <Text fz="xs">{formatDateTime(s.since)}</Text>
                          <Text fz="xs">{s.decidedBy?.name ?? '–'}</Text>
                          {s.caseId === null ? null : linked ? (
                            <Anchor component={Link} to={`/qualifications/${s.caseId}`} fz="xs">
                              #{s.caseId}
                              {s.revision && s.revision > 1 ? ` rev. ${s.revision}` : ''}
                            </Anchor>
                          ) : (
                            <Text fz="xs">
                              #{s.caseId}
                              {s.revision && s.revision > 1 ? ` rev. ${s.revision}` : ''}
                            </Text>
                          )}
                          {s.caseId !== null && <DecisionRecordButton caseId={s.caseId} state={s.standing} />}
                        </Table.Td>
                      </Table.Tr>
                    ))}
                  </Fragment>
                );
              })}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
    </Stack>
  );
}
