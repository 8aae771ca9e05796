import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Source } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { render, signInAs } from '@/testing/render';
import { SourcesPanel } from './sources-panel';

const source = (over: Partial<Source>): Source => ({
  housePartId: 5,
  vendorPartId: 11,
  manufacturer: 'Aldmoor Semiconductor',
  mpn: 'AMZ5V1-T',
  package: 'SOD-123',
  lifecycleNote: null,
  role: 'alternate',
  note: null,
  cardVersion: 1,
  addedBy: { id: 2, name: 'Priya Raman' },
  createdAt: '2026-12-01T10:00:00.000Z',
  updatedAt: '2026-12-01T10:00:00.000Z',
  ...over,
});

describe('SourcesPanel', { timeout: 20_000 }, () => {
  it('shows each role as its decisions gave it, with nothing to choose', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/house-parts/:id/sources': { body: [source({ role: 'approved' }), source({ vendorPartId: 12, mpn: 'BRZ-5V1', role: 'alternate' })] } });
    render(<SourcesPanel housePartId={5} partNumber="OHI-ZD-9051" />);
    expect(await screen.findByLabelText('Role of AMZ5V1-T')).toHaveTextContent('Approved source');
    expect(screen.getByLabelText('Role of BRZ-5V1')).toHaveTextContent('Alternate');
    // no control anywhere sets a role: not in the rows, not in the link form
    expect(screen.queryByRole('textbox', { name: /Role of/ })).not.toBeInTheDocument();
    expect(screen.queryByLabelText('As')).not.toBeInTheDocument();
  });

  it('offers an admin no link or unlink: admins read the catalogue', async () => {
    signInAs('admin');
    mockApi({ 'GET /api/house-parts/:id/sources': { body: [source({ role: 'approved' })] } });
    render(<SourcesPanel housePartId={5} partNumber="OHI-ZD-9051" />);
    expect(await screen.findByLabelText('Role of AMZ5V1-T')).toHaveTextContent('Approved source');
    expect(screen.queryByRole('button', { name: 'Link source' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Remove AMZ5V1-T' })).not.toBeInTheDocument();
  });

  it('links a vendor part as a candidate: the request carries no role', async () => {
    signInAs('engineer');
    const api = mockApi({
      'GET /api/house-parts/:id/sources': { body: [] },
      'GET /api/vendor-parts': {
        body: {
          items: [
            {
              id: 12,
              mpn: 'BRZ-5V1',
              manufacturer: 'Brackenford Devices',
              package: 'SOD-323',
              lifecycleNote: null,
              card: null,
              createdAt: '2026-12-01T10:00:00.000Z',
              updatedAt: '2026-12-01T10:00:00.000Z',
            },
          ],
          total: 1,
          pageIndex: 0,
          pageSize: 20,
        },
      },
      'POST /api/house-parts/:id/sources': (call) => ({
        status: 201,
        body: source({ vendorPartId: (call.body as { vendorPartId: number }).vendorPartId, mpn: 'BRZ-5V1' }),
      }),
    });
    const { user } = render(<SourcesPanel housePartId={5} partNumber="OHI-ZD-9051" />);
    await user.type(screen.getByPlaceholderText('Type a part number or manufacturer'), 'BRZ');
    await user.click(await screen.findByRole('option', { name: /BRZ-5V1/ }));
    await user.click(screen.getByRole('button', { name: 'Link source' }));
    await waitFor(() => expect(api.callsTo('POST', '/api/house-parts/5/sources')).toHaveLength(1));
    expect(api.callsTo('POST', '/api/house-parts/5/sources')[0].body).toEqual({ vendorPartId: 12, note: null });
  });
});
