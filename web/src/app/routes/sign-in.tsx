import { Alert } from '@mantine/core';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { landingPathFor } from '@/app/navigation';
import { PublicFrame } from '@/components/public-frame';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { getSessionEndReason, useSession } from '@/lib/session';

export function SignInRoute() {
  const session = useSession();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next');

  if (session) return <Navigate to={landingPathFor(session.user.role, next)} replace />;

  return (
    <PublicFrame subtitle="Second sources for regulator diodes, qualified and signed off.">
      {getSessionEndReason() === 'expired' && (
        <Alert color="yellow" title="Session ended">
          Your session has ended. Sign in again to carry on where you were.
        </Alert>
      )}
      <SignInForm onSignedIn={(s) => navigate(landingPathFor(s.user.role, next), { replace: true })} />
    </PublicFrame>
  );
}
