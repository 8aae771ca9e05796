import { useState } from 'react';
import { Alert, Badge, Button, Group, Paper, Select, Stack, Text, TextInput, Textarea, Title } from '@mantine/core';
import {
  CHECK_LABELS,
  WAIVER_STATE_LABELS,
  WAIVABLE_VERDICTS,
  createWaiverRequestSchema,
  formatNumber,
  formatQuantity,
  isOpenState,
  parseQuantity,
  type CheckQuantity,
  type Qualification,
  type Waiver,
} from '@shuntwise/contracts';
import { describeError } from '@/lib/api-client';
import { useWaivers, useWaiverStep } from '../api/waivers';
import type { Viewer } from '../utils/sign-off-rules';

/** A check's value in its unit, as the evaluation shows it; a ratio plain. */
export function formatWaiverLimit(value: number | null, quantity: CheckQuantity): string {
  if (value === null) return 'as stated';
  if (quantity === 'ratio') return formatNumber(value, 4, { trim: true });
  if (quantity === 'text') return String(value);
  return formatQuantity(value, quantity);
}

/** Reads the accepted limit typed with its unit ("45 Ω", "1.5 uA") into SI; a ratio is a plain number; a text check takes none. */
export function readAcceptedLimit(text: string, quantity: CheckQuantity): number | null {
  if (quantity === 'text') return null;
  if (quantity === 'ratio') {
    const n = Number(text.trim());
    if (text.trim() === '' || !Number.isFinite(n)) throw new Error('Accepted limit: write a number');
    return n;
  }
  return parseQuantity(text, quantity, { field: 'Accepted limit' });
}

/** The form an engineer fills to waive one failing or marginal check of an open case. */
export function WaiverForm({
  q,
  onSubmit,
  busy,
}: {
  q: Qualification;
  onSubmit: (body: ReturnType<typeof createWaiverRequestSchema.parse>) => void;
  busy?: boolean;
}) {
  const waivable = q.evaluation.checks.filter((c) => (WAIVABLE_VERDICTS as readonly string[]).includes(c.verdict));
  const [checkId, setCheckId] = useState<string | null>(waivable[0]?.id ?? null);
  const [limit, setLimit] = useState('');
  const [reason, setReason] = useState('');
  const [expiresOn, setExpiresOn] = useState('');
  const [error, setError] = useState<string | null>(null);
  const check = waivable.find((c) => c.id === checkId) ?? null;
  if (waivable.length === 0) return null;

  const submit = () => {
    setError(null);
    if (!check) return setError('Choose the check to waive');
    let acceptedLimit: number | null;
    try {
      acceptedLimit = readAcceptedLimit(limit, check.quantity);
    } catch (e) {
      return setError(e instanceof Error ? e.message : String(e));
    }
    const parsed = createWaiverRequestSchema.safeParse({ checkId: check.id, acceptedLimit, reason, expiresOn });
    if (!parsed.success) return setError(parsed.error.issues.map((i) => `${i.path.join('.') || 'waiver'}: ${i.message}`).join('; '));
    onSubmit(parsed.data);
  };

  return (
    <Stack gap="xs" component="form" aria-label="Prepare a waiver" onSubmit={(e) => (e.preventDefault(), submit())}>
      <Select
        label="Check"
        data={waivable.map((c) => ({ value: c.id, label: `${CHECK_LABELS[c.id]} (${c.verdict})` }))}
        value={checkId}
        onChange={setCheckId}
        allowDeselect={false}
      />
      {check && check.quantity !== 'text' && (
        <TextInput
          label="Accepted limit"
          description={`The spec says ${formatWaiverLimit(check.limit, check.quantity)}; the part has ${formatWaiverLimit(check.value, check.quantity)}`}
          value={limit}
          onChange={(e) => setLimit(e.currentTarget.value)}
        />
      )}
      <Textarea label="Reason" value={reason} onChange={(e) => setReason(e.currentTarget.value)} autosize minRows={2} />
      <TextInput
        label="Expires on"
        type="date"
        description="Last day the waiver holds; the clearance lapses the day after"
        value={expiresOn}
        onChange={(e) => setExpiresOn(e.currentTarget.value)}
      />
      {error && (
        <Text c="red" fz="sm" role="alert">
          {error}
        </Text>
      )}
      <Button type="submit" loading={busy} size="xs">
        Prepare waiver
      </Button>
    </Stack>
  );
}

