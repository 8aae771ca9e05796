import { Alert, List, Text } from '@mantine/core';
import { IconRefreshAlert } from '@tabler/icons-react';
import { isOpenState, type Qualification, type RecheckCause } from '@shuntwise/contracts';
import { formatDateTime } from '@/lib/format-date';

const CAUSE: Record<RecheckCause, string> = {
  'card-changed': 'the rating card changed',
  'spec-changed': 'the spec changed',
  'datasheet-revised': 'a datasheet was revised',
  'measurements-added': 'measured samples were added',
  'waiver-expired': 'a waiver it was cleared on expired',
};

/** The "needs re-check" flag with what caused it: a catalogue change after the evaluation. */
export function RecheckFlag({ q }: { q: Qualification }) {
  if (!q.needsRecheck) return null;
  const open = isOpenState(q.state);
  return (
    <Alert color="orange" icon={<IconRefreshAlert size={18} />} title="Needs a re-check">
      <Text fz="sm">
        {open
          ? 'The catalogue changed after this case was evaluated. Evaluate it again (in draft) before it is decided.'
          : q.nextId !== null
            ? `The catalogue changed after this decision. A re-check is open as case #${q.nextId}.`
            : 'The catalogue changed after this decision. The decision stands as recorded until an engineer opens a re-check.'}
      </Text>
      <List size="sm" mt={4}>
        {q.recheckReasons.map((r) => (
          <List.Item key={`${r.cause}-${r.at}`}>
            {formatDateTime(r.at)}: {CAUSE[r.cause]} — {r.detail}
          </List.Item>
        ))}
      </List>
    </Alert>
  );
}
