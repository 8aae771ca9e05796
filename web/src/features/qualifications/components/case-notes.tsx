import { useState } from 'react';
import { Button, Group, Paper, Stack, Text, Textarea, Title } from '@mantine/core';
import type { Qualification } from '@shuntwise/contracts';
import { useUpdateQualification } from '../api/update-qualification';
import { ChangeRefused } from './conflict-notice';

/** The preparer's notes on the case; editable by an engineer while it is a draft. */
export function CaseNotes({ q, canEdit, onReload }: { q: Qualification; canEdit: boolean; onReload: () => Promise<unknown> }) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(q.summary);
  const mutation = useUpdateQualification();
  const save = () => mutation.mutate({ id: q.id, request: { version: q.version, summary: text.trim() } }, { onSuccess: () => setEditing(false) });

  return (
    <Paper component="section" aria-label="Notes">
      <Stack gap={6}>
        <Group justify="space-between">
          <Title order={3} fz="h5">
            Notes
          </Title>
          {canEdit && !editing && (
            <Button
              size="compact-xs"
              variant="subtle"
              onClick={() => {
                setText(q.summary);
                setEditing(true);
              }}
            >
              Edit
            </Button>
          )}
        </Group>
        {editing ? (
          <>
            <Textarea aria-label="Notes" autosize minRows={2} maxRows={10} value={text} onChange={(e) => setText(e.currentTarget.value)} maxLength={4000} />
            {mutation.isError && <ChangeRefused error={mutation.error} onReload={() => void onReload().then(() => mutation.reset())} />}
            <Group justify="flex-end" gap="xs">
              <Button size="xs" variant="default" onClick={() => setEditing(false)}>
                Cancel
              </Button>
              <Button size="xs" onClick={save} loading={mutation.isPending}>
                Save notes
              </Button>
            </Group>
          </>
        ) : (
          <Text fz="sm" c={q.summary ? undefined : 'dimmed'} style={{ whiteSpace: 'pre-wrap' }}>
            {q.summary || 'No notes.'}
          </Text>
        )}
      </Stack>
    </Paper>
  );
}
