import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { comparePayloadSchema } from '@shuntwise/contracts';
import { CompareRoute } from './compare';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, render, signInAs } from '@/testing/render';
import { Route, Routes } from 'react-router';
import fixture from '@/features/compare/testing/compare-fixture.json';
import { logTicks, niceTicks } from '@/features/compare/utils/series';

// An answer of the demo stack (invented catalogue), trimmed to five currents and three sources.
const PAYLOAD = comparePayloadSchema.parse(fixture);

function renderCompare() {
  return render(
    <Routes>
      <Route path="/compare/:housePartId" element={<CompareRoute />} />
    </Routes>,
    { route: '/compare/10' },
  );
}

describe('Compare screen', () => {
  it('puts the checks of every source side by side with margins coloured by verdict', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/compare/:id': { body: PAYLOAD } });
    renderCompare();
    const table = await screen.findByRole('table', { name: 'Checks by source' });
    const dissipation = table.querySelector('tr[data-check="power-dissipation"]')!;
    const cells = within(dissipation as HTMLElement).getAllByRole('cell');
    // check, limit, then one cell per source in the payload's order
    expect(cells[1]).toHaveTextContent('≤ 130 mW');
    expect(cells[2]).toHaveAttribute('data-verdict', 'pass');
    expect(cells[3]).toHaveAttribute('data-verdict', 'fail');
    expect(within(cells[3]).getByText('−13.1 %')).toHaveStyle({ color: 'var(--mantine-color-red-9)' });
    expect(cells[4]).toHaveTextContent('no rating card with vzNom and izt yet');
    expect(screen.getByText(/NMZ-10: not drawn/)).toBeInTheDocument();
  });

  it('shows each worst-case window beside the spec windows, and the caution', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/compare/:id': { body: PAYLOAD } });
    renderCompare();
    expect(await screen.findByTestId('window-BRZ05-10')).toHaveTextContent('9.11 V … 11.0 V');
    expect(screen.getByTestId('window-CBX3-10')).toHaveTextContent('9.07 V … 11.2 V');
    expect(screen.getByRole('region', { name: 'Worst-case window' })).toHaveTextContent("the spec's output window 8.81 V … 11.2 V");
    expect(screen.getByText(/Confirm them by measurement and with the manufacturer/)).toBeInTheDocument();
  });

  it('offers to open a case for an alternate without one, not for the approved source', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/compare/:id': { body: PAYLOAD } });
    renderCompare();
    expect(await screen.findByRole('button', { name: 'Open a case: CBX3-10 for OHI-ZD-1100' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Open a case: BRZ05-10 for OHI-ZD-1100' })).not.toBeInTheDocument();
    // No evaluation, nothing to qualify yet.
    expect(screen.queryByRole('button', { name: 'Open a case: NMZ-10 for OHI-ZD-1100' })).not.toBeInTheDocument();
  });

  it('says why when there is nothing to compare against', async () => {
    signInAs('engineer');
    mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.engineer },
      'GET /api/qualification-views/compare/:id': { status: 422, body: errorBody('House part OHI-ZD-1100 has no spec yet: there is nothing to compare against') },
    });
    renderCompare();
    expect(await screen.findByRole('alert')).toHaveTextContent('has no spec yet: there is nothing to compare against');
  });

  it('draws the current axis at 1-2-5 steps per decade and the voltage axis at round steps', () => {
    expect(logTicks(0.00025, 0.01185)).toEqual([0.0005, 0.001, 0.002, 0.005, 0.01]);
    const v = niceTicks(8.71, 11.3, 7);
    expect(v.ticks).toEqual([8.5, 9, 9.5, 10, 10.5, 11, 11.5]);
    expect(v.domain).toEqual([8.5, 11.5]);
  });
});
