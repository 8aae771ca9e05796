import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SESSION_STORAGE_KEY } from '@/lib/session';
import { errorBody, mockApi } from '@/testing/mock-api';
import { currentLocation, renderApp, signInAs } from '@/testing/render';

describe('a 401 from the API in the running app', () => {
  it('sends the user to sign-in, keeping the page they were on', async () => {
    signInAs('admin');
    mockApi({
      'GET /api/auth/me': { status: 401, body: errorBody('Token no longer valid') },
      'GET /api/outbox': { status: 401, body: errorBody('Token no longer valid') },
    });
    renderApp('/outbox');
    expect(await screen.findByRole('form', { name: 'Sign in' })).toBeInTheDocument();
    expect(currentLocation()).toBe('/sign-in?next=%2Foutbox');
    expect(screen.getByText(/Your session has ended/)).toBeInTheDocument();
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull();
  });

  it('after signing in again, returns to that page', async () => {
    signInAs('admin');
    mockApi({
      'GET /api/auth/me': { status: 401, body: errorBody('Token no longer valid') },
      'GET /api/outbox': { status: 401, body: errorBody('Token no longer valid') },
    });
    const { user } = renderApp('/outbox');
    await screen.findByRole('form', { name: 'Sign in' });

    mockApi({
      'POST /api/auth/login': {
        body: { accessToken: 'fresh', user: { id: 1, email: 'admin@demo.test', name: 'Ilse Brandauer', role: 'admin' } },
      },
      'GET /api/auth/me': { body: { id: 1, email: 'admin@demo.test', name: 'Ilse Brandauer', role: 'admin' } },
      'GET /api/outbox': { body: [] },
    });
    await user.type(screen.getByLabelText('E-mail'), 'admin@demo.test');
    await user.type(screen.getByLabelText('Password'), 'demo-password-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'Outbox' })).toBeInTheDocument();
    expect(currentLocation()).toBe('/outbox');
  });
});
