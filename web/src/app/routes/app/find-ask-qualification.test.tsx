import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CreateQualificationRequestRequest, QualificationRequest } from '@shuntwise/contracts';
import { FACETS, page, searchItem } from '@/features/find-parts/testing/fixtures';
import { HOUSE_PARTS, request, requestPage } from '@/features/qualification-requests/testing/fixtures';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';

// Invented parts: one usable for OHI-ZD-1051, one not cleared anywhere.
const CLEARED = searchItem(5, 'BRZ05-5V1');
const NOT_CLEARED = searchItem(60, 'NMZ-05V6', {
  vendorPart: { id: 60, manufacturer: 'Nettlecombe Devices', mpn: 'NMZ-05V6', package: 'SOD-123', lifecycleNote: null },
  cleared: false,
  clearances: [],
});

function api(mine: QualificationRequest[] = [], onCreate?: (body: CreateQualificationRequestRequest) => { status?: number; body: unknown }) {
  const stored = [...mine];
  return mockApi({
    'GET /api/auth/me': { body: DEMO_USERS.designer },
    'GET /api/search/facets': { body: FACETS },
    'GET /api/search': { body: page([CLEARED, NOT_CLEARED]) },
    'GET /api/qualification-requests': () => ({ body: requestPage(stored) }),
    'GET /api/house-parts': { body: HOUSE_PARTS },
    'POST /api/qualification-requests': (call) => {
      const reply = onCreate?.(call.body as CreateQualificationRequestRequest) ?? {
        status: 201,
        body: request(31, { ...(call.body as object), housePart: null }),
      };
      if ((reply.status ?? 201) === 201) stored.unshift(reply.body as QualificationRequest);
      return reply;
    },
  });
}

