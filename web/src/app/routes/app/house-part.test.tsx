import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { HousePart } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';

// An invented new house part, before its spec is written.
const PART: HousePart = {
  id: 5,
  partNumber: 'OHI-ZD-9051',
  description: 'Regulator diode 5.1 V',
  status: 'draft',
  specVersion: null,
  sourceCount: 0,
  createdAt: '2026-12-01T10:00:00.000Z',
  updatedAt: '2026-12-01T10:00:00.000Z',
  createdBy: { id: 2, name: 'Priya Raman' },
};

describe('house part page', () => {
  it('shows a house part without a spec as an empty spec to write, not an error (the API answers 200 null)', async () => {
    signInAs('engineer');
    const api = mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.engineer },
      'GET /api/house-parts/:id': { body: PART },
      'GET /api/house-parts/:id/spec': { body: null },
      'GET /api/house-parts/:id/spec/versions': { body: [] },
      'GET /api/house-parts/:id/sources': { body: [] },
    });
    renderApp('/house-parts/5');
    expect(await screen.findByText('no spec yet')).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'OHI-ZD-9051' })).toBeInTheDocument();
    expect(screen.queryByText('The house part could not be loaded')).not.toBeInTheDocument();
    expect(api.calls.filter((c) => c.path === '/api/house-parts/5/spec')).toHaveLength(1);
  });
});
