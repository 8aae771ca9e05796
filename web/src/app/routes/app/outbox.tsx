import { Alert, Button, Center, Loader } from '@mantine/core';
import { IconRefresh } from '@tabler/icons-react';
import { PageHeader } from '@/components/page-header';
import { useOutbox } from '@/features/outbox/api/get-outbox';
import { MailList } from '@/features/outbox/components/mail-list';
import { describeError } from '@/lib/api-client';

export function OutboxRoute() {
  const outbox = useOutbox();
  return (
    <>
      <PageHeader
        title="Outbox"
        description="Mail the local mail catcher received, newest first. Nothing here left this machine."
        actions={
          <Button variant="default" leftSection={<IconRefresh size={16} />} loading={outbox.isFetching} onClick={() => outbox.refetch()}>
            Refresh
          </Button>
        }
      />
      {outbox.isPending && (
        <Center py="xl">
          <Loader aria-label="Loading the outbox" />
        </Center>
      )}
      {outbox.isError && (
        <Alert color="red" title="The outbox could not be loaded" role="alert">
          {describeError(outbox.error)}
        </Alert>
      )}
      {outbox.isSuccess && <MailList mails={outbox.data} />}
    </>
  );
}
