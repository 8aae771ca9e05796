import { Badge, Button, Group, Table, Text } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import type { Invitation } from '@shuntwise/contracts';
import { RoleBadge } from '@/components/role-badge';
import { describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useInvitationAction } from '../api/invitation-actions';

/** Invitations not yet accepted or revoked, newest first; an expired one says so (its link no longer works). Each can be sent again or taken back. */
export function InvitationsTable({ invitations, now = Date.now() }: { invitations: Invitation[]; now?: number }) {
  const resend = useInvitationAction('resend');
  const revoke = useInvitationAction('revoke');
  const run = (action: typeof resend, invitation: Invitation, done: string, failed: string) =>
    action.mutate(invitation.id, {
      onSuccess: () => notifications.show({ color: 'verdigris', title: done, message: invitation.email }),
      onError: (e) => notifications.show({ color: 'red', title: failed, message: describeError(e) }),
    });
  const pending = invitations.filter((i) => i.acceptedAt === null && i.revokedAt === null).sort((a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt));

  if (pending.length === 0) {
    return (
      <Text fz="sm" c="dimmed">
        No invitations are waiting.
      </Text>
    );
  }

  return (
    <Table aria-label="Pending invitations">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Name</Table.Th>
          <Table.Th>E-mail</Table.Th>
          <Table.Th>Role</Table.Th>
          <Table.Th>Sent</Table.Th>
          <Table.Th>Link valid until</Table.Th>
          <Table.Th>
            <Text span fz="sm" fw={700}>
              Actions
            </Text>
          </Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {pending.map((invitation) => {
          const expired = Date.parse(invitation.expiresAt) <= now;
          return (
            <Table.Tr key={invitation.id}>
              <Table.Td>{invitation.name}</Table.Td>
              <Table.Td>{invitation.email}</Table.Td>
              <Table.Td>
                <RoleBadge role={invitation.role} />
              </Table.Td>
              <Table.Td>{formatDateTime(invitation.createdAt)}</Table.Td>
              <Table.Td>{expired ? <Badge color="gray">Expired {formatDateTime(invitation.expiresAt)}</Badge> : formatDateTime(invitation.expiresAt)}</Table.Td>
              <Table.Td>
                <Group gap={6} wrap="nowrap">
                  <Button
                    size="compact-xs"
                    variant="light"
                    aria-label={`Send the invitation of ${invitation.email} again`}
                    loading={resend.isPending && resend.variables === invitation.id}
                    onClick={() => run(resend, invitation, 'Invitation sent again with a new link', 'The invitation was not sent')}
                  >
                    Send again
                  </Button>
                  <Button
                    size="compact-xs"
                    variant="subtle"
                    color="red"
                    aria-label={`Revoke the invitation of ${invitation.email}`}
                    loading={revoke.isPending && revoke.variables === invitation.id}
                    onClick={() => {
                      if (window.confirm(`Revoke the invitation of ${invitation.email}? Its link stops working.`))
                        run(revoke, invitation, 'Invitation revoked', 'The invitation was not revoked');
                    }}
                  >
                    Revoke
                  </Button>
                </Group>
              </Table.Td>
            </Table.Tr>
          );
        })}
      </Table.Tbody>
    </Table>
  );
}
