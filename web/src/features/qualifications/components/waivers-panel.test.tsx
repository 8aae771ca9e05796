import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { render } from '@/testing/render';
import { caseFixture } from '../testing/case-fixture';
import { WaiverForm, readAcceptedLimit } from './waivers-panel';

// The fixture case has a marginal leakage check (1 µA against 1 µA) and a failing
// worst-case dissipation (88.1 mW against 77.9 mW); the others pass or lack data.
describe('waiver form', () => {
  it('offers only the failing and marginal checks', async () => {
    render(<WaiverForm q={caseFixture()} onSubmit={vi.fn()} />);
    fireEvent.click(await screen.findByRole('textbox', { name: 'Check' }));
    const options = (await screen.findAllByRole('option')).map((o) => o.textContent);
    expect(options).toEqual(['Reverse leakage (marginal)', 'Worst-case dissipation (fail)']);
  });

  it('reads the accepted limit with its unit into SI and sends the contracts body', async () => {
    const onSubmit = vi.fn();
    render(<WaiverForm q={caseFixture()} onSubmit={onSubmit} />);
    fireEvent.change(await screen.findByLabelText('Accepted limit'), { target: { value: '1.5 uA' } });
    fireEvent.change(screen.getByLabelText('Reason'), { target: { value: 'divider current dwarfs it' } });
    fireEvent.change(screen.getByLabelText('Expires on'), { target: { value: '2027-06-30' } });
    fireEvent.click(screen.getByRole('button', { name: 'Prepare waiver' }));
    expect(onSubmit).toHaveBeenCalledTimes(1);
    const body = onSubmit.mock.calls[0][0];
    expect(body).toMatchObject({ checkId: 'leakage', reason: 'divider current dwarfs it', expiresOn: '2027-06-30' });
    // 1.5 µA = 1.5e-6 A (SI prefix micro, common practice, no source)
    expect(body.acceptedLimit).toBeCloseTo(1.5e-6, 15);
  });

  it('names the problem and sends nothing when the limit has the wrong unit or the reason and date are missing', async () => {
    const onSubmit = vi.fn();
    render(<WaiverForm q={caseFixture()} onSubmit={onSubmit} />);
    fireEvent.change(await screen.findByLabelText('Accepted limit'), { target: { value: '1.5 V' } });
    fireEvent.click(screen.getByRole('button', { name: 'Prepare waiver' }));
    expect((await screen.findByRole('alert')).textContent).toMatch(/Accepted limit/);
    fireEvent.change(screen.getByLabelText('Accepted limit'), { target: { value: '1.5 uA' } });
    fireEvent.click(screen.getByRole('button', { name: 'Prepare waiver' }));
    expect((await screen.findByRole('alert')).textContent).toMatch(/reason: Write the reason for the waiver/);
    expect((await screen.findByRole('alert')).textContent).toMatch(/expiresOn: must be a date/);
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('reads a ratio as a plain number and a text check as no limit', () => {
    expect(readAcceptedLimit(' 22 ', 'ratio')).toBe(22);
    expect(() => readAcceptedLimit('x', 'ratio')).toThrow(/Accepted limit/);
    expect(readAcceptedLimit('anything', 'text')).toBeNull();
  });
});
