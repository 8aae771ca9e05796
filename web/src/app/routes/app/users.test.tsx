import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { Invitation, User } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';

const users: User[] = [
  {
    id: 1,
    email: 'admin@demo.test',
    name: 'Ilse Brandauer',
    role: 'admin',
    active: true,
    createdAt: '2026-11-01T09:00:00.000Z',
    lastLoginAt: '2026-12-01T08:00:00.000Z',
  },
  { id: 2, email: 'engineer@demo.test', name: 'Tomas Verhoef', role: 'engineer', active: true, createdAt: '2026-11-01T09:00:00.000Z', lastLoginAt: null },
  { id: 6, email: 'pia@demo.test', name: 'Pia Lindqvist', role: 'buyer', active: false, createdAt: '2026-11-03T09:00:00.000Z', lastLoginAt: null },
];

const invitations: Invitation[] = [
  {
    id: 11,
    email: 'oskar@demo.test',
    name: 'Oskar Benitez',
    role: 'designer',
    expiresAt: '2099-01-01T00:00:00.000Z',
    acceptedAt: null,
    revokedAt: null,
    createdAt: '2026-11-30T10:00:00.000Z',
  },
  {
    id: 10,
    email: 'old@demo.test',
    name: 'Mara Old',
    role: 'buyer',
    expiresAt: '2026-01-01T00:00:00.000Z',
    acceptedAt: null,
    revokedAt: null,
    createdAt: '2025-12-25T10:00:00.000Z',
  },
  {
    id: 9,
    email: 'done@demo.test',
    name: 'Done Already',
    role: 'engineer',
    expiresAt: '2099-01-01T00:00:00.000Z',
    acceptedAt: '2026-11-02T10:00:00.000Z',
    revokedAt: null,
    createdAt: '2026-11-01T10:00:00.000Z',
  },
];

function usersApi(overrides: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'GET /api/auth/me': { body: DEMO_USERS.admin },
    'GET /api/users': { body: users },
    'GET /api/users/invitations': { body: invitations },
    'PATCH /api/users/:id': (call, params) => ({
      body: { ...users.find((u) => u.id === Number(params.id))!, ...(call.body as object) },
    }),
    'POST /api/users/invitations': (call) => ({
      status: 201,
      body: {
        id: 12,
        ...(call.body as object),
        expiresAt: '2099-01-01T00:00:00.000Z',
        acceptedAt: null,
        revokedAt: null,
        createdAt: '2026-12-01T10:00:00.000Z',
      },
    }),
    'POST /api/users/invitations/:id/resend': (_call, params) => ({
      body: { ...invitations.find((i) => i.id === Number(params.id))!, expiresAt: '2099-02-01T00:00:00.000Z' },
    }),
    'POST /api/users/invitations/:id/revoke': (_call, params) => ({
      body: { ...invitations.find((i) => i.id === Number(params.id))!, revokedAt: '2026-12-04T08:00:00.000Z' },
    }),
    ...overrides,
  });
}

async function openUsers() {
  signInAs('admin');
  const result = renderApp('/users');
  // The first render fetches the data-grid chunk: allow it more than the default second.
  await screen.findByRole('cell', { name: 'Tomas Verhoef' }, { timeout: 5000 });
  return result;
}

function rowOf(name: string): HTMLElement {
  return screen.getByRole('cell', { name }).closest('tr')!;
}

