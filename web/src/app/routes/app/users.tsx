import 'mantine-react-table/styles.css';
import '@mantine/dates/styles.css';

import { Alert, Button, Stack, Title } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { IconMailPlus } from '@tabler/icons-react';
import { PageHeader } from '@/components/page-header';
import { useInvitations } from '@/features/users/api/get-invitations';
import { useUsers } from '@/features/users/api/get-users';
import { InvitationsTable } from '@/features/users/components/invitations-table';
import { InviteUserModal } from '@/features/users/components/invite-user-modal';
import { UsersTable } from '@/features/users/components/users-table';
import { describeError } from '@/lib/api-client';

export function UsersRoute() {
  const users = useUsers();
  const invitations = useInvitations();
  const [inviting, { open, close }] = useDisclosure(false);

  return (
    <>
      <PageHeader
        title="Users"
        description="Who may sign in, and in which role. A role change or deactivation ends that person's sign-ins."
        actions={
          <Button leftSection={<IconMailPlus size={16} />} onClick={open}>
            Invite someone
          </Button>
        }
      />
      <Stack gap="lg">
        {users.isError && (
          <Alert color="red" title="Users could not be loaded" role="alert">
            {describeError(users.error)}
          </Alert>
        )}
        <UsersTable users={users.data ?? []} loading={users.isPending} />
        <Stack gap="xs">
          <Title order={3} fz="h5">
            Pending invitations
          </Title>
          {invitations.isError ? (
            <Alert color="red" role="alert">
              {describeError(invitations.error)}
            </Alert>
          ) : (
            <InvitationsTable invitations={invitations.data ?? []} />
          )}
        </Stack>
      </Stack>
      <InviteUserModal opened={inviting} onClose={close} />
    </>
  );
}
