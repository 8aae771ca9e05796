import { Alert, Button, PasswordInput, Stack, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { acceptInvitationRequestSchema, type LoginResponse } from '@shuntwise/contracts';
import { ApiError, describeError } from '@/lib/api-client';
import { schemaResolver } from '@/lib/form';
import { useAcceptInvitation } from '../api/accept-invitation';
import type { InvitationPreview } from '../api/get-invitation';

interface Values {
  token: string;
  name: string;
  password: string;
  confirm: string;
}

const validateSchema = schemaResolver<Values>(acceptInvitationRequestSchema);

export function AcceptInvitationForm({
  token,
  invitation,
  onAccepted,
}: {
  token: string;
  invitation: InvitationPreview;
  onAccepted: (session: LoginResponse) => void;
}) {
  const accept = useAcceptInvitation();
  const form = useForm<Values>({
    mode: 'uncontrolled',
    initialValues: { token, name: invitation.name, password: '', confirm: '' },
    validate: (values) => {
      const errors = validateSchema(values);
      if (!errors.password && values.confirm !== values.password) errors.confirm = 'The two passwords differ';
      return errors;
    },
    validateInputOnBlur: true,
  });

  const submit = form.onSubmit((values) => {
    const { confirm: _confirm, ...body } = values;
    accept.mutate(acceptInvitationRequestSchema.parse(body), {
      onSuccess: onAccepted,
      onError: (error) => {
        // Server-side field messages (e.g. a password rule) go beside their field.
        if (error instanceof ApiError) for (const e of error.errors ?? []) form.setFieldError(e.path, e.message);
      },
    });
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Accept invitation">
      <Stack gap="sm">
        {accept.isError && (
          <Alert color="red" title="Not accepted" role="alert">
            {accept.error instanceof ApiError && accept.error.status === 404
              ? 'This invitation is no longer valid: it was used already or it expired. Ask your administrator for a new one.'
              : describeError(accept.error)}
          </Alert>
        )}
        <TextInput label="E-mail" value={invitation.email} readOnly disabled />
        <TextInput label="Your name" autoComplete="name" key={form.key('name')} {...form.getInputProps('name')} />
        <PasswordInput
          label="Password"
          description="At least 10 characters"
          autoComplete="new-password"
          key={form.key('password')}
          {...form.getInputProps('password')}
        />
        <PasswordInput label="Password again" autoComplete="new-password" key={form.key('confirm')} {...form.getInputProps('confirm')} />
        <Button type="submit" loading={accept.isPending} fullWidth mt="xs">
          Set password and sign in
        </Button>
      </Stack>
    </form>
  );
}
