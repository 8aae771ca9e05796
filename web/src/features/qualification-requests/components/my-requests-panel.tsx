import { useState } from 'react';
import { Alert, Anchor, Button, Collapse, Group, Paper, Stack, Table, Text, Title } from '@mantine/core';
import type { QualificationRequest } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { QualificationStateBadge } from '@/components/qualification-state-badge';
import { describeError } from '@/lib/api-client';
import { formatDateTime, formatShortDate } from '@/lib/format-date';
import { useMyQualificationRequests } from '../api/get-qualification-requests';
import { formatDay } from '../utils/format';
import { RequestStateBadge } from './request-state-badge';

/** Rows shown before "show all". */
const FIRST_ROWS = 5;
/** A request closed this recently still opens the panel by itself. */
const RECENT_MS = 14 * 86_400_000;

function WhereItStands({ request, linkCases }: { request: QualificationRequest; linkCases: boolean }) {
  if (request.state === 'open') {
    return (
      <Stack gap={0}>
        <Text fz="xs" c="dimmed">
          Engineers were told {formatDateTime(request.createdAt)}
        </Text>
        {request.neededBy && <Text fz="xs">Needed by {formatDay(request.neededBy)}</Text>}
      </Stack>
    );
  }
  if (request.state === 'declined') {
    return (
      <Text fz="xs" lineClamp={3} title={request.reply ?? undefined}>
        <Text span fz="xs" c="dimmed">
          {request.closedBy?.name ?? 'An engineer'}:{' '}
        </Text>
        {request.reply}
      </Text>
    );
  }
  const c = request.case;
  return (
    <Group gap={6} wrap="wrap">
      {c && linkCases ? (
        <Anchor component={Link} to={`/qualifications/${c.id}`} fz="xs">
          Case #{c.id}
        </Anchor>
      ) : (
        <Text span fz="xs">
          Case #{c?.id}
        </Text>
      )}
      {c && <QualificationStateBadge state={c.state} size="xs" />}
      <Text span fz="xs" c="dimmed">
        {c ? `for ${c.housePart.partNumber}` : ''} · opened by {request.closedBy?.name ?? 'an engineer'} {formatShortDate(request.closedAt)}
      </Text>
    </Group>
  );
}

/**
 * The caller's own requests for a qualification and where each stands: waiting, taken up
 * (with its case and the case's state) or declined (with the engineer's reply). Shown
 * only once there is one; open by itself while one is waiting or was answered lately.
 */
export function MyRequestsPanel({ linkCases }: { linkCases: boolean }) {
  const mine = useMyQualificationRequests();
  const [shown, setShown] = useState<boolean | null>(null);
  const [all, setAll] = useState(false);
  if (mine.isError) {
    return (
      <Alert color="red" mb="md" p="xs" title="Your qualification requests could not be loaded">
        {describeError(mine.error)}
      </Alert>
    );
  }
  const items = mine.data?.items ?? [];
  if (items.length === 0) return null;

  const count = (state: QualificationRequest['state']) => items.filter((r) => r.state === state).length;
  const recent = items.some((r) => r.state === 'open' || (r.closedAt !== null && Date.now() - Date.parse(r.closedAt) < RECENT_MS));
  const open = shown ?? recent;
  const rows = all ? items : items.slice(0, FIRST_ROWS);
  const summary = [`${count('open')} waiting`, `${count('taken-up')} taken up`, `${count('declined')} declined`].join(' · ');

  return (
    <Paper p="sm" mb="md" role="region" aria-labelledby="my-requests-title">
      <Group justify="space-between" wrap="nowrap">
        <Group gap="xs" wrap="wrap">
          <Title order={3} fz="h5" id="my-requests-title">
            My qualification requests
          </Title>
          <Text fz="xs" c="dimmed" data-testid="my-requests-summary">
            {summary}
          </Text>
        </Group>
        <Button variant="subtle" size="compact-xs" aria-expanded={open} onClick={() => setShown(!open)}>
          {open ? 'Hide' : `Show ${items.length}`}
        </Button>
      </Group>
      <Collapse in={open}>
        <Stack gap={4} mt="xs">
          <Table aria-label="My qualification requests" withTableBorder={false} verticalSpacing={4}>
            <Table.Thead>
              <Table.Tr style={{ whiteSpace: 'nowrap' }}>
                <Table.Th>Part</Table.Th>
                <Table.Th>For house part</Table.Th>
                <Table.Th>What it is for</Table.Th>
                <Table.Th>State</Table.Th>
                <Table.Th>Where it stands</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {rows.map((r) => (
                <Table.Tr key={r.id} aria-label={`Request #${r.id}: ${r.vendorPart.mpn}`}>
                  <Table.Td style={{ whiteSpace: 'nowrap' }}>
                    <Text fz="sm" fw={600} span>
                      {r.vendorPart.mpn}
                    </Text>{' '}
                    <Text fz="xs" c="dimmed" span>
                      {r.vendorPart.manufacturer}
                    </Text>
                  </Table.Td>
                  <Table.Td fz="sm" style={{ whiteSpace: 'nowrap' }}>
                    {r.housePart?.partNumber ?? (
                      <Text span fz="xs" c="dimmed">
                        engineer chooses
                      </Text>
                    )}
                  </Table.Td>
                  <Table.Td maw={320}>
                    <Text fz="xs" lineClamp={2} title={r.note}>
                      {r.note}
                    </Text>
                  </Table.Td>
                  <Table.Td>
                    <RequestStateBadge state={r.state} />
                  </Table.Td>
                  <Table.Td maw={360}>
                    <WhereItStands request={r} linkCases={linkCases} />
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
          {items.length > FIRST_ROWS && (
            <Group>
              <Button variant="subtle" size="compact-xs" onClick={() => setAll(!all)}>
                {all ? `Show the first ${FIRST_ROWS}` : `Show all ${items.length}`}
              </Button>
            </Group>
          )}
          <Text fz="xs" c="dimmed">
            A part becomes usable once a second engineer clears its case; it then shows as cleared for that house part in the results.
          </Text>
        </Stack>
      </Collapse>
    </Paper>
  );
}