describe('Find parts: asking for a qualification', { timeout: 20_000 }, () => {
  it('offers it on a part not cleared; the note is required before anything is sent; the request goes out with the house part and date', async () => {
    signInAs('designer');
    const mock = api();
    const { user } = renderApp('/find');
    const row = await screen.findByRole('row', { name: 'NMZ-05V6' });
    await user.click(within(row).getByRole('button', { name: 'Ask for qualification of NMZ-05V6' }));
    const dialog = await screen.findByRole('dialog', { name: 'Ask for qualification of NMZ-05V6' });
    await user.click(within(dialog).getByRole('button', { name: 'Send the request' }));
    expect(await within(dialog).findByText('Say what it is for: the design, why this part, by when')).toBeInTheDocument();
    expect(mock.callsTo('POST', '/api/qualification-requests')).toHaveLength(0);

    await user.type(within(dialog).getByRole('textbox', { name: /What it is for/ }), 'Loop driver reference on the new transmitter board');
    await user.click(within(dialog).getByRole('textbox', { name: 'For house part' }));
    await user.click(await screen.findByRole('option', { name: /OHI-ZD-1056/ }));
    fireEvent.change(within(dialog).getByLabelText(/Needed by/), { target: { value: '2099-03-31' } });
    await user.click(within(dialog).getByRole('button', { name: 'Send the request' }));
    await waitFor(() => expect(mock.callsTo('POST', '/api/qualification-requests')).toHaveLength(1));
    expect(mock.callsTo('POST', '/api/qualification-requests')[0].body).toEqual({
      vendorPartId: 60,
      housePartId: 8,
      note: 'Loop driver reference on the new transmitter board',
      neededBy: '2099-03-31',
    });
    expect(await screen.findByText('Request #31 sent')).toBeInTheDocument();
    // the row now says it is asked for, and the panel lists the request
    expect(await within(row).findByTestId('asked-NMZ-05V6')).toHaveTextContent('you asked · waiting');
    expect(within(row).queryByRole('button', { name: 'Ask for qualification of NMZ-05V6' })).not.toBeInTheDocument();
    const panel = await screen.findByRole('region', { name: 'My qualification requests' });
    expect(within(panel).getByRole('row', { name: 'Request #31: NMZ-05V6' })).toHaveTextContent('Waiting for an engineer');
  });

  it('on a cleared part, asks for another house part: those it is usable for cannot be chosen', async () => {
    signInAs('designer');
    api();
    const { user } = renderApp('/find');
    const row = await screen.findByRole('row', { name: 'BRZ05-5V1' });
    await user.click(within(row).getByRole('button', { name: 'Ask for qualification of BRZ05-5V1 for another house part' }));
    const dialog = await screen.findByRole('dialog', { name: 'Ask for qualification of BRZ05-5V1' });
    expect(dialog).toHaveTextContent('Already usable for OHI-ZD-1051');
    await user.click(within(dialog).getByRole('textbox', { name: 'For house part' }));
    const usable = await screen.findByRole('option', { name: /OHI-ZD-1051/ });
    expect(usable).toHaveAttribute('data-combobox-disabled', 'true');
    expect(usable).toHaveTextContent('already usable');
    expect(screen.getByRole('option', { name: /OHI-ZD-1056/ })).not.toHaveAttribute('data-combobox-disabled');
  });

  it('on a part whose qualification is under way, asks only for another house part', async () => {
    signInAs('designer');
    mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.designer },
      'GET /api/search/facets': { body: FACETS },
      'GET /api/search': { body: page([{ ...NOT_CLEARED, qualificationOpen: true }]) },
      'GET /api/qualification-requests': { body: requestPage([]) },
      'GET /api/house-parts': { body: HOUSE_PARTS },
    });
    const { user } = renderApp('/find');
    const row = await screen.findByRole('row', { name: 'NMZ-05V6' });
    expect(row).toHaveTextContent('qualification under way');
    expect(within(row).queryByRole('button', { name: 'Ask for qualification of NMZ-05V6' })).not.toBeInTheDocument();
    await user.click(within(row).getByRole('button', { name: 'Ask for qualification of NMZ-05V6 for another house part' }));
    expect(await screen.findByRole('dialog')).toHaveTextContent('A qualification of it is under way already; ask only if you need it for another house part.');
  });

  it('says plainly when the server refuses (a duplicate), and keeps what was typed; a past date is named on its field', async () => {
    signInAs('designer');
    const mock = api([], (body) =>
      body.neededBy === '2020-01-15'
        ? { status: 400, body: errorBody('neededBy (2020-01-15) is in the past', [{ path: 'neededBy', message: 'in the past' }]) }
        : {
            status: 409,
            body: errorBody(
              'You already asked for Nettlecombe Devices NMZ-05V6 (no house part named) in request #30 on 2026-11-28; it is waiting for an engineer',
            ),
          },
    );
    const { user } = renderApp('/find');
    await user.click(await screen.findByRole('button', { name: 'Ask for qualification of NMZ-05V6' }));
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByRole('textbox', { name: /What it is for/ }), 'Second channel');
    fireEvent.change(within(dialog).getByLabelText(/Needed by/), { target: { value: '2020-01-15' } });
    await user.click(within(dialog).getByRole('button', { name: 'Send the request' }));
    expect(await within(dialog).findByText('in the past')).toBeInTheDocument();
    fireEvent.change(within(dialog).getByLabelText(/Needed by/), { target: { value: '' } });
    await user.click(within(dialog).getByRole('button', { name: 'Send the request' }));
    const alert = await within(dialog).findByRole('alert');
    expect(alert).toHaveTextContent('The request was not sent');
    expect(alert).toHaveTextContent(/You already asked for Nettlecombe Devices NMZ-05V6 .* request #30/);
    expect(within(dialog).getByRole('textbox', { name: /What it is for/ })).toHaveValue('Second channel');
    expect(mock.callsTo('POST', '/api/qualification-requests')).toHaveLength(2);
  });

  it('shows the designer where each request stands: waiting, taken up with its case, declined with the reply', async () => {
    signInAs('designer');
    api([
      request(33, { vendorPart: { id: 61, manufacturer: 'Nettlecombe Devices', mpn: 'NMZ-06V8', package: 'SOD-123' } }),
      request(32, {
        state: 'taken-up',
        closedBy: { id: 2, name: 'Tomas Verhoef' },
        closedAt: '2026-11-30T10:00:00.000Z',
        case: { id: 14, revision: 1, state: 'in-review', housePart: { id: 8, partNumber: 'OHI-ZD-1056', description: 'loop-driver reference' } },
      }),
      request(30, {
        vendorPart: { id: 62, manufacturer: 'Nettlecombe Devices', mpn: 'NMZ-24', package: 'SOD-123' },
        state: 'declined',
        closedBy: { id: 2, name: 'Tomas Verhoef' },
        closedAt: '2026-11-29T10:00:00.000Z',
        reply: 'End of life announced; use BRZ05-24.',
      }),
    ]);
    renderApp('/find');
    const panel = await screen.findByRole('region', { name: 'My qualification requests' });
    expect(within(panel).getByTestId('my-requests-summary')).toHaveTextContent('1 waiting · 1 taken up · 1 declined');
    const taken = within(panel).getByRole('row', { name: 'Request #32: NMZ-05V6' });
    expect(taken).toHaveTextContent('Taken up');
    expect(taken).toHaveTextContent('Case #14');
    expect(taken).toHaveTextContent('In review');
    expect(taken).toHaveTextContent('for OHI-ZD-1056 · opened by Tomas Verhoef');
    // designers cannot open the case screens: the case is named, not linked
    expect(within(taken).queryByRole('link')).toBeNull();
    expect(within(panel).getByRole('row', { name: 'Request #30: NMZ-24' })).toHaveTextContent('Tomas Verhoef: End of life announced; use BRZ05-24.');
    expect(within(panel).getByRole('row', { name: 'Request #33: NMZ-06V8' })).toHaveTextContent('Needed by 31 Mar 2027');
  });

  it('shows no panel to a designer who never asked', async () => {
    signInAs('designer');
    api();
    renderApp('/find');
    await screen.findByRole('row', { name: 'NMZ-05V6' });
    expect(screen.queryByRole('region', { name: 'My qualification requests' })).not.toBeInTheDocument();
  });
});

describe('Find parts for an admin', () => {
  it('offers no asking', async () => {
    signInAs('admin');
    const mock = mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.admin },
      'GET /api/search/facets': { body: FACETS },
      'GET /api/search': { body: page([CLEARED, NOT_CLEARED]) },
    });
    renderApp('/find');
    await screen.findByRole('row', { name: 'NMZ-05V6' });
    expect(screen.queryByRole('button', { name: /Ask for qualification/ })).not.toBeInTheDocument();
    expect(mock.unmatched).toEqual([]);
  });
});
