import { cloneElement, type ReactElement } from 'react';
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { comparePayloadSchema } from '@shuntwise/contracts';
import { CompareRoute } from './compare';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, render, signInAs } from '@/testing/render';
import { Route, Routes } from 'react-router';
import fixture from '@/features/compare/testing/compare-fixture.json';
import { logTicks, niceTicks } from '@/features/compare/utils/series';

// jsdom lays nothing out, so the chart's responsive wrapper would measure 0 × 0 and draw nothing: give it a size.
vi.mock('recharts', async (importOriginal) => {
  const actual = await importOriginal<typeof import('recharts')>();
  return {
    ...actual,
    ResponsiveContainer: ({ children }: { children: ReactElement<{ width?: number; height?: number }> }) => cloneElement(children, { width: 900, height: 380 }),
  };
});

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
    // Each part is held to its own derated limit, not the first source's for all.
    expect(cells[1]).toHaveTextContent("each part's own");
    expect(cells[1]).not.toHaveTextContent('130 mW');
    expect(within(cells[2]).getByTestId('own-limit-power-dissipation')).toHaveTextContent(
      'limit ≤ 130 mW: 50 % of 260 mW derated to 85.0 °C (PD max, linear to TJ max)',
    );
    expect(within(cells[3]).getByTestId('own-limit-power-dissipation')).toHaveTextContent(
      'limit ≤ 77.9 mW: 50 % of 156 mW derated to 85.0 °C ((TJ max − Ta)/RthJA)',
    );
    // A spec limit is the same for every part and stays in the limit column.
    const rating = within(table.querySelector('tr[data-check="power-rating"]') as HTMLElement).getAllByRole('cell');
    expect(rating[1]).toHaveTextContent('≥ 300 mW');
    expect(within(rating[2]).queryByTestId('own-limit-power-rating')).toBeNull();
    // A window check's limit is the spec's window, the same for every part (its nearer end differs by part).
    for (const id of ['tc', 'vz-window']) {
      const cellsOf = within(table.querySelector(`tr[data-check="${id}"]`) as HTMLElement).getAllByRole('cell');
      expect([id, cellsOf[1].textContent]).not.toEqual([id, expect.stringContaining("each part's own")]);
      expect(cellsOf[1].textContent).toMatch(/…/);
    }
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
      'GET /api/qualification-views/compare/:id': {
        status: 422,
        body: errorBody('House part OHI-ZD-1100 has no spec yet: there is nothing to compare against'),
      },
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

  it('shades each tolerance band as one area per part and ambient instead of two more lines each', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/compare/:id': { body: PAYLOAD } });
    renderCompare();
    const chart = await screen.findByTestId('iv-chart');
    // Two drawable sources × three ambients: one nominal line each.
    expect(chart.querySelectorAll('.recharts-line')).toHaveLength(6);
    expect(chart.querySelectorAll('.recharts-area')).toHaveLength(0);
    await userEvent.click(screen.getByRole('switch', { name: 'Tolerance bands' }));
    expect(chart.querySelectorAll('.recharts-line')).toHaveLength(6);
    const areas = chart.querySelectorAll('.recharts-area-area');
    expect(areas).toHaveLength(6);
    for (const a of areas) expect(a.getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+/);
  });

  it('draws the I–V with voltage on x and the current linear in mA on y when asked, as engineers draw the knee', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.engineer }, 'GET /api/qualification-views/compare/:id': { body: PAYLOAD } });
    renderCompare();
    const chart = await screen.findByTestId('iv-chart');
    expect(chart).toHaveAttribute('data-scale', 'log');
    const axis = screen.getByRole('radiogroup', { name: 'Current axis' });
    await userEvent.click(within(axis).getByRole('radio', { name: 'Linear I–V (mA)' }));
    expect(chart).toHaveAttribute('data-scale', 'linear');
    // The first source's 25 °C line: each grid current maps linearly to the vertical axis (up is more current),
    // and the voltage rises to the right.
    const yTicks = [...chart.querySelectorAll('.recharts-yAxis .recharts-cartesian-axis-tick-value')].map((t) => t.textContent);
    const xTicks = [...chart.querySelectorAll('.recharts-xAxis .recharts-cartesian-axis-tick-value')].map((t) => t.textContent);
    // The fixture's grid ends at 1.5 × 7.9 mA = 11.85 mA: round linear steps from zero, in mA.
    expect(yTicks).toEqual(['0', '2 mA', '4 mA', '6 mA', '8 mA', '10 mA', '12 mA']);
    expect(xTicks.length).toBeGreaterThan(3);
    expect(xTicks.every((t) => / V$/.test(t ?? ''))).toBe(true);
    const points = (chart.querySelector('.recharts-line-curve')!.getAttribute('d') ?? '').match(/-?[\d.]+,-?[\d.]+/g)!.map((p) => p.split(',').map(Number));
    const currents = PAYLOAD.currents;
    expect(points).toHaveLength(currents.length);
    const [x0, y0] = points[0];
    const [xN, yN] = points[points.length - 1];
    expect(yN).toBeLessThan(y0);
    expect(xN).toBeGreaterThan(x0);
    points.forEach(([, y], k) => expect((y0 - y) / (y0 - yN)).toBeCloseTo((currents[k] - currents[0]) / (currents.at(-1)! - currents[0]), 2));
    await userEvent.click(within(axis).getByRole('radio', { name: 'Log current' }));
    expect(chart).toHaveAttribute('data-scale', 'log');
    expect(chart.querySelectorAll('.recharts-line')).toHaveLength(6);
  });
});
