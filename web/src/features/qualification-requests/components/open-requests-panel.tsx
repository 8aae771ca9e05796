import { useState } from 'react';
import { Alert, Anchor, Badge, Button, Group, Modal, Paper, Stack, Table, Text, Textarea, Title } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconClipboardPlus, IconX } from '@tabler/icons-react';
import type { QualificationRequest } from '@shuntwise/contracts';
import { Link, useNavigate } from 'react-router';
import { ApiError, describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useDeclineQualificationRequest } from '../api/decline-qualification-request';
import { useQualificationRequests } from '../api/get-qualification-requests';
import { useOpenCaseFromRequest } from '../api/open-case-from-request';
import { age, formatDay } from '../utils/format';
import { HousePartSelect } from './house-part-select';

/** The pair's latest decision ruled the part out (rejected, or revoked): said beside the request, with the case. */
function RuledOutNote({ request, full = false }: { request: QualificationRequest; full?: boolean }) {
  const r = request.ruledOut;
  if (!r) return null;
  const what = r.state === 'revoked' ? 'Revoked' : 'Rejected';
  return (
    <Text fz="xs" c="red.9" style={{ whiteSpace: 'normal' }}>
      {what} before:{' '}
      <Anchor component={Link} to={`/qualifications/${r.caseId}`} fz="xs" c="red.9" td="underline">
        case #{r.caseId}
      </Anchor>
      {r.at ? `, ${formatDateTime(r.at)}` : ''}
      {full && r.reason ? `: ${r.reason}` : ''}
    </Text>
  );
}

/** Rows shown before "show all". */
const FIRST_ROWS = 5;

function Refused({ error, what }: { error: unknown; what: string }) {
  const conflict = error instanceof ApiError && error.status === 409;
  return (
    <Alert color={conflict ? 'orange' : 'red'} role="alert" title={`The request was not ${what}`} p="xs">
      {conflict && (
        <Text fz="sm" mb={4}>
          Nothing was changed. Another engineer may have answered it meanwhile, or the part already has a case for this house part.
        </Text>
      )}
      <Text fz="sm">{describeError(error)}</Text>
    </Alert>
  );
}

