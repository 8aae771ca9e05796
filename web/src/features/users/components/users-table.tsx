import { useCallback, useMemo, useState } from 'react';
import { Badge, Button, Group, Modal, Select, Text, Tooltip } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { ROLES, type Role, type User } from '@shuntwise/contracts';
import { MantineReactTable, useMantineReactTable, type MRT_ColumnDef } from 'mantine-react-table';
import { roleLabel } from '@/components/role-badge';
import { describeError } from '@/lib/api-client';
import { denseTableOptions } from '@/lib/data-table';
import { formatDateTime } from '@/lib/format-date';
import { useSession } from '@/lib/session';
import { useUpdateUser } from '../api/update-user';

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: roleLabel(role) }));

export function UsersTable({ users, loading }: { users: User[]; loading: boolean }) {
  const session = useSession();
  const selfId = session?.user.id;
  const update = useUpdateUser();
  const { mutate } = update;
  const [confirming, setConfirming] = useState<User | null>(null);

  const changeRole = useCallback(
    (user: User, role: Role) => {
      if (role === user.role) return;
      mutate(
        { id: user.id, changes: { role } },
        {
          onSuccess: (saved) =>
            notifications.show({
              color: 'verdigris',
              title: 'Role changed',
              message: `${saved.name} is now ${roleLabel(saved.role)}. They sign in again to use it.`,
            }),
          onError: (error) => notifications.show({ color: 'red', title: 'Role not changed', message: describeError(error) }),
        },
      );
    },
    [mutate],
  );

  const setActive = (user: User, active: boolean) => {
    update.mutate(
      { id: user.id, changes: { active } },
      {
        onSuccess: (saved) => {
          setConfirming(null);
          notifications.show({
            color: 'verdigris',
            title: active ? 'Reactivated' : 'Deactivated',
            message: active ? `${saved.name} can sign in again.` : `${saved.name} is signed out everywhere and cannot sign in.`,
          });
        },
        onError: (error) => {
          setConfirming(null);
          notifications.show({
            color: 'red',
            title: active ? 'Not reactivated' : 'Not deactivated',
            message: describeError(error),
          });
        },
      },
    );
  };

  const columns = useMemo<MRT_ColumnDef<User>[]>(
    () => [
      { accessorKey: 'name', header: 'Name' },
      { accessorKey: 'email', header: 'E-mail' },
      {
        accessorKey: 'role',
        header: 'Role',
        filterVariant: 'select',
        mantineFilterSelectProps: { data: ROLE_OPTIONS },
        Cell: ({ row }) => {
          const user = row.original;
          const self = user.id === selfId;
          const select = (
            <Select
              size="xs"
              w={130}
              data={ROLE_OPTIONS}
              value={user.role}
              allowDeselect={false}
              disabled={self || !user.active}
              aria-label={`Role of ${user.name}`}
              onChange={(value) => value && changeRole(user, value as Role)}
            />
          );
          return self ? (
            <Tooltip label="You cannot change your own role">
              <div>{select}</div>
            </Tooltip>
          ) : (
            select
          );
        },
      },
      {
        accessorKey: 'active',
        header: 'Status',
        Cell: ({ row }) => (row.original.active ? <Badge color="verdigris">Active</Badge> : <Badge color="gray">Deactivated</Badge>),
      },
      {
        accessorKey: 'lastLoginAt',
        header: 'Last sign-in',
        Cell: ({ row }) => formatDateTime(row.original.lastLoginAt),
      },
      {
        accessorKey: 'createdAt',
        header: 'Since',
        Cell: ({ row }) => formatDateTime(row.original.createdAt),
      },
    ],
    [selfId, changeRole],
  );

  const table = useMantineReactTable({
    ...denseTableOptions<User>(),
    columns,
    data: users,
    getRowId: (user) => String(user.id),
    enableRowActions: true,
    positionActionsColumn: 'last',
    displayColumnDefOptions: { 'mrt-row-actions': { header: '', size: 130 } },
    state: { isLoading: loading },
    renderRowActions: ({ row }) => {
      const user = row.original;
      if (user.id === selfId) {
        return (
          <Text fz="xs" c="dimmed">
            This is you
          </Text>
        );
      }
      return user.active ? (
        <Button size="compact-xs" variant="subtle" color="red" onClick={() => setConfirming(user)}>
          Deactivate
        </Button>
      ) : (
        <Button size="compact-xs" variant="subtle" onClick={() => setActive(user, true)} loading={update.isPending}>
          Reactivate
        </Button>
      );
    },
  });

  return (
    <>
      <MantineReactTable table={table} />
      <Modal opened={confirming !== null} onClose={() => setConfirming(null)} title="Deactivate this account?" centered>
        {confirming && (
          <>
            <Text fz="sm">
              {confirming.name} ({confirming.email}) is signed out at once and cannot sign in until an administrator reactivates the account. Their records stay
              as they are.
            </Text>
            <Group justify="flex-end" mt="md">
              <Button variant="default" onClick={() => setConfirming(null)}>
                Keep active
              </Button>
              <Button color="red" loading={update.isPending} onClick={() => setActive(confirming, false)}>
                Deactivate
              </Button>
            </Group>
          </>
        )}
      </Modal>
    </>
  );
}
