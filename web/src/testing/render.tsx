import type { ReactElement, ReactNode } from 'react';
import { MantineProvider } from '@mantine/core';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render as testingLibraryRender } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { LoginResponse, Role } from '@shuntwise/contracts';
import { MemoryRouter, useLocation } from 'react-router';
import { AppRoutes } from '@/app/router';
import { setSession } from '@/lib/session';
import { theme } from '@/theme/theme';

export function createTestQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } } });
}

let lastLocation = '';

/** Records where the router is, so tests can check redirects (path + search). */
function LocationProbe() {
  const location = useLocation();
  lastLocation = `${location.pathname}${location.search}`;
  return null;
}

export function currentLocation(): string {
  return lastLocation;
}

interface Options {
  route?: string;
  queryClient?: QueryClient;
}

/** Renders inside the app's providers (theme, query client, router); the signed-in layout adds notifications. */
export function render(ui: ReactNode, { route = '/', queryClient = createTestQueryClient() }: Options = {}) {
  const user = userEvent.setup();
  const result = testingLibraryRender(ui as ReactElement, {
    wrapper: ({ children }: { children: ReactNode }) => (
      <MantineProvider theme={theme}>
        <QueryClientProvider client={queryClient}>
          <MemoryRouter initialEntries={[route]}>
            <LocationProbe />
            {children}
          </MemoryRouter>
        </QueryClientProvider>
      </MantineProvider>
    ),
  });
  return { ...result, user, queryClient };
}

/** The whole app (every route) at a path. */
export function renderApp(route: string, options: Omit<Options, 'route'> = {}) {
  return render(<AppRoutes />, { ...options, route });
}

export const DEMO_USERS: Record<Role, LoginResponse['user']> = {
  admin: { id: 1, email: 'admin@demo.test', name: 'Ilse Brandauer', role: 'admin' },
  engineer: { id: 2, email: 'engineer@demo.test', name: 'Tomas Verhoef', role: 'engineer' },
  designer: { id: 4, email: 'designer@demo.test', name: 'Nadia Okafor', role: 'designer' },
  buyer: { id: 5, email: 'buyer@demo.test', name: 'Rune Salcedo', role: 'buyer' },
};

/** Signs a demo user in without the API (the token is a placeholder). */
export function signInAs(role: Role): LoginResponse {
  const session = { accessToken: `test-token-${role}`, user: DEMO_USERS[role] };
  setSession(session);
  return session;
}
