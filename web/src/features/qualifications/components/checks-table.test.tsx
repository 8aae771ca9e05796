import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatMargin } from '@/components/check-cells';
import { render } from '@/testing/render';
import { CHECKS } from '../testing/case-fixture';
import { ChecksTable } from './checks-table';

function row(id: string): HTMLElement {
  const el = document.querySelector<HTMLElement>(`tr[data-check="${id}"]`);
  if (!el) throw new Error(`no row for ${id}`);
  return el;
}

describe('checks table', () => {
  it('shows each margin with its sign, to one decimal, in percent of the limit', () => {
    render(<ChecksTable checks={CHECKS} />);
    // Margins worked by hand in the fixture (common practice, no source): (limit − value) / limit.
    expect(screen.getByTestId('margin-zd')).toHaveTextContent('+37.8 %');
    expect(screen.getByTestId('margin-vz-window')).toHaveTextContent('+2.1 %');
    expect(screen.getByTestId('margin-power-dissipation')).toHaveTextContent('−13.1 %');
    expect(screen.getByTestId('margin-power-rating')).toHaveTextContent('+150.0 %');
    expect(screen.getByTestId('margin-leakage')).toHaveTextContent('±0.0 %');
    // No data and text checks have no margin: a dash, never a number.
    expect(screen.getByTestId('margin-knee-ratio')).toHaveTextContent('–');
    expect(screen.getByTestId('margin-package')).toHaveTextContent('–');
  });

  it('colours every margin by its verdict: green pass, yellow marginal, red fail, grey no data', () => {
    render(<ChecksTable checks={CHECKS} />);
    const colour = (id: string) => within(screen.getByTestId(`margin-${id}`)).getByText(/%|–/);
    expect(colour('zd')).toHaveAttribute('data-verdict', 'pass');
    expect(colour('zd')).toHaveStyle({ color: 'var(--mantine-color-verdigris-7)' });
    expect(colour('zd')).not.toHaveStyle({ color: 'var(--mantine-color-red-9)' });
    expect(colour('leakage')).toHaveStyle({ color: 'var(--mantine-color-yellow-8)' });
    expect(colour('power-dissipation')).toHaveStyle({ color: 'var(--mantine-color-red-9)' });
    expect(colour('knee-ratio')).toHaveStyle({ color: 'var(--mantine-color-dimmed)' });
    // The verdict is also written out, so the table reads without colour.
    expect(within(row('power-dissipation')).getByText('fail')).toBeInTheDocument();
    expect(within(row('leakage')).getByText('marginal')).toBeInTheDocument();
    expect(within(row('knee-ratio')).getByText('no data')).toBeInTheDocument();
  });

  it('formats values and limits through the shared formatter: windows, bounds, packages', () => {
    render(<ChecksTable checks={CHECKS} />);
    const vz = within(row('vz-window'));
    expect(vz.getByText(/10\.3 V/)).toBeInTheDocument();
    expect(row('vz-window')).toHaveTextContent('10.3 V … 11.4 V');
    expect(row('vz-window')).toHaveTextContent('10.1 V … 12.0 V');
    expect(row('zd')).toHaveTextContent('≤ 13.0 Ω');
    expect(row('power-rating')).toHaveTextContent('≥ 600 mW');
    expect(row('leakage')).toHaveTextContent('1.00 µA');
    expect(row('tc')).toHaveTextContent('7.30 mV/K');
    expect(row('package')).toHaveTextContent('SMB');
    expect(row('package')).toHaveTextContent('SMA, SMB');
    expect(row('knee-ratio')).toHaveTextContent('≤ 9.50');
  });

  it('opens a row to its sentence and assumptions, and all rows at once', async () => {
    const { user } = render(
      <ChecksTable
        checks={CHECKS}
        notApplicable={[{ id: 'knee-span', label: 'Voltage span over the operating currents', reason: 'the spec sets no largest voltage span' }]}
      />,
    );
    expect(screen.queryByText('the diode may dissipate 50 % of its derated rating')).not.toBeInTheDocument();
    expect(row('power-dissipation')).toHaveAttribute('title', '88.1 mW at 7.90 mA and 85 °C above the allowed 77.9 mW');
    await user.click(screen.getByRole('button', { name: 'Show the assumptions of Worst-case dissipation' }));
    expect(screen.getByText('the diode may dissipate 50 % of its derated rating')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Hide the assumptions of Worst-case dissipation' })).toHaveAttribute('aria-expanded', 'true');
    await user.click(screen.getByRole('button', { name: 'Show every assumption' }));
    expect(screen.getByText('datasheet leakage is stated at 25 °C, as is the spec’s')).toBeInTheDocument();
    expect(screen.getByText(/Not checked \(the spec sets no limit\): Voltage span over the operating currents/)).toBeInTheDocument();
  });

  it('rounds margins to one decimal and never prints −0.0', () => {
    expect(formatMargin(2.049)).toBe('+2.0 %');
    expect(formatMargin(2.06)).toBe('+2.1 %');
    expect(formatMargin(-0.04)).toBe('±0.0 %');
    expect(formatMargin(-25)).toBe('−25.0 %');
    expect(formatMargin(null)).toBe('–');
    expect(formatMargin(Number.NaN)).toBe('–');
  });
});
