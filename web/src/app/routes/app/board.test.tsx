import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { BoardPage } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { DEMO_USERS, currentLocation, renderApp, signInAs } from '@/testing/render';

// Invented demo data: one house part with its approved source, a cleared alternate and one without a case.
const PAGE: BoardPage = {
  items: [
    {
      housePart: { id: 4, partNumber: 'OHI-ZD-1047', description: 'Regulator diode 4.7 V', status: 'active', specVersion: 1 },
      sources: [
        {
          vendorPart: { id: 11, manufacturer: 'Brackenford Semiconductor', mpn: 'BRZ05-4V7', package: 'SOD-123' },
          role: 'approved',
          cardVersion: 1,
          state: 'none',
          latestCase: null,
        },
        {
          vendorPart: { id: 40, manufacturer: 'Quarryhill Semitech', mpn: 'QHZ4V7A', package: 'SOD-123' },
          role: 'alternate',
          cardVersion: 2,
          state: 'cleared',
          latestCase: {
            id: 1,
            revision: 1,
            state: 'cleared',
            overall: 'pass',
            preparedBy: { id: 2, name: 'Priya Raman' },
            decidedBy: { id: 3, name: 'Tomas Eklund' },
            needsRecheck: true,
            updatedAt: '2026-10-21T18:25:27.000Z',
            ageDays: 41,
          },
        },
        {
          vendorPart: { id: 41, manufacturer: 'Corriebank Electronics', mpn: 'CBX3-4.7', package: 'SOD-323' },
          role: 'alternate',
          cardVersion: 1,
          state: 'none',
          latestCase: null,
        },
      ],
    },
  ],
  total: 1,
  pageIndex: 0,
  pageSize: 25,
  counts: {
    draft: 0,
    'in-review': 0,
    approved: 0,
    cleared: 1,
    'cleared-with-conditions': 0,
    'cleared-with-waiver': 0,
    rejected: 0,
    withdrawn: 0,
    revoked: 0,
    'waiver-lapsed': 0,
    none: 2,
  },
  // Every engineer the server knows, including one with no case on this page.
  engineers: [
    { id: 5, name: 'Aino Varga' },
    { id: DEMO_USERS.engineer.id, name: DEMO_USERS.engineer.name },
    { id: 3, name: 'Tomas Eklund' },
  ],
};

// The Board also lists open qualification requests; these tests are about the table.
const NO_REQUESTS = { 'GET /api/qualification-requests': { body: { items: [], total: 0, pageIndex: 0, pageSize: 200 } } };
const boardUrls = (fetch: ReturnType<typeof mockApi>['fetch']) =>
  fetch.mock.calls.map(([input]) => String(input)).filter((u) => u.includes('/qualification-views/board'));

describe('Board screen', () => {
  it('shows each source with its state, verdict, case, engineers and age, and links to the case, the compare view and the parts', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/board': { body: PAGE }, ...NO_REQUESTS });
    renderApp('/board');
    const row = (await screen.findByRole('link', { name: 'QHZ4V7A' })).closest('tr')!;
    expect(within(row).getByText('Cleared').closest('[data-state]')).toHaveAttribute('data-state', 'cleared');
    expect(within(row).getByText('pass')).toBeInTheDocument();
    expect(within(row).getByText('re-check')).toBeInTheDocument();
    expect(row).toHaveTextContent('Priya Raman → Tomas Eklund');
    expect(row).toHaveTextContent('41 days');
    expect(within(row).getByRole('link', { name: '#1' })).toHaveAttribute('href', '/qualifications/1');
    expect(screen.getByRole('link', { name: 'Compare the sources of OHI-ZD-1047' })).toHaveAttribute('href', '/compare/4');
    expect(screen.getByRole('link', { name: 'OHI-ZD-1047' })).toHaveAttribute('href', '/house-parts/4');
    // A case is opened for an alternate without one; the approved source is the reference.
    expect(screen.getByRole('button', { name: 'Open a case: CBX3-4.7 for OHI-ZD-1047' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Open a case: BRZ05-4V7 for OHI-ZD-1047' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Open a case: QHZ4V7A for OHI-ZD-1047' })).not.toBeInTheDocument();
  });

  it('filters by state from the tallies and by age, through the server and the address', async () => {
    signInAs('engineer');
    const api = mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/board': { body: PAGE }, ...NO_REQUESTS });
    const { user } = renderApp('/board');
    await user.click(await screen.findByRole('button', { name: 'Cleared: 1' }));
    await waitFor(() => expect(boardUrls(api.fetch)).toContain('/api/qualification-views/board?pageIndex=0&pageSize=25&state=cleared'));
    expect(currentLocation()).toBe('/board?state=cleared');
    // One request per view: the server's tallies already ignore the state filter.
    expect(boardUrls(api.fetch).filter((u) => u.includes('pageSize=1&') || u.endsWith('pageSize=1'))).toEqual([]);
    expect(new Set(boardUrls(api.fetch))).toEqual(
      new Set(['/api/qualification-views/board?pageIndex=0&pageSize=25', '/api/qualification-views/board?pageIndex=0&pageSize=25&state=cleared']),
    );
    expect(screen.getByRole('button', { name: 'Cleared: 1' })).toHaveAttribute('aria-pressed', 'true');
    await user.type(screen.getByLabelText('Unchanged for at least'), '30');
    await waitFor(() => expect(boardUrls(api.fetch)).toContain('/api/qualification-views/board?minAgeDays=30&pageIndex=0&pageSize=25&state=cleared'));
  });

  it('offers every engineer the server names in the engineer filter, the viewer marked, and filters by one', async () => {
    signInAs('engineer');
    const api = mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/board': { body: PAGE }, ...NO_REQUESTS });
    const { user } = renderApp('/board');
    await screen.findByRole('link', { name: 'QHZ4V7A' });
    await user.click(screen.getByRole('textbox', { name: 'Engineer' }));
    const options = (await screen.findAllByRole('option')).map((o) => o.textContent);
    expect(options).toEqual(['Aino Varga', `${DEMO_USERS.engineer.name} (me)`, 'Tomas Eklund']);
    await user.click(screen.getByRole('option', { name: 'Aino Varga' }));
    await waitFor(() => expect(boardUrls(api.fetch)).toContain('/api/qualification-views/board?engineerId=5&pageIndex=0&pageSize=25'));
    expect(currentLocation()).toBe('/board?engineer=5');
  });

  it('opens a case for a source and goes to it', async () => {
    signInAs('engineer');
    const api = mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.engineer },
      'GET /api/qualification-views/board': { body: PAGE },
      ...NO_REQUESTS,
      'POST /api/qualifications': {
        status: 409,
        body: { message: 'Case #12 (Corriebank Electronics CBX3-4.7 for OHI-ZD-1047) is still draft: continue that one', correlationId: 'c0ffee00-test' },
      },
    });
    const { user } = renderApp('/board');
    await user.click(await screen.findByRole('button', { name: 'Open a case: CBX3-4.7 for OHI-ZD-1047' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Open the case' }));
    const alert = await within(dialog).findByRole('alert');
    expect(alert).toHaveTextContent('This source already has a case');
    expect(alert).toHaveTextContent('Case #12');
    expect(api.callsTo('POST', '/api/qualifications')[0].body).toEqual({ housePartId: 4, vendorPartId: 41 });
  });
});
