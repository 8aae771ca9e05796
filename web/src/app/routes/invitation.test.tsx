import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { getSession } from '@/lib/session';
import { errorBody, mockApi } from '@/testing/mock-api';
import { currentLocation, renderApp } from '@/testing/render';

const TOKEN = 'tok_0123456789abcdefghijkl';
const preview = { email: 'oskar@demo.test', name: 'Oskar Benitez', role: 'designer', expiresAt: '2099-01-01T00:00:00.000Z' };
const signedIn = { accessToken: 'fresh-token', user: { id: 12, email: 'oskar@demo.test', name: 'Oskar B.', role: 'designer' } };

describe('invitation page', () => {
  it('shows who is invited, sets name and password, and signs in', async () => {
    const api = mockApi({
      [`GET /api/auth/invitations/${TOKEN}`]: { body: preview },
      'POST /api/auth/invitations/accept': { body: signedIn },
      'GET /api/auth/me': { body: signedIn.user },
    });
    const { user } = renderApp(`/invitation/${TOKEN}`);
    expect(await screen.findByText('oskar@demo.test')).toBeInTheDocument();
    expect(screen.getByText('Designer')).toBeInTheDocument();
    const name = screen.getByLabelText('Your name');
    expect(name).toHaveValue('Oskar Benitez');

    await user.clear(name);
    await user.type(name, 'Oskar B.');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    expect(screen.getByText('Use at least 10 characters')).toBeInTheDocument();

    await user.clear(screen.getByLabelText('Password'));
    await user.type(screen.getByLabelText('Password'), 'a-long-enough-secret');
    await user.type(screen.getByLabelText('Password again'), 'a-long-enough-secreT');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    expect(screen.getByText('The two passwords differ')).toBeInTheDocument();
    expect(api.callsTo('POST', '/api/auth/invitations/accept')).toHaveLength(0);

    await user.clear(screen.getByLabelText('Password again'));
    await user.type(screen.getByLabelText('Password again'), 'a-long-enough-secret');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    await waitFor(() => expect(currentLocation()).toBe('/find'));
    expect(api.callsTo('POST', '/api/auth/invitations/accept')[0].body).toEqual({
      token: TOKEN,
      name: 'Oskar B.',
      password: 'a-long-enough-secret',
    });
    expect(api.callsTo('POST', '/api/auth/invitations/accept')[0].headers.Authorization).toBeUndefined();
    expect(getSession()?.accessToken).toBe('fresh-token');
  });

  it('explains an unknown, used or expired link', async () => {
    mockApi({ [`GET /api/auth/invitations/${TOKEN}`]: { status: 404, body: errorBody('Invitation not found') } });
    renderApp(`/invitation/${TOKEN}`);
    expect(await screen.findByRole('alert')).toHaveTextContent('unknown, already used or expired');
    expect(screen.queryByLabelText('Password')).not.toBeInTheDocument();
  });
});
