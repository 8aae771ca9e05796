import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { BoardPage, QualificationRequest } from '@shuntwise/contracts';
import { HOUSE_PARTS, request, requestPage } from '@/features/qualification-requests/testing/fixtures';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, currentLocation, renderApp, signInAs } from '@/testing/render';

const EMPTY_BOARD: BoardPage = {
  items: [],
  total: 0,
  pageIndex: 0,
  pageSize: 25,
  counts: {
    draft: 0,
    'in-review': 0,
    approved: 0,
    cleared: 0,
    'cleared-with-conditions': 0,
    'cleared-with-waiver': 0,
    rejected: 0,
    withdrawn: 0,
    revoked: 0,
    'waiver-lapsed': 0,
    none: 0,
  },
  engineers: [],
};

// Invented requests: one naming its house part, one leaving the choice to the engineer.
const NAMED = request(21, { housePart: { id: 8, partNumber: 'OHI-ZD-1056', description: 'Regulator diode 5.6 V, loop-driver reference' } });
const UNNAMED = request(22, {
  vendorPart: { id: 61, manufacturer: 'Nettlecombe Devices', mpn: 'NMZ-05V1', package: 'SOD-123' },
  neededBy: null,
  note: 'Any 5.1 V position; cheaper than the approved part',
});

function api(role: 'engineer' | 'admin', open: QualificationRequest[] = [NAMED, UNNAMED], extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'GET /api/auth/me': { body: DEMO_USERS[role] },
    'GET /api/qualification-views/board': { body: EMPTY_BOARD },
    'GET /api/qualification-requests': { body: requestPage(open) },
    'GET /api/house-parts': { body: HOUSE_PARTS },
    ...extra,
  });
}

