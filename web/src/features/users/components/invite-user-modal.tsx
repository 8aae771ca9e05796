import { Alert, Button, Group, Modal, Select, Stack, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { notifications } from '@mantine/notifications';
import { createInvitationRequestSchema, ROLES, type Role } from '@shuntwise/contracts';
import { roleLabel } from '@/components/role-badge';
import { ApiError, describeError } from '@/lib/api-client';
import { schemaResolver } from '@/lib/form';
import { useCreateInvitation } from '../api/create-invitation';

interface Values {
  name: string;
  email: string;
  role: Role | '';
}

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: roleLabel(role) }));

export function InviteUserModal({ opened, onClose }: { opened: boolean; onClose: () => void }) {
  const invite = useCreateInvitation();
  const form = useForm<Values>({
    mode: 'uncontrolled',
    initialValues: { name: '', email: '', role: 'engineer' },
    validate: schemaResolver(createInvitationRequestSchema),
    validateInputOnBlur: true,
  });

  const close = () => {
    form.reset();
    invite.reset();
    onClose();
  };

  const submit = form.onSubmit((values) => {
    const body = createInvitationRequestSchema.parse(values);
    invite.mutate(body, {
      onSuccess: (invitation) => {
        notifications.show({
          color: 'verdigris',
          title: 'Invitation sent',
          message: `${invitation.name} (${invitation.email}) can set a password from the link in the e-mail.`,
        });
        close();
      },
      onError: (error) => {
        if (error instanceof ApiError && error.status === 409) {
          form.setFieldError('email', error.message);
        } else if (error instanceof ApiError) {
          for (const e of error.errors ?? []) form.setFieldError(e.path, e.message);
        }
        notifications.show({ color: 'red', title: 'Invitation not sent', message: describeError(error) });
      },
    });
  });

  return (
    <Modal opened={opened} onClose={close} title="Invite someone" centered>
      <form onSubmit={submit} noValidate aria-label="Invite someone">
        <Stack gap="sm">
          {invite.isError && !(invite.error instanceof ApiError && invite.error.status === 409) && (
            <Alert color="red" role="alert">
              {describeError(invite.error)}
            </Alert>
          )}
          <TextInput label="Name" data-autofocus key={form.key('name')} {...form.getInputProps('name')} />
          <TextInput label="E-mail" type="email" key={form.key('email')} {...form.getInputProps('email')} />
          <Select
            label="Role"
            data={ROLE_OPTIONS}
            allowDeselect={false}
            comboboxProps={{ withinPortal: true }}
            key={form.key('role')}
            {...form.getInputProps('role')}
          />
          <Group justify="flex-end" mt="xs">
            <Button variant="default" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" loading={invite.isPending}>
              Send invitation
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
