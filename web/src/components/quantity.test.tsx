import { useState } from 'react';
import { screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { QuantityKind } from '@shuntwise/contracts';
import { render } from '@/testing/render';
import { Quantity } from './quantity';
import { formatForInput, QuantityInput } from './quantity-input';

// Expected texts follow the SI prefixes in steps of 10³ (BIPM, The International System
// of Units, 9th edition 2019, table 7: m = 10⁻³, µ = 10⁻⁶, k = 10³ — quoted from memory),
// three significant figures (common practice, no source) and the true minus sign U+2212
// for negative values (ISO 80000-1 typography, quoted from memory).
describe('Quantity', () => {
  it.each<[number, QuantityKind, string]>([
    [4.7, 'voltage', '4.70 V'],
    [0.00025, 'current', '250 µA'],
    [33, 'resistance', '33.0 Ω'],
    [-0.0019, 'tempCoVoltage', '−1.90 mV/K'],
    // a small coefficient stays in mV/K as datasheets state it, never −600 µV/K
    [-0.0006, 'tempCoVoltage', '−0.60 mV/K'],
    [-40, 'temperature', '−40.0 °C'],
    [0.5, 'power', '500 mW'],
    [1200, 'resistance', '1.20 kΩ'],
    [150, 'temperature', '150 °C'],
  ])('shows %s in %s as %s', (value, kind, text) => {
    render(<Quantity value={value} kind={kind} />);
    expect(screen.getByText(text)).toBeInTheDocument();
  });

  it('keeps the exact SI value for hovering', () => {
    render(<Quantity value={0.00025} kind="current" />);
    expect(screen.getByText('250 µA')).toHaveAttribute('title', '0.00025');
  });

  it('shows a missing value as a dash, never as zero', () => {
    render(<Quantity value={null} kind="voltage" />);
    expect(screen.getByText('–')).toBeInTheDocument();
    expect(screen.queryByText(/0 V/)).not.toBeInTheDocument();
  });
});

describe('formatForInput', () => {
  // The field shows what one would type back, without padding zeros or rounding:
  // 4.7 mA is 4.7 × 10⁻³ A (SI prefix milli, BIPM SI Brochure, from memory).
  it.each<[number | null, QuantityKind, string]>([
    [0.0047, 'current', '4.7 mA'],
    [5, 'voltage', '5 V'],
    [4.705, 'voltage', '4.705 V'],
    [5e-7, 'current', '500 nA'],
    [null, 'current', ''],
  ])('writes %s %s as "%s"', (value, kind, text) => {
    expect(formatForInput(value, kind)).toBe(text);
  });
});

function Harness({ kind, unit, initial = null, onValue }: { kind: QuantityKind; unit?: string; initial?: number | null; onValue: (v: number | null) => void }) {
  const [value, setValue] = useState<number | null>(initial);
  return (
    <>
      <QuantityInput
        label="Test current"
        kind={kind}
        unit={unit}
        value={value}
        onChange={(v) => {
          setValue(v);
          onValue(v);
        }}
      />
      <button type="button" onClick={() => setValue(0.02)}>
        load
      </button>
    </>
  );
}

describe('QuantityInput', () => {
  // SI values: 5 mA = 5 × 10⁻³ A, 0.5 µA = 5 × 10⁻⁷ A (SI prefixes, BIPM SI Brochure
  // 9th edition, from memory); "u" for µ where the keyboard has no µ is common practice, no source.
  it.each<[string, number]>([
    ['5 mA', 5e-3],
    ['0.5 µA', 5e-7],
    ['0.5 uA', 5e-7],
    ['20mA', 0.02],
  ])('stores "%s" as %s A', async (text, si) => {
    const onValue = vi.fn();
    const { user } = render(<Harness kind="current" onValue={onValue} />);
    await user.type(screen.getByLabelText('Test current'), text);
    const last = onValue.mock.calls.at(-1)?.[0] as number;
    expect(last).toBeCloseTo(si, 15);
    expect(Math.abs(last - si) / si).toBeLessThan(1e-12);
  });

  it('reads a bare number in the field unit: "4.7" in a mA field is 4.7 mA', async () => {
    const onValue = vi.fn();
    const { user } = render(<Harness kind="current" unit="mA" onValue={onValue} />);
    await user.type(screen.getByLabelText('Test current'), '4.7');
    expect(onValue.mock.calls.at(-1)?.[0]).toBeCloseTo(0.0047, 15);
    expect(screen.getByText('mA')).toBeInTheDocument();
  });

  it('names the field when the unit does not fit, keeps the text and stores nothing wrong', async () => {
    const onValue = vi.fn();
    const { user } = render(<Harness kind="current" onValue={onValue} />);
    const input = screen.getByLabelText('Test current');
    await user.type(input, '5 mV');
    await user.tab();
    expect(screen.getByText(/Test current: cannot read "5 mV" as a current/)).toBeInTheDocument();
    expect(input).toHaveValue('5 mV');
    expect(input).toHaveAttribute('aria-invalid', 'true');
    // On the way, "5" read as 5 A (a bare number in the field unit); once the text stops
    // reading the value is NaN, so no form keeps 5 A behind an error.
    expect(onValue.mock.calls.map((c) => c[0])).toEqual([5, NaN]);
  });

  it('shows a value set from outside in the same notation', async () => {
    const { user } = render(<Harness kind="current" initial={0.0047} onValue={() => {}} />);
    const input = screen.getByLabelText('Test current');
    expect(input).toHaveValue('4.7 mA');
    await user.click(screen.getByRole('button', { name: 'load' }));
    expect(input).toHaveValue('20 mA');
  });

  it('empties to null', async () => {
    const onValue = vi.fn();
    const { user } = render(<Harness kind="voltage" initial={5.1} onValue={onValue} />);
    await user.clear(screen.getByLabelText('Test current'));
    expect(onValue).toHaveBeenLastCalledWith(null);
  });
});
