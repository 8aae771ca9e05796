import { Alert, Anchor, Center, Loader, Text } from '@mantine/core';
import { Link, useNavigate, useParams } from 'react-router';
import { homePathFor } from '@/app/navigation';
import { QueryProvider } from '@/app/query-provider';
import { PublicFrame } from '@/components/public-frame';
import { RoleBadge } from '@/components/role-badge';
import { useInvitation } from '@/features/auth/api/get-invitation';
import { AcceptInvitationForm } from '@/features/auth/components/accept-invitation-form';
import { ApiError, describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';

export function InvitationRoute() {
  return (
    <QueryProvider>
      <InvitationPage />
    </QueryProvider>
  );
}

function InvitationPage() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const invitation = useInvitation(token);

  return (
    <PublicFrame subtitle="Accept your invitation">
      {invitation.isPending && (
        <Center py="lg">
          <Loader aria-label="Loading the invitation" />
        </Center>
      )}
      {invitation.isError && (
        <Alert color="red" title="Invitation not found" role="alert">
          {invitation.error instanceof ApiError && invitation.error.status === 404
            ? 'This invitation link is unknown, already used or expired. Ask your administrator to send a new one.'
            : describeError(invitation.error)}
          <Text fz="sm" mt="xs">
            <Anchor component={Link} to="/sign-in">
              Go to sign-in
            </Anchor>
          </Text>
        </Alert>
      )}
      {invitation.isSuccess && (
        <>
          <Text fz="sm">
            <b>{invitation.data.email}</b> is invited to Shuntwise as <RoleBadge role={invitation.data.role} />. The link works once, until{' '}
            {formatDateTime(invitation.data.expiresAt)}.
          </Text>
          <AcceptInvitationForm
            token={token}
            invitation={invitation.data}
            onAccepted={(session) => navigate(homePathFor(session.user.role), { replace: true })}
          />
        </>
      )}
    </PublicFrame>
  );
}
