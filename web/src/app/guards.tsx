import { Suspense, type ComponentType, type LazyExoticComponent } from 'react';
import { Center, Loader } from '@mantine/core';
import { Navigate, Outlet, useLocation } from 'react-router';
import { getSessionEndReason, useSession } from '@/lib/session';
import { mayUse, type Screen } from './navigation';
import { NotAvailable } from './routes/app/not-available';

export function PageLoader() {
  return (
    <Center py="xl" mih={200}>
      <Loader type="dots" aria-label="Loading" />
    </Center>
  );
}

/**
 * Everything below needs a session. Without one the user goes to sign-in, which brings
 * them back here afterwards — unless they signed out on purpose.
 */
export function RequireSession() {
  const session = useSession();
  const location = useLocation();
  if (!session) {
    const here = `${location.pathname}${location.search}${location.hash}`;
    const keep = getSessionEndReason() !== 'signed-out' && location.pathname !== '/';
    return <Navigate to={keep ? `/sign-in?next=${encodeURIComponent(here)}` : '/sign-in'} replace />;
  }
  return <Outlet />;
}

/**
 * Opens a screen's page only for the roles the navigation map allows. The page is a
 * React.lazy component so a role that may not use it never downloads its code.
 */
export function ScreenGate({ screen, page: Page }: { screen: Screen; page: LazyExoticComponent<ComponentType> }) {
  const session = useSession();
  if (!session) return null;
  if (!mayUse(session.user.role, screen)) return <NotAvailable screen={screen} role={session.user.role} />;
  return (
    <Suspense fallback={<PageLoader />}>
      <Page />
    </Suspense>
  );
}
