import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { getSession } from '@/lib/session';
import { errorBody, mockApi } from '@/testing/mock-api';
import { currentLocation, renderApp } from '@/testing/render';

const designer = { id: 4, email: 'designer@demo.test', name: 'Nadia Okafor', role: 'designer' as const };

function signInMocks(status = 200) {
  return mockApi({
    'POST /api/auth/login': status === 200 ? { body: { accessToken: 'tok-designer', user: designer } } : { status, body: errorBody('refused') },
    'GET /api/auth/me': { body: designer },
  });
}

describe('sign-in form', () => {
  it('checks the fields with the contracts schema before calling the API', async () => {
    const api = signInMocks();
    const { user } = renderApp('/sign-in');
    await user.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(screen.getByText('Enter a valid e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(api.calls).toHaveLength(0);
  });

  it('refuses an e-mail address without a domain', async () => {
    const api = signInMocks();
    const { user } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), 'nadia');
    await user.type(screen.getByLabelText('Password'), 'something-long');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(screen.getByText('Enter a valid e-mail address')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(api.calls).toHaveLength(0);
  });

  it('says plainly when the credentials do not match, and keeps what was typed', async () => {
    signInMocks(401);
    const { user } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), 'designer@demo.test');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('That e-mail and password do not match an active account.');
    expect(screen.getByLabelText('E-mail')).toHaveValue('designer@demo.test');
    expect(getSession()).toBeNull();
  });

  it('explains the rate limit', async () => {
    signInMocks(429);
    const { user } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), 'designer@demo.test');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(/Too many sign-in attempts/);
  });

  it('sends the e-mail address in lower case, stores the session and lands on the role’s first screen', async () => {
    const api = signInMocks();
    const { user } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), ' Designer@Demo.test ');
    await user.type(screen.getByLabelText('Password'), 'demo-password-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'Find parts' })).toBeInTheDocument();
    expect(currentLocation()).toBe('/find');
    expect(api.callsTo('POST', '/api/auth/login')[0].body).toEqual({ email: 'designer@demo.test', password: 'demo-password-1' });
    expect(getSession()?.accessToken).toBe('tok-designer');
    expect(JSON.parse(localStorage.getItem('shuntwise.session')!).user.email).toBe('designer@demo.test');
  });

  it('does not follow `next` to a screen the role may not use', async () => {
    signInMocks();
    const { user } = renderApp('/sign-in?next=%2Fusers');
    await user.type(await screen.findByLabelText('E-mail'), 'designer@demo.test');
    await user.type(screen.getByLabelText('Password'), 'demo-password-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    await screen.findByRole('heading', { name: 'Find parts' });
    expect(currentLocation()).toBe('/find');
  });
});
