import { screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SourcesView } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';

// Invented demo data: two house parts, one followed by the buyer.
const VIEW: SourcesView = {
  items: [
    {
      housePart: { id: 4, partNumber: 'OHI-ZD-1047', description: 'Regulator diode 4.7 V, sensor supply clamp', status: 'active' },
      sources: [
        {
          vendorPart: { id: 11, manufacturer: 'Brackenford Semiconductor', mpn: 'BRZ05-4V7', package: 'SOD-123' },
          role: 'approved',
          standing: 'not-qualified',
          caseId: null,
          revision: null,
          conditions: null,
          since: null,
          decidedBy: null,
          openCase: null,
          needsRecheck: false,
          waivers: [],
        },
        {
          vendorPart: { id: 40, manufacturer: 'Quarryhill Semitech', mpn: 'QHZ4V7A', package: 'SOD-123' },
          role: 'alternate',
          standing: 'cleared-with-conditions',
          caseId: 3,
          revision: 2,
          conditions: 'Incoming inspection of leakage on five pieces per lot',
          since: '2026-11-05T18:25:27.000Z',
          decidedBy: { id: 3, name: 'Tomas Eklund' },
          openCase: null,
          needsRecheck: true,
          waivers: [],
        },
      ],
    },
  ],
};

function api(extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'GET /api/auth/me': { body: DEMO_USERS.buyer },
    'GET /api/qualification-views/sources': { body: VIEW },
    ...extra,
  });
}

