import { Alert, Button, Group, Text } from '@mantine/core';
import { IconRefresh } from '@tabler/icons-react';
import { ApiError, describeError } from '@/lib/api-client';

/**
 * A refused change, said plainly. A 409 means the case moved on meanwhile (another
 * engineer decided first, or it was changed or re-evaluated): reloading shows where it
 * stands now. What the user typed stays in the form.
 */
export function ChangeRefused({
  error,
  onReload,
  reloading,
  conflictTitle = 'The case changed before your action arrived',
  conflictHint = 'Someone else decided or changed it first, or the catalogue moved on. Nothing was changed by your action. Reload to see the case as it is now; your text stays here.',
}: {
  error: unknown;
  onReload?: () => void;
  reloading?: boolean;
  conflictTitle?: string;
  conflictHint?: string;
}) {
  const conflict = error instanceof ApiError && error.status === 409;
  const refused = error instanceof ApiError && error.status === 403;
  const title = conflict ? conflictTitle : refused ? 'Not allowed' : 'The action did not go through';
  return (
    <Alert color={conflict ? 'orange' : 'red'} title={title} role="alert" p="xs">
      {conflict && (
        <Text fz="sm" mb={4}>
          {conflictHint}
        </Text>
      )}
      <Text fz="sm">{describeError(error)}</Text>
      {conflict && onReload && (
        <Group mt="xs">
          <Button size="xs" variant="default" leftSection={<IconRefresh size={14} />} onClick={onReload} loading={reloading}>
            Reload the case
          </Button>
        </Group>
      )}
    </Alert>
  );
}
