import { useState } from 'react';
import { Alert, Badge, Button, Group, Modal, Stack, Text, TextInput, Textarea, Tooltip } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconMessageQuestion } from '@tabler/icons-react';
import { QUALIFICATION_REQUEST_NOTE_MAX, createQualificationRequestRequestSchema } from '@shuntwise/contracts';
import { ApiError, describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useCreateQualificationRequest } from '../api/create-qualification-request';
import { useMyQualificationRequests } from '../api/get-qualification-requests';
import { HousePartSelect } from './house-part-select';

export interface AskTarget {
  vendorPart: { id: number; manufacturer: string; mpn: string };
  /** House parts the part is already usable for (asking for those makes no sense). */
  clearedFor: ReadonlyArray<{ id: number; partNumber: string }>;
  /** A case for it is open already (for some house part). */
  underWay?: boolean;
}

const FIELDS = ['note', 'neededBy', 'housePartId'] as const;
type Field = (typeof FIELDS)[number];

/** The server's complaints about the fields this form shows; anything else goes in the alert. */
function fieldErrors(error: unknown): Partial<Record<Field, string>> {
  if (!(error instanceof ApiError) || !error.errors) return {};
  return Object.fromEntries(error.errors.filter((e) => (FIELDS as readonly string[]).includes(e.path)).map((e) => [e.path, e.message]));
}

/** Today as YYYY-MM-DD in the viewer's own calendar. */
function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/**
 * "Ask for qualification" on a part a designer may not design in yet (or may, but for other
 * house parts): a note on the application, optionally the house part and a date. Engineers
 * are mailed; the requester hears when it is taken up or declined.
 */
export function AskQualificationButton({ target }: { target: AskTarget }) {
  const [opened, setOpened] = useState(false);
  const mine = useMyQualificationRequests();
  const waiting = (mine.data?.items ?? []).filter((r) => r.vendorPart.id === target.vendorPart.id && r.state === 'open');
  // Usable somewhere, or being qualified already: asking is for another house part.
  const another = target.clearedFor.length > 0 || (target.underWay ?? false);
  const { mpn } = target.vendorPart;

  return (
    <Group gap={4} wrap="wrap" mt={4}>
      {waiting.length > 0 && (
        <Tooltip
          withArrow
          multiline
          maw={300}
          label={waiting
            .map((r) => `Request #${r.id}${r.housePart ? ` for ${r.housePart.partNumber}` : ''}, sent ${formatDateTime(r.createdAt)}: waiting for an engineer`)
            .join('; ')}
        >
          <Badge size="sm" color="blue" variant="outline" data-testid={`asked-${mpn}`}>
            you asked · waiting
          </Badge>
        </Tooltip>
      )}
      {(waiting.length === 0 || another) && (
        <Button
          size="compact-xs"
          variant={another ? 'subtle' : 'light'}
          color={another ? 'gray' : undefined}
          leftSection={<IconMessageQuestion size={13} />}
          aria-label={another ? `Ask for qualification of ${mpn} for another house part` : `Ask for qualification of ${mpn}`}
          onClick={() => setOpened(true)}
        >
          {/* The name carries the visible words (WCAG 2.5.3); "for another house part" is in the name too. */}
          Ask for qualification
        </Button>
      )}
      {opened && <AskQualificationDialog target={target} onClose={() => setOpened(false)} />}
    </Group>
  );
}

function AskQualificationDialog({ target, onClose }: { target: AskTarget; onClose: () => void }) {
  const [note, setNote] = useState('');
  const [neededBy, setNeededBy] = useState('');
  const [housePartId, setHousePartId] = useState<number | null>(null);
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const create = useCreateQualificationRequest();
  const what = `${target.vendorPart.manufacturer} ${target.vendorPart.mpn}`;
  const exclude = new Map(target.clearedFor.map((h) => [h.id, 'already usable']));
  // A field's complaint goes once it is changed.
  const clear = (field: Field) => setErrors((e) => (e[field] ? { ...e, [field]: undefined } : e));

  const submit = () => {
    const body = { vendorPartId: target.vendorPart.id, housePartId, note, neededBy: neededBy || null };
    // The API's own schema first: a note left empty is said here, before anything is sent.
    const parsed = createQualificationRequestRequestSchema.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    if (housePartId !== null && exclude.has(housePartId)) {
      setErrors({ housePartId: `${what} is already usable for this house part` });
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (request) => {
        notifications.show({
          color: 'verdigris',
          title: `Request #${request.id} sent`,
          message: `The component engineers are told about ${what}. You get an e-mail when one takes it up or declines it; My qualification requests shows where it stands.`,
        });
        onClose();
      },
      onError: (error) => setErrors(fieldErrors(error)),
    });
  };

  return (
    <Modal opened onClose={onClose} title={`Ask for qualification of ${target.vendorPart.mpn}`} centered size="lg">
      <Stack gap="sm">
        <Text fz="sm">
          A component engineer checks {what} against a house part&apos;s spec, and a second engineer signs the decision off. Say what you need it for, so they
          can weigh it against the rest of their work.
        </Text>
        {target.clearedFor.length > 0 && (
          <Text fz="sm" c="dimmed">
            Already usable for {target.clearedFor.map((h) => h.partNumber).join(', ')}: choose the house part you need it for.
          </Text>
        )}
        {target.underWay && (
          <Text fz="sm" c="dimmed">
            A qualification of it is under way already; ask only if you need it for another house part.
          </Text>
        )}
        <HousePartSelect
          label="For house part"
          description={target.clearedFor.length > 0 ? 'The house part of your design' : 'Optional: leave it empty if you do not know; the engineer chooses'}
          placeholder="any: the engineer chooses"
          value={housePartId}
          onChange={(id) => {
            setHousePartId(id);
            clear('housePartId');
          }}
          exclude={exclude}
          error={errors.housePartId}
        />
        <Textarea
          label="What it is for"
          description="The design and board, why this part, quantities, anything the engineer should look at"
          required
          autosize
          minRows={3}
          maxLength={QUALIFICATION_REQUEST_NOTE_MAX}
          value={note}
          onChange={(e) => {
            setNote(e.currentTarget.value);
            clear('note');
          }}
          error={errors.note}
          data-autofocus
        />
        <TextInput
          type="date"
          w={200}
          label="Needed by"
          description="Optional"
          min={today()}
          value={neededBy}
          onChange={(e) => {
            setNeededBy(e.currentTarget.value);
            clear('neededBy');
          }}
          error={errors.neededBy}
        />
        {create.isError && Object.keys(fieldErrors(create.error)).length === 0 && (
          <Alert
            color={create.error instanceof ApiError && create.error.status === 409 ? 'orange' : 'red'}
            role="alert"
            title="The request was not sent"
            p="xs"
          >
            <Text fz="sm">{describeError(create.error)}</Text>
          </Alert>
        )}
        <Group justify="flex-end" gap="xs">
          <Button variant="default" onClick={onClose}>
            Cancel
          </Button>
          <Button onClick={submit} loading={create.isPending}>
            Send the request
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}