function OpenCaseDialog({ request, onClose }: { request: QualificationRequest; onClose: () => void }) {
  const [housePartId, setHousePartId] = useState<number | null>(request.housePart?.id ?? null);
  const [summary, setSummary] = useState('');
  const [missing, setMissing] = useState(false);
  const open = useOpenCaseFromRequest();
  const navigate = useNavigate();
  const what = `${request.vendorPart.manufacturer} ${request.vendorPart.mpn}`;

  const submit = () => {
    if (housePartId === null) {
      setMissing(true);
      return;
    }
    open.mutate(
      { id: request.id, body: { housePartId: request.housePart ? undefined : housePartId, summary: summary.trim() || undefined } },
      {
        onSuccess: (taken) => {
          notifications.show({
            color: 'verdigris',
            title: `Case #${taken.case?.id} opened`,
            message: `${what} for ${taken.case?.housePart.partNumber}; request #${request.id} is taken up and ${request.requestedBy.name} is told.`,
          });
          onClose();
          if (taken.case) navigate(`/qualifications/${taken.case.id}`);
        },
      },
    );
  };

  return (
    <Modal opened onClose={onClose} title={`Open a case for ${request.vendorPart.mpn}`} centered size="lg">
      <Stack gap="sm">
        <Text fz="sm">
          Opens a qualification case for {what}
          {request.housePart ? ` as a source of ${request.housePart.partNumber}` : ''}. Its rating card is checked now against the house part&apos;s current
          spec; the case starts as a draft, request #{request.id} is taken up and {request.requestedBy.name} is told.
        </Text>
        <Paper withBorder p="xs" bg="var(--mantine-color-default-hover)">
          <Text fz="xs" c="dimmed">
            {request.requestedBy.name} asked {formatDateTime(request.createdAt)}
            {request.neededBy ? `, needed by ${formatDay(request.neededBy)}` : ''}:
          </Text>
          <Text fz="sm" style={{ whiteSpace: 'pre-wrap' }}>
            {request.note}
          </Text>
        </Paper>
        {request.housePart ? (
          <Text fz="sm">
            For house part <b>{request.housePart.partNumber}</b> ({request.housePart.description}), as the request names.
          </Text>
        ) : null}
        {request.housePart && request.ruledOut ? <RuledOutNote request={request} full /> : null}
        {request.housePart ? null : (
          <HousePartSelect
            label="For house part"
            description="The request names none: choose the house part whose spec the part is checked against"
            placeholder="number or description"
            required
            requireSpec
            value={housePartId}
            onChange={(id) => {
              setHousePartId(id);
              setMissing(false);
            }}
            error={missing ? 'Choose the house part to qualify it for' : open.error instanceof ApiError ? open.error.fieldError('housePartId') : undefined}
          />
        )}
        <Textarea
          label="Notes"
          placeholder="optional; without notes the case quotes the request"
          autosize
          minRows={2}
          maxLength={4000}
          value={summary}
          onChange={(e) => setSummary(e.currentTarget.value)}
        />
        {open.isError && <Refused error={open.error} what="taken up" />}
        <Group justify="flex-end" gap="xs">
          <Button variant="default" onClick={onClose}>
            Cancel
          </Button>
          <Button onClick={submit} loading={open.isPending}>
            Open the case
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}

function DeclineDialog({ request, onClose }: { request: QualificationRequest; onClose: () => void }) {
  const [reply, setReply] = useState('');
  const [missing, setMissing] = useState(false);
  const decline = useDeclineQualificationRequest();

  const submit = () => {
    if (!reply.trim()) {
      setMissing(true);
      return;
    }
    decline.mutate(
      { id: request.id, body: { reply: reply.trim() } },
      {
        onSuccess: () => {
          notifications.show({ color: 'gray', title: `Request #${request.id} declined`, message: `${request.requestedBy.name} is mailed your reply.` });
          onClose();
        },
      },
    );
  };

  return (
    <Modal opened onClose={onClose} title={`Decline request #${request.id}`} centered size="lg">
      <Stack gap="sm">
        <Text fz="sm">
          {request.requestedBy.name} asked for {request.vendorPart.manufacturer} {request.vendorPart.mpn}
          {request.housePart ? ` for ${request.housePart.partNumber}` : ''}: &ldquo;{request.note}&rdquo;
        </Text>
        <Textarea
          label={`Reply to ${request.requestedBy.name}`}
          description="Why not, or what to use instead; it is mailed and shown with the request"
          required
          autosize
          minRows={3}
          maxLength={2000}
          value={reply}
          onChange={(e) => {
            setReply(e.currentTarget.value);
            setMissing(false);
          }}
          error={
            missing
              ? 'Write the reply to the requester: why not, or what to use instead'
              : decline.error instanceof ApiError
                ? decline.error.fieldError('reply')
                : undefined
          }
          data-autofocus
        />
        {decline.isError && !(decline.error instanceof ApiError && decline.error.fieldError('reply')) && <Refused error={decline.error} what="declined" />}
        <Group justify="flex-end" gap="xs">
          <Button variant="default" onClick={onClose}>
            Cancel
          </Button>
          <Button color="orange" onClick={submit} loading={decline.isPending}>
            Decline the request
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}

/**
 * The designers' requests waiting for an engineer, compact, above the Board's table:
 * engineers open a case from one (choosing the house part when it names none) or decline
 * it with a reply; admins read.
 */
export function OpenRequestsPanel({ canAct, linkParts }: { canAct: boolean; linkParts: boolean }) {
  const open = useQualificationRequests({ status: 'open', pageIndex: 0, pageSize: 100 });
  const [all, setAll] = useState(false);
  const [acting, setActing] = useState<{ request: QualificationRequest; action: 'open' | 'decline' } | null>(null);
  const items = open.data?.items ?? [];
  const rows = all ? items : items.slice(0, FIRST_ROWS);
  const total = open.data?.total ?? 0;

  return (
    <Paper p="xs" mb="sm" role="region" aria-labelledby="open-requests-title">
      <Group gap="xs" wrap="wrap">
        <Title order={3} fz="h5" id="open-requests-title">
          Asked for qualification
        </Title>
        {open.data && (
          <Badge size="sm" color={total > 0 ? 'blue' : 'gray'} variant={total > 0 ? 'filled' : 'light'} aria-label={`${total} waiting`}>
            {total}
          </Badge>
        )}
        <Text fz="xs" c="dimmed">
          {total > 0
            ? `Requests from designers waiting for an engineer${canAct ? ': open a case from one, or decline it with a reply' : ''}.`
            : open.isPending
              ? 'Loading…'
              : 'No request is waiting for an engineer.'}
        </Text>
      </Group>
      {open.isError && (
        <Alert color="red" p="xs" mt="xs" title="The requests could not be loaded">
          {describeError(open.error)}
        </Alert>
      )}
      {rows.length > 0 && (
        <Table.ScrollContainer minWidth={900} type="native" mt={6}>
          <Table aria-label="Requests for qualification" withTableBorder={false} verticalSpacing={4}>
            <Table.Thead>
              <Table.Tr style={{ whiteSpace: 'nowrap' }}>
                <Table.Th>Part</Table.Th>
                <Table.Th>For house part</Table.Th>
                <Table.Th>Asked by</Table.Th>
                <Table.Th>Needed by</Table.Th>
                <Table.Th>What it is for</Table.Th>
                {canAct && <Table.Th />}
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {rows.map((r) => (
                <Table.Tr key={r.id} aria-label={`Request #${r.id}: ${r.vendorPart.mpn}`}>
                  <Table.Td style={{ whiteSpace: 'nowrap' }}>
                    {linkParts ? (
                      <Anchor component={Link} to={`/vendor-parts/${r.vendorPart.id}`} fz="sm" fw={600}>
                        {r.vendorPart.mpn}
                      </Anchor>
                    ) : (
                      <Text span fz="sm" fw={600}>
                        {r.vendorPart.mpn}
                      </Text>
                    )}{' '}
                    <Text span fz="xs" c="dimmed">
                      {r.vendorPart.manufacturer}
                    </Text>
                  </Table.Td>
                  <Table.Td style={{ whiteSpace: 'nowrap' }}>
                    {r.housePart ? (
                      linkParts ? (
                        <Anchor component={Link} to={`/house-parts/${r.housePart.id}`} fz="sm">
                          {r.housePart.partNumber}
                        </Anchor>
                      ) : (
                        <Text span fz="sm">
                          {r.housePart.partNumber}
                        </Text>
                      )
                    ) : (
                      <Text span fz="xs" c="dimmed">
                        not named
                      </Text>
                    )}
                    <RuledOutNote request={r} />
                  </Table.Td>
                  <Table.Td style={{ whiteSpace: 'nowrap' }}>
                    <Text fz="sm" span>
                      {r.requestedBy.name}
                    </Text>{' '}
                    <Text fz="xs" c="dimmed" span title={formatDateTime(r.createdAt)}>
                      · {age(r.createdAt)}
                    </Text>
                  </Table.Td>
                  <Table.Td fz="sm" style={{ whiteSpace: 'nowrap' }}>
                    {r.neededBy ? (
                      formatDay(r.neededBy)
                    ) : (
                      <Text span fz="xs" c="dimmed">
                        –
                      </Text>
                    )}
                  </Table.Td>
                  <Table.Td maw={420}>
                    <Text fz="xs" lineClamp={2} title={r.note}>
                      {r.note}
                    </Text>
                  </Table.Td>
                  {canAct && (
                    <Table.Td>
                      <Group gap={4} wrap="nowrap" justify="flex-end">
                        <Button
                          size="compact-xs"
                          variant="light"
                          leftSection={<IconClipboardPlus size={13} />}
                          aria-label={`Open a case from request #${r.id}`}
                          onClick={() => setActing({ request: r, action: 'open' })}
                        >
                          Open a case
                        </Button>
                        <Button
                          size="compact-xs"
                          variant="subtle"
                          color="gray"
                          leftSection={<IconX size={13} />}
                          aria-label={`Decline request #${r.id}`}
                          onClick={() => setActing({ request: r, action: 'decline' })}
                        >
                          Decline
                        </Button>
                      </Group>
                    </Table.Td>
                  )}
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
      {items.length > FIRST_ROWS && (
        <Button variant="subtle" size="compact-xs" mt={4} onClick={() => setAll(!all)}>
          {all ? `Show the first ${FIRST_ROWS}` : `Show all ${items.length}`}
        </Button>
      )}
      {acting?.action === 'open' && <OpenCaseDialog request={acting.request} onClose={() => setActing(null)} />}
      {acting?.action === 'decline' && <DeclineDialog request={acting.request} onClose={() => setActing(null)} />}
    </Paper>
  );
}
