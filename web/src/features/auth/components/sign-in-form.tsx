import { startTransition } from 'react';
import { Alert, Button, PasswordInput, Stack, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { loginRequestSchema, type LoginResponse } from '@shuntwise/contracts';
import { ApiError, describeError } from '@/lib/api-client';
import { schemaResolver } from '@/lib/form';
import { useSignIn } from '../api/login';

function signInErrorText(error: unknown): string {
  if (error instanceof ApiError && error.status === 401) return 'That e-mail and password do not match an active account.';
  if (error instanceof ApiError && error.status === 429) return 'Too many sign-in attempts from here. Wait a minute, then try again.';
  return describeError(error);
}

export function SignInForm({ onSignedIn }: { onSignedIn: (session: LoginResponse) => void }) {
  const [error, signIn, pending] = useSignIn(onSignedIn);
  const form = useForm({
    mode: 'uncontrolled',
    initialValues: { email: '', password: '' },
    validate: schemaResolver(loginRequestSchema),
    validateInputOnBlur: true,
  });

  const submit = form.onSubmit((values) => {
    startTransition(() => signIn(loginRequestSchema.parse(values)));
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Sign in">
      <Stack gap="sm">
        {error !== null && !pending && (
          <Alert color="red" title="Not signed in" role="alert">
            {signInErrorText(error)}
          </Alert>
        )}
        <TextInput label="E-mail" type="email" autoComplete="username" autoFocus key={form.key('email')} {...form.getInputProps('email')} />
        <PasswordInput label="Password" autoComplete="current-password" key={form.key('password')} {...form.getInputProps('password')} />
        <Button type="submit" loading={pending} fullWidth mt="xs">
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
