import { Group, Paper, Stack, Text, Timeline, Title } from '@mantine/core';
import type { AuditAction, AuditEntry } from '@shuntwise/contracts';
import { QualificationStateBadge } from '@/components/qualification-state-badge';
import { formatDateTime } from '@/lib/format-date';

const ACTION_LABEL: Record<AuditAction, string> = {
  opened: 'Opened',
  evaluated: 'Evaluated again',
  edited: 'Edited',
  submitted: 'Sent for review',
  'sent-back': 'Sent back to draft',
  approved: 'Approved as approved source',
  cleared: 'Cleared',
  'cleared-with-conditions': 'Cleared with conditions',
  rejected: 'Rejected',
  withdrawn: 'Withdrawn',
  revoked: 'Revoked',
  'recheck-opened': 'Re-check opened',
  'flagged-for-recheck': 'Flagged for re-check',
  commented: 'Commented',
};

const FIELD_LABEL: Record<string, string> = {
  state: 'state',
  specVersion: 'spec version',
  cardVersion: 'card version',
  overall: 'overall verdict',
  needsRecheck: 'needs re-check',
  reviewerId: 'reviewer',
  summary: 'notes',
  nextId: 'next revision',
};

function show(value: AuditEntry['changes'][number]['from']): string {
  if (value === null) return '–';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  const text = String(value);
  return text.length > 80 ? `${text.slice(0, 77)}…` : text;
}

/** Every state change and edit of the case, oldest first: who, when, what changed. */
export function AuditTrail({ entries }: { entries: readonly AuditEntry[] }) {
  return (
    <Paper component="section" aria-label="Audit trail">
      <Stack gap="xs">
        <Title order={3} fz="h5">
          Audit trail
        </Title>
        <Timeline bulletSize={12} lineWidth={2} active={entries.length - 1}>
          {entries.map((e) => {
            // The state change is shown as a badge; the rest as plain lines (a value recorded for the first time without an arrow).
            const others = e.changes.filter((c) => c.field !== 'state');
            return (
              <Timeline.Item
                key={e.id}
                title={
                  <Group gap={6}>
                    <Text fz="sm" fw={500}>
                      {ACTION_LABEL[e.action]}
                    </Text>
                    {e.toState && e.fromState !== e.toState && <QualificationStateBadge state={e.toState} size="xs" />}
                  </Group>
                }
              >
                <Text fz="xs" c="dimmed">
                  {e.by?.name ?? 'Shuntwise (catalogue change)'}, {formatDateTime(e.at)}
                </Text>
                {e.note && (
                  <Text fz="xs" style={{ whiteSpace: 'pre-wrap' }}>
                    {e.note}
                  </Text>
                )}
                {others.length > 0 && (
                  <Text fz="xs" c="dimmed">
                    {others.map((c) => `${FIELD_LABEL[c.field] ?? c.field}: ${c.from === null ? show(c.to) : `${show(c.from)} → ${show(c.to)}`}`).join(' · ')}
                  </Text>
                )}
              </Timeline.Item>
            );
          })}
        </Timeline>
      </Stack>
    </Paper>
  );
}
