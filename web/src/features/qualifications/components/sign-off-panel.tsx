import { useRef, useState, type ReactNode } from 'react';
import { Alert, Button, Divider, Group, Paper, Stack, Text, Title } from '@mantine/core';
import { IconInfoCircle } from '@tabler/icons-react';
import { QUALIFICATION_TRANSITIONS, type Qualification, type QualificationAction } from '@shuntwise/contracts';
import { QualificationStateBadge } from '@/components/qualification-state-badge';
import { formatDateTime } from '@/lib/format-date';
import { offeredActions, signOffNotes, type Viewer } from '../utils/sign-off-rules';
import { ACTION_COLOR, ActionDialog } from './action-dialog';

function Line({ label, children }: { label: string; children: ReactNode }) {
  return (
    <Group gap={6} wrap="nowrap" align="baseline">
      <Text fz="xs" c="dimmed" w={92} style={{ flexShrink: 0 }}>
        {label}
      </Text>
      <Text fz="sm" component="div" style={{ minWidth: 0 }}>
        {children}
      </Text>
    </Group>
  );
}

const PRIMARY: ReadonlySet<QualificationAction> = new Set(['submit', 'clear', 'clear-with-conditions', 'recheck']);

/**
 * Who prepared and who decided, and the actions the viewer may take now. Buttons appear
 * only when the role, the state and the two-person rule allow them; the notes say why an
 * expected one is missing, before anyone tries.
 */
export function SignOffPanel({
  q,
  viewer,
  onReload,
  onDone,
}: {
  q: Qualification;
  viewer: Viewer;
  onReload: () => Promise<unknown>;
  onDone?: (result: Qualification, action: QualificationAction) => void;
}) {
  const [action, setAction] = useState<QualificationAction | null>(null);
  // After an action the button that opened the dialog is usually gone (the state changed), so
  // focus would fall to the page's body: it goes to the panel's heading, which reads the new state.
  const heading = useRef<HTMLHeadingElement>(null);
  const acted = useRef(false);
  const actions = offeredActions(q, viewer);
  const notes = signOffNotes(q, viewer);
  const decisionWord = q.decision?.state === 'rejected' ? 'Reason' : q.decision?.state === 'cleared-with-conditions' ? 'Conditions' : 'Note';

  return (
    <Paper component="section" aria-label="Sign-off">
      <Stack gap="xs">
        <Group justify="space-between">
          <Title order={3} fz="h5" ref={heading} tabIndex={-1}>
            Sign-off
          </Title>
          <QualificationStateBadge state={q.state} size="md" />
        </Group>
        <Line label="Prepared by">
          {q.preparedBy.name}
          {q.preparedBy.id === viewer.id ? ' (you)' : ''}, {formatDateTime(q.createdAt)}
        </Line>
        {q.reviewer && <Line label="Reviewer asked">{q.reviewer.name}</Line>}
        {q.submittedAt && <Line label="In review since">{formatDateTime(q.submittedAt)}</Line>}
        {q.decision && (
          <>
            <Line label="Decided by">
              {q.decision.by.name}, {formatDateTime(q.decision.at)}
            </Line>
            <Line label="Decided on">
              spec v{q.decision.specVersion}, card v{q.decision.cardVersion}
            </Line>
            {q.decision.text && (
              <Line label={decisionWord}>
                <Text fz="sm" style={{ whiteSpace: 'pre-wrap' }} data-testid="decision-text">
                  {q.decision.text}
                </Text>
              </Line>
            )}
          </>
        )}
        {q.revocation && (
          <>
            <Line label="Revoked by">
              {q.revocation.by.name}, {formatDateTime(q.revocation.at)}
            </Line>
            <Line label="Why">
              <Text fz="sm" style={{ whiteSpace: 'pre-wrap' }}>
                {q.revocation.reason}
              </Text>
            </Line>
          </>
        )}
        <Divider />
        {actions.length > 0 ? (
          <Group gap="xs" role="group" aria-label="Actions on this case">
            {actions.map((a) => (
              <Button
                key={a}
                size="xs"
                variant={PRIMARY.has(a) ? 'filled' : 'default'}
                color={PRIMARY.has(a) ? ACTION_COLOR[a] : undefined}
                c={!PRIMARY.has(a) && ACTION_COLOR[a] ? `${ACTION_COLOR[a]}.7` : undefined}
                onClick={() => setAction(a)}
              >
                {QUALIFICATION_TRANSITIONS[a].label}
              </Button>
            ))}
          </Group>
        ) : (
          <Text fz="sm" c="dimmed">
            Nothing for you to do on this case now.
          </Text>
        )}
        {notes.map((note) => (
          <Alert key={note} color="blue" variant="light" p="xs" icon={<IconInfoCircle size={16} />}>
            <Text fz="sm">{note}</Text>
          </Alert>
        ))}
      </Stack>
      <ActionDialog
        q={q}
        action={action}
        onClose={() => setAction(null)}
        onReload={onReload}
        onDone={(result, done) => {
          acted.current = true;
          onDone?.(result, done);
        }}
        onClosed={() => {
          if (!acted.current) return;
          acted.current = false;
          heading.current?.focus();
        }}
      />
    </Paper>
  );
}