describe('Users screen', () => {
  it('lists the users with role and status, and only the invitations still waiting', async () => {
    usersApi();
    await openUsers();
    expect(within(rowOf('Pia Lindqvist')).getByText('Deactivated')).toBeInTheDocument();
    expect(within(rowOf('Tomas Verhoef')).getByText('Active')).toBeInTheDocument();
    const pending = screen.getByRole('table', { name: 'Pending invitations' });
    expect(within(pending).getByText('oskar@demo.test')).toBeInTheDocument();
    expect(within(pending).getByText(/Expired/)).toBeInTheDocument();
    expect(within(pending).queryByText('done@demo.test')).not.toBeInTheDocument();
  });

  it('changes a role with PATCH and confirms it', async () => {
    const api = usersApi();
    const { user } = await openUsers();
    await user.click(screen.getByRole('textbox', { name: 'Role of Tomas Verhoef' }));
    await user.click(await screen.findByRole('option', { name: 'Designer' }));
    await waitFor(() => expect(api.callsTo('PATCH', '/api/users/2')).toHaveLength(1));
    expect(api.callsTo('PATCH', '/api/users/2')[0].body).toEqual({ role: 'designer' });
    expect(await screen.findByText('Role changed')).toBeInTheDocument();
  });

  it('deactivates only after confirmation', async () => {
    const api = usersApi();
    const { user } = await openUsers();
    await user.click(within(rowOf('Tomas Verhoef')).getByRole('button', { name: 'Deactivate' }));
    const dialog = await screen.findByRole('dialog', { name: 'Deactivate this account?' });
    expect(api.callsTo('PATCH', '/api/users/2')).toHaveLength(0);
    await user.click(within(dialog).getByRole('button', { name: 'Deactivate' }));
    await waitFor(() => expect(api.callsTo('PATCH', '/api/users/2')).toHaveLength(1));
    expect(api.callsTo('PATCH', '/api/users/2')[0].body).toEqual({ active: false });
    expect(await screen.findByText(/is signed out everywhere/)).toBeInTheDocument();
  });

  it('reactivates a deactivated account', async () => {
    const api = usersApi();
    const { user } = await openUsers();
    await user.click(within(rowOf('Pia Lindqvist')).getByRole('button', { name: 'Reactivate' }));
    await waitFor(() => expect(api.callsTo('PATCH', '/api/users/6')).toHaveLength(1));
    expect(api.callsTo('PATCH', '/api/users/6')[0].body).toEqual({ active: true });
    expect(await screen.findByText('Pia Lindqvist can sign in again.')).toBeInTheDocument();
  });

  it('offers no way to deactivate or demote oneself', async () => {
    usersApi();
    await openUsers();
    const own = rowOf('Ilse Brandauer');
    expect(within(own).queryByRole('button', { name: 'Deactivate' })).not.toBeInTheDocument();
    expect(within(own).getByRole('textbox', { name: 'Role of Ilse Brandauer' })).toBeDisabled();
  });

  it('shows the server’s refusal as a notification', async () => {
    usersApi({ 'PATCH /api/users/:id': { status: 409, body: errorBody('The last administrator cannot be deactivated') } });
    const { user } = await openUsers();
    await user.click(within(rowOf('Tomas Verhoef')).getByRole('button', { name: 'Deactivate' }));
    const dialog = await screen.findByRole('dialog', { name: 'Deactivate this account?' });
    await user.click(within(dialog).getByRole('button', { name: 'Deactivate' }));
    expect(await screen.findByText('Not deactivated')).toBeInTheDocument();
    expect(screen.getByText(/The last administrator cannot be deactivated \(ref\. c0ffee00-test\)/)).toBeInTheDocument();
  });

  it('invites by e-mail with name and role, validated by the contracts schema', async () => {
    const api = usersApi();
    const { user } = await openUsers();
    await user.click(screen.getByRole('button', { name: 'Invite someone' }));
    const dialog = await screen.findByRole('dialog', { name: 'Invite someone' });
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));
    expect(within(dialog).getByText('Required')).toBeInTheDocument();
    expect(within(dialog).getByText('Enter a valid e-mail address')).toBeInTheDocument();
    expect(api.callsTo('POST', '/api/users/invitations')).toHaveLength(0);

    await user.type(within(dialog).getByLabelText('Name'), 'Oda Kessler');
    await user.type(within(dialog).getByLabelText('E-mail'), 'Oda.Kessler@Demo.test');
    await user.click(within(dialog).getByRole('textbox', { name: 'Role' }));
    await user.click(await screen.findByRole('option', { name: 'Buyer' }));
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));
    await waitFor(() => expect(api.callsTo('POST', '/api/users/invitations')).toHaveLength(1));
    expect(api.callsTo('POST', '/api/users/invitations')[0].body).toEqual({
      name: 'Oda Kessler',
      email: 'oda.kessler@demo.test',
      role: 'buyer',
    });
    expect(await screen.findByText('Invitation sent')).toBeInTheDocument();
    // The pending list is read again after the invitation.
    await waitFor(() => expect(api.callsTo('GET', '/api/users/invitations')).toHaveLength(2));
  });

  it('puts a 409 (the person already has an account) beside the e-mail field', async () => {
    usersApi({ 'POST /api/users/invitations': { status: 409, body: errorBody('A user with this e-mail exists') } });
    const { user } = await openUsers();
    await user.click(screen.getByRole('button', { name: 'Invite someone' }));
    const dialog = await screen.findByRole('dialog', { name: 'Invite someone' });
    await user.type(within(dialog).getByLabelText('Name'), 'Tomas Again');
    await user.type(within(dialog).getByLabelText('E-mail'), 'engineer@demo.test');
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));
    expect(await within(dialog).findByText('A user with this e-mail exists')).toBeInTheDocument();
    expect(within(dialog).getByLabelText('E-mail')).toHaveValue('engineer@demo.test');
    expect(await screen.findByText('Invitation not sent')).toBeInTheDocument();
  });

  it('sends an invitation again, and revokes one only after confirmation', { timeout: 60_000 }, async () => {
    const api = usersApi();
    const { user } = await openUsers();
    const pending = screen.getByRole('table', { name: 'Pending invitations' });
    await user.click(within(pending).getByRole('button', { name: 'Send the invitation of oskar@demo.test again' }));
    await waitFor(() => expect(api.callsTo('POST', '/api/users/invitations/11/resend')).toHaveLength(1));
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    await user.click(within(pending).getByRole('button', { name: 'Revoke the invitation of old@demo.test' }));
    expect(confirm).toHaveBeenCalledWith(expect.stringMatching(/Its link stops working/));
    expect(api.callsTo('POST', '/api/users/invitations/10/revoke')).toHaveLength(0);
    confirm.mockReturnValue(true);
    await user.click(within(pending).getByRole('button', { name: 'Revoke the invitation of old@demo.test' }));
    await waitFor(() => expect(api.callsTo('POST', '/api/users/invitations/10/revoke')).toHaveLength(1));
    confirm.mockRestore();
  });
});
