import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '@shuntwise/contracts';
import { getSession } from '@/lib/session';
import { mockApi } from '@/testing/mock-api';
import { currentLocation, DEMO_USERS, renderApp, signInAs } from '@/testing/render';
import { homePathFor, landingPathFor } from './navigation';

// The role map of DESIGN.md's roles table and the web-shell brief, written out here by
// hand so that a change to navigation.ts has to be made twice on purpose.
const EXPECTED: Record<Role, string[]> = {
  admin: ['Board', 'House parts', 'Vendor parts', 'Qualifications', 'Find parts', 'Sources', 'Outbox', 'Users'],
  engineer: ['Board', 'House parts', 'Vendor parts', 'Qualifications', 'Find parts', 'Sources'],
  designer: ['Find parts'],
  buyer: ['Sources'],
};
const HOME: Record<Role, string> = { admin: '/board', engineer: '/board', designer: '/find', buyer: '/sources' };

function apiFor(role: Role) {
  return mockApi({
    'GET /api/auth/me': { body: DEMO_USERS[role] },
    'GET /api/users': { body: [] },
    'GET /api/users/invitations': { body: [] },
    'GET /api/outbox': { body: [] },
    'POST /api/auth/logout': { status: 204 },
  });
}

describe('navigation per role', () => {
  it.each(Object.keys(EXPECTED) as Role[])('%s sees only its screens and lands on the first', async (role) => {
    signInAs(role);
    apiFor(role);
    renderApp('/');
    if (EXPECTED[role].length > 1) {
      const nav = await screen.findByRole('navigation', { name: 'Main navigation' });
      const labels = within(nav)
        .getAllByRole('link')
        .map((a) => a.textContent);
      expect(labels).toEqual(EXPECTED[role]);
    } else {
      // One screen: no sidebar to choose from; the account sits in the header.
      const account = await screen.findByRole('group', { name: 'Account' });
      expect(account).toHaveTextContent(DEMO_USERS[role].name);
      expect(screen.queryByRole('navigation', { name: 'Main navigation' })).toBeNull();
    }
    // a keyboard user can jump past the header and navigation
    expect(screen.getByRole('link', { name: 'Skip to main content' })).toHaveAttribute('href', '#main-content');
    expect(document.getElementById('main-content')?.tagName).toBe('MAIN');
    await waitFor(() => expect(currentLocation()).toBe(HOME[role]));
    expect(homePathFor(role)).toBe(HOME[role]);
  });

  it('a screen the role may not use says so instead of showing it', async () => {
    signInAs('buyer');
    const api = apiFor('buyer');
    renderApp('/users');
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Not available for your role');
    expect(alert).toHaveTextContent('You are signed in as Buyer');
    expect(api.callsTo('GET', '/api/users')).toHaveLength(0);
  });

  it('Find parts, the last screen built, opens for engineers too', async () => {
    signInAs('engineer');
    apiFor('engineer');
    renderApp('/find');
    expect(await screen.findByRole('heading', { name: 'Find parts' })).toBeInTheDocument();
  });

  it('without a session every screen leads to sign-in, remembering the page', async () => {
    apiFor('admin');
    renderApp('/qualifications');
    await screen.findByRole('form', { name: 'Sign in' });
    expect(currentLocation()).toBe('/sign-in?next=%2Fqualifications');
  });

  it('signing out calls the API, forgets the session and shows sign-in without a return page', async () => {
    signInAs('engineer');
    const api = apiFor('engineer');
    const { user } = renderApp('/sources');
    await user.click(await screen.findByRole('button', { name: 'Sign out' }));
    await screen.findByRole('form', { name: 'Sign in' });
    expect(api.callsTo('POST', '/api/auth/logout')).toHaveLength(1);
    expect(api.callsTo('POST', '/api/auth/logout')[0].headers.Authorization).toBe('Bearer test-token-engineer');
    expect(getSession()).toBeNull();
    expect(localStorage.getItem('shuntwise.session')).toBeNull();
    expect(currentLocation()).toBe('/sign-in');
    expect(screen.queryByText(/Your session has ended/)).not.toBeInTheDocument();
  });

  it('takes the role the server reports over the stored one', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: { ...DEMO_USERS.engineer, role: 'buyer' } } });
    renderApp('/sources');
    const account = await screen.findByRole('group', { name: 'Account' });
    await within(account).findByText('Buyer');
    expect(screen.queryByRole('navigation', { name: 'Main navigation' })).toBeNull();
  });
});

describe('landingPathFor', () => {
  it('returns to an allowed page with its query', () => {
    expect(landingPathFor('admin', '/users?tab=x')).toBe('/users?tab=x');
  });
  it('ignores pages the role may not use, unknown pages and other origins', () => {
    expect(landingPathFor('buyer', '/users')).toBe('/sources');
    expect(landingPathFor('admin', '/nowhere')).toBe('/board');
    expect(landingPathFor('admin', '//elsewhere.test/users')).toBe('/board');
    expect(landingPathFor('admin', 'https://elsewhere.test/users')).toBe('/board');
    expect(landingPathFor('designer', null)).toBe('/find');
  });
});