describe('Board: requests for a qualification', { timeout: 20_000 }, () => {
  it('lists the open requests above the table with who asked, by when and what for', async () => {
    signInAs('engineer');
    const mock = api('engineer');
    renderApp('/board');
    const panel = await screen.findByRole('region', { name: 'Asked for qualification' });
    expect(await within(panel).findByLabelText('2 waiting')).toBeInTheDocument();
    const named = within(panel).getByRole('row', { name: 'Request #21: NMZ-05V6' });
    expect(named).toHaveTextContent('Nettlecombe Devices');
    expect(named).toHaveTextContent('OHI-ZD-1056');
    expect(named).toHaveTextContent('Nadia Okafor');
    expect(named).toHaveTextContent('31 Mar 2027');
    expect(named).toHaveTextContent('Reference for the loop driver');
    expect(within(named).getByRole('link', { name: 'NMZ-05V6' })).toHaveAttribute('href', '/vendor-parts/60');
    expect(within(panel).getByRole('row', { name: 'Request #22: NMZ-05V1' })).toHaveTextContent('not named');
    expect(mock.calls.find((c) => c.path === '/api/qualification-requests')).toBeDefined();
    const url = mock.fetch.mock.calls.map(([u]) => String(u)).find((u) => u.startsWith('/api/qualification-requests'));
    expect(url).toBe('/api/qualification-requests?status=open&pageIndex=0&pageSize=100');
  });

  it('opens a case from a request that names no house part: the house part is required, parts without a spec cannot be chosen; then goes to the case', async () => {
    signInAs('engineer');
    const mock = api('engineer', [NAMED, UNNAMED], {
      'POST /api/qualification-requests/:id/open-case': (call, params) => ({
        status: 201,
        body: { ...UNNAMED, id: Number(params.id), state: 'taken-up', case: { id: 57, revision: 1, state: 'draft', housePart: HOUSE_PARTS.items[0] } },
      }),
    });
    const { user } = renderApp('/board');
    await user.click(await screen.findByRole('button', { name: 'Open a case from request #22' }));
    const dialog = await screen.findByRole('dialog', { name: 'Open a case for NMZ-05V1' });
    expect(dialog).toHaveTextContent('Any 5.1 V position; cheaper than the approved part');
    await user.click(within(dialog).getByRole('button', { name: 'Open the case' }));
    expect(await within(dialog).findByText('Choose the house part to qualify it for')).toBeInTheDocument();
    expect(mock.callsTo('POST', '/api/qualification-requests/22/open-case')).toHaveLength(0);

    await user.click(within(dialog).getByRole('textbox', { name: /For house part/ }));
    expect(await screen.findByRole('option', { name: /OHI-ZD-1099/ })).toHaveAttribute('data-combobox-disabled', 'true');
    await user.click(screen.getByRole('option', { name: /OHI-ZD-1051/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Open the case' }));
    await waitFor(() => expect(mock.callsTo('POST', '/api/qualification-requests/22/open-case')).toHaveLength(1));
    expect(mock.callsTo('POST', '/api/qualification-requests/22/open-case')[0].body).toEqual({ housePartId: 7 });
    await waitFor(() => expect(currentLocation()).toBe('/qualifications/57'));
  });

  it('a request that names its house part opens for it without asking, and a refusal is said plainly', async () => {
    signInAs('engineer');
    const mock = api('engineer', [NAMED], {
      'POST /api/qualification-requests/:id/open-case': {
        status: 409,
        body: errorBody('Case #12 (Nettlecombe Devices NMZ-05V6 for OHI-ZD-1056) is still draft: continue that one'),
      },
    });
    const { user } = renderApp('/board');
    await user.click(await screen.findByRole('button', { name: 'Open a case from request #21' }));
    const dialog = await screen.findByRole('dialog');
    expect(dialog).toHaveTextContent('For house part OHI-ZD-1056');
    expect(within(dialog).queryByRole('textbox', { name: /For house part/ })).not.toBeInTheDocument();
    await user.type(within(dialog).getByRole('textbox', { name: 'Notes' }), 'Compare with the approved part first');
    await user.click(within(dialog).getByRole('button', { name: 'Open the case' }));
    const alert = await within(dialog).findByRole('alert');
    expect(alert).toHaveTextContent('The request was not taken up');
    expect(alert).toHaveTextContent('Case #12');
    expect(mock.callsTo('POST', '/api/qualification-requests/21/open-case')[0].body).toEqual({ summary: 'Compare with the approved part first' });
    expect(currentLocation()).toBe('/board');
  });

  it('declines with a reply, which is required', async () => {
    signInAs('engineer');
    const mock = api('engineer', [NAMED], {
      'POST /api/qualification-requests/:id/decline': (call) => ({ body: { ...NAMED, state: 'declined', reply: (call.body as { reply: string }).reply } }),
    });
    const { user } = renderApp('/board');
    await user.click(await screen.findByRole('button', { name: 'Decline request #21' }));
    const dialog = await screen.findByRole('dialog', { name: 'Decline request #21' });
    await user.click(within(dialog).getByRole('button', { name: 'Decline the request' }));
    expect(await within(dialog).findByText('Write the reply to the requester: why not, or what to use instead')).toBeInTheDocument();
    expect(mock.callsTo('POST', '/api/qualification-requests/21/decline')).toHaveLength(0);
    await user.type(within(dialog).getByRole('textbox', { name: /Reply to Nadia Okafor/ }), 'End of life announced; use BRZ05-5V6, already approved.');
    await user.click(within(dialog).getByRole('button', { name: 'Decline the request' }));
    await waitFor(() => expect(mock.callsTo('POST', '/api/qualification-requests/21/decline')).toHaveLength(1));
    expect(mock.callsTo('POST', '/api/qualification-requests/21/decline')[0].body).toEqual({
      reply: 'End of life announced; use BRZ05-5V6, already approved.',
    });
    expect(await screen.findByText('Request #21 declined')).toBeInTheDocument();
  });

  it('shows admins the requests without actions', async () => {
    signInAs('admin');
    api('admin');
    renderApp('/board');
    const panel = await screen.findByRole('region', { name: 'Asked for qualification' });
    await within(panel).findByRole('row', { name: 'Request #21: NMZ-05V6' });
    expect(within(panel).queryByRole('button', { name: /Open a case|Decline/ })).not.toBeInTheDocument();
  });

  it('says when no request is waiting', async () => {
    signInAs('engineer');
    api('engineer', []);
    renderApp('/board');
    const panel = await screen.findByRole('region', { name: 'Asked for qualification' });
    expect(await within(panel).findByText('No request is waiting for an engineer.')).toBeInTheDocument();
    expect(within(panel).queryByRole('table')).not.toBeInTheDocument();
  });
});