describe('Sources screen', () => {
  let clicked: HTMLAnchorElement[];
  beforeEach(() => {
    clicked = [];
    // jsdom has no object URLs and does not download: record what would be saved.
    URL.createObjectURL = vi.fn(() => 'blob:sources');
    URL.revokeObjectURL = vi.fn();
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push(this);
    });
  });
  afterEach(() => vi.restoreAllMocks());

  it('lists every source with its standing, conditions, date and who decided, without catalogue links for a buyer', async () => {
    signInAs('buyer');
    api();
    renderApp('/sources');
    const row = await screen.findByText('QHZ4V7A');
    const tr = row.closest('tr')!;
    expect(tr).toHaveTextContent('Cleared with conditions');
    expect(tr).toHaveTextContent('Incoming inspection of leakage on five pieces per lot');
    expect(tr).toHaveTextContent('05 Nov 2026');
    expect(tr).toHaveTextContent('Tomas Eklund');
    expect(tr).toHaveTextContent('#3 rev. 2');
    expect(tr).toHaveTextContent('re-check due');
    // Buyers may not open house parts, vendor parts or cases: names only.
    expect(within(tr).queryByRole('link')).not.toBeInTheDocument();
    expect(screen.getByText('Not qualified')).toBeInTheDocument();
  });

  it('shows an approved source since when and by whom, and the Conditions text only for a clearance with conditions', async () => {
    signInAs('buyer');
    const approved = {
      ...VIEW.items[0].sources[1],
      vendorPart: { id: 12, manufacturer: 'Brackenford Semiconductor', mpn: 'BRZ05-4V7B', package: 'SOD-123' },
      role: 'approved' as const,
      standing: 'approved' as const,
      caseId: 8,
      revision: 1,
      // the API sends no conditions for an approval (standingConditions in contracts)
      conditions: null,
      since: '2026-10-14T09:00:00.000Z',
      decidedBy: { id: 5, name: 'Ines Varga' },
      needsRecheck: false,
    };
    api({ 'GET /api/qualification-views/sources': { body: { items: [{ ...VIEW.items[0], sources: [approved, VIEW.items[0].sources[1]] }] } } });
    renderApp('/sources');
    const tr = (await screen.findByText('BRZ05-4V7B')).closest('tr')!;
    expect(tr).toHaveTextContent('Approved');
    expect(tr).toHaveTextContent('14 Oct 2026');
    expect(tr).toHaveTextContent('Ines Varga');
    expect(within(tr).queryByText(/Incoming inspection/)).toBeNull();
    expect(screen.getByRole('columnheader', { name: 'Conditions or reason' })).toBeInTheDocument();
  });

  it('exports the view as CSV with the session token and the same filter', async () => {
    signInAs('buyer');
    const calls = api({ 'GET /api/qualification-views/sources.csv': { body: 'house_part,mpn\n' } });
    const { user } = renderApp('/sources');
    await screen.findByText('QHZ4V7A');
    await user.click(screen.getByRole('button', { name: 'Export CSV' }));
    await waitFor(() => expect(calls.callsTo('GET', '/api/qualification-views/sources.csv')).toHaveLength(1));
    expect(calls.callsTo('GET', '/api/qualification-views/sources.csv')[0].headers.Authorization).toBe('Bearer test-token-buyer');
    const url = String(calls.fetch.mock.calls.find(([input]) => String(input).includes('sources.csv'))![0]);
    // A buyer starts on the house parts they follow; the file holds what the screen shows.
    expect(url).toBe('/api/qualification-views/sources.csv?mine=true');
    await waitFor(() => expect(clicked).toHaveLength(1));
    expect(clicked[0].download).toBe('sources.csv');
    expect(await screen.findByText('sources.csv was downloaded.')).toBeInTheDocument();
  });

  it('says plainly when the export fails', async () => {
    signInAs('buyer');
    api({ 'GET /api/qualification-views/sources.csv': { status: 500, body: errorBody('Internal server error') } });
    const { user } = renderApp('/sources');
    await screen.findByText('QHZ4V7A');
    await user.click(screen.getByRole('button', { name: 'Export CSV' }));
    expect(await screen.findByText('Export failed')).toBeInTheDocument();
    expect(screen.getByText(/Internal server error \(ref\. c0ffee00-test\)/)).toBeInTheDocument();
    expect(clicked).toHaveLength(0);
  });

  it('lets a buyer stop following a house part (only themself)', async () => {
    signInAs('buyer');
    const calls = api({ 'DELETE /api/house-parts/:id/buyers/:userId': { status: 204 } });
    const { user } = renderApp('/sources');
    const button = await screen.findByRole('button', { name: 'Stop following OHI-ZD-1047' });
    expect(button).toHaveAttribute('aria-pressed', 'true');
    await user.click(button);
    await waitFor(() => expect(calls.callsTo('DELETE', '/api/house-parts/4/buyers/5')).toHaveLength(1));
    expect(await screen.findByText('No longer following OHI-ZD-1047')).toBeInTheDocument();
  });

  it("opens on the one house part a buyer's mail links to, and offers to show all", async () => {
    signInAs('buyer');
    const calls = api();
    const { user } = renderApp('/sources?housePartId=4');
    await screen.findByText('QHZ4V7A');
    const urls = () => calls.fetch.mock.calls.map(([i]) => String(i)).filter((u) => u.startsWith('/api/qualification-views/sources'));
    expect(urls()).toContain('/api/qualification-views/sources?housePartId=4');
    await user.click(screen.getByRole('button', { name: 'Showing one house part — show all' }));
    await waitFor(() => expect(urls().at(-1)).toBe('/api/qualification-views/sources?mine=true'));
    expect(screen.getByRole('radio', { name: 'House parts I follow' })).toBeChecked();
  });

  it('shows engineers every house part with links to the catalogue and the case', async () => {
    signInAs('engineer');
    const calls = mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/sources': { body: VIEW } });
    renderApp('/sources');
    expect(await screen.findByRole('link', { name: 'QHZ4V7A' })).toHaveAttribute('href', '/vendor-parts/40');
    expect(screen.getByRole('link', { name: 'OHI-ZD-1047' })).toHaveAttribute('href', '/house-parts/4');
    expect(screen.getByRole('link', { name: '#3 rev. 2' })).toHaveAttribute('href', '/qualifications/3');
    expect(screen.queryByRole('button', { name: /follow/i })).not.toBeInTheDocument();
    expect(String(calls.fetch.mock.calls.find(([i]) => String(i).includes('/qualification-views/sources'))![0])).toBe('/api/qualification-views/sources');
  });
});
