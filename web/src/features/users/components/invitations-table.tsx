import { Badge, Table, Text } from '@mantine/core';
import type { Invitation } from '@shuntwise/contracts';
import { RoleBadge } from '@/components/role-badge';
import { formatDateTime } from '@/lib/format-date';

/** Invitations not yet accepted, newest first; an expired one says so (its link no longer works). */
export function InvitationsTable({ invitations, now = Date.now() }: { invitations: Invitation[]; now?: number }) {
  const pending = invitations
    .filter((i) => i.acceptedAt === null)
    .sort((a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt));

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
              <Table.Td>
                {expired ? (
                  <Badge color="gray">Expired {formatDateTime(invitation.expiresAt)}</Badge>
                ) : (
                  formatDateTime(invitation.expiresAt)
                )}
              </Table.Td>
            </Table.Tr>
          );
        })}
      </Table.Tbody>
    </Table>
  );
}
