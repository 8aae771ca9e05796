import { Alert, Button, Group, Text } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconRefresh } from '@tabler/icons-react';
import { describeError } from '@/lib/api-client';
import { useReadDatasheetAgain } from '../api/read-again';

/**
 * Shown beside a card whose datasheet suggestions came from an earlier version of the reader:
 * a fresh reading may find more values, and leaves out figures the earlier one got wrong.
 * Engineers can have the stored file read again; others are told who can.
 */
export function OutdatedReading({ datasheetId, canReadAgain }: { datasheetId: number; canReadAgain: boolean }) {
  const readAgain = useReadDatasheetAgain();
  const run = () =>
    readAgain.mutate(datasheetId, {
      onSuccess: (reading) => {
        const values = reading.variants.reduce((n, v) => n + Object.keys(v.fields).length, 0);
        notifications.show({
          color: 'verdigris',
          title: 'Datasheet read again',
          message: `${reading.variants.length} part${reading.variants.length === 1 ? '' : 's'}, ${values} value${values === 1 ? '' : 's'} to check · ${reading.warnings.length} warning${reading.warnings.length === 1 ? '' : 's'}`,
        });
      },
    });
  return (
    <Alert color="orange" p="xs" mb="xs" title="Suggestions from an earlier reader" data-testid="outdated-reading">
      <Text fz="sm">
        This datasheet was read by an earlier version of the datasheet reader. Reading it again may find more values and leaves out figures the earlier reading
        got wrong; values already on the card stay as they are.
      </Text>
      {readAgain.isError && (
        <Text fz="sm" c="red" role="alert" mt={4}>
          Not read again: {describeError(readAgain.error)}
        </Text>
      )}
      <Group mt="xs">
        {canReadAgain ? (
          <Button size="compact-sm" variant="light" color="orange" leftSection={<IconRefresh size={14} />} loading={readAgain.isPending} onClick={run}>
            Read the datasheet again
          </Button>
        ) : (
          <Text fz="xs" c="dimmed">
            An engineer can have it read again.
          </Text>
        )}
      </Group>
    </Alert>
  );
}