function WaiverRow({ w, q, viewer }: { w: Waiver; q: Qualification; viewer: Viewer }) {
  const step = useWaiverStep(q.id);
  const [reason, setReason] = useState('');
  const mayDecide = viewer.role === 'engineer' && w.state === 'proposed' && w.preparedBy.id !== viewer.id && isOpenState(q.state);
  return (
    <Stack gap={4} data-testid={`waiver-${w.id}`}>
      <Group gap="xs">
        <Badge color={w.state === 'approved' ? 'yellow' : w.state === 'lapsed' ? 'orange' : 'gray'} variant="light">
          {WAIVER_STATE_LABELS[w.state]}
        </Badge>
        <Text fz="sm" fw={600}>
          {w.checkLabel}
        </Text>
      </Group>
      <Text fz="sm">
        Accepted {formatWaiverLimit(w.acceptedLimit, w.quantity)} (spec {formatWaiverLimit(w.specLimit, w.quantity)}), until {w.expiresOn}. {w.reason}
      </Text>
      <Text fz="xs" c="dimmed">
        Prepared by {w.preparedBy.name}
        {w.decidedBy ? `; ${w.state === 'refused' ? 'refused' : 'approved'} by ${w.decidedBy.name}` : ''}
      </Text>
      {w.state === 'proposed' && w.preparedBy.id === viewer.id && (
        <Text fz="xs" c="dimmed">
          You prepared this waiver, so another engineer must approve it (two-person rule).
        </Text>
      )}
      {mayDecide && (
        <Group gap="xs" align="end">
          <Button size="xs" onClick={() => step.mutate({ kind: 'approve', waiverId: w.id, body: {} })} loading={step.isPending}>
            Approve waiver
          </Button>
          <TextInput
            size="xs"
            placeholder="Reason for refusing"
            aria-label="Reason for refusing"
            value={reason}
            onChange={(e) => setReason(e.currentTarget.value)}
          />
          <Button
            size="xs"
            color="red"
            variant="light"
            disabled={!reason.trim()}
            onClick={() => step.mutate({ kind: 'refuse', waiverId: w.id, body: { reason } })}
          >
            Refuse
          </Button>
        </Group>
      )}
      {step.error && (
        <Text c="red" fz="sm" role="alert">
          {describeError(step.error)}
        </Text>
      )}
    </Stack>
  );
}

/** Waivers of the case beside the sign-off: the list with approve and refuse, and the form to prepare one while the case is open. */
export function WaiversPanel({ q, viewer }: { q: Qualification; viewer: Viewer }) {
  const reads = viewer.role === 'engineer' || viewer.role === 'admin';
  const list = useWaivers(q.id, reads);
  const step = useWaiverStep(q.id);
  const [formKey, setFormKey] = useState(0);
  if (!reads) return null;
  const items = list.data?.items ?? [];
  const canPrepare = viewer.role === 'engineer' && isOpenState(q.state);
  if (items.length === 0 && (!canPrepare || q.overall === 'pass')) return null;
  return (
    <Paper component="section" aria-label="Waivers">
      <Stack gap="xs">
        <Title order={3} fz="h5">
          Waivers
        </Title>
        {items.map((w) => (
          <WaiverRow key={w.id} w={w} q={q} viewer={viewer} />
        ))}
        {canPrepare && (
          <WaiverForm
            key={formKey}
            q={q}
            busy={step.isPending}
            onSubmit={(body) => step.mutate({ kind: 'create', body }, { onSuccess: () => setFormKey((k) => k + 1) })}
          />
        )}
        {step.error && (
          <Alert color="red" role="alert">
            {describeError(step.error)}
          </Alert>
        )}
      </Stack>
    </Paper>
  );
}
