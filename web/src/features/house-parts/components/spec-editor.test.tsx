import { screen, waitFor } from '@testing-library/react';
import { notifications } from '@mantine/notifications';
import { describe, expect, it, vi } from 'vitest';
import type { SpecVersion } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { render, signInAs } from '@/testing/render';
import { SpecEditor } from './spec-editor';

function saved(version: number, spec: unknown): SpecVersion {
  return {
    housePartId: 5,
    version,
    spec: spec as SpecVersion['spec'],
    note: null,
    createdAt: '2026-12-01T10:00:00.000Z',
    createdBy: { id: 2, name: 'Priya Raman' },
  };
}

const v1 = saved(1, {
  iRef: 0.005,
  vz: { min: 4.8, nom: 5.1, max: 5.4 },
  zdMax: 30,
  knee: null,
  leakage: { irMax: 2e-6, vr: 2 },
  tc: null,
  power: { pdMin: 0.3, deratingFraction: 0.5 },
  packages: ['SOD-123'],
  envelope: { iMin: 0.002, iMax: 0.01, taMin: -40, taMax: 85 },
  outputWindow: null,
  marginalBandPercent: 5,
});

type Put = { baseVersion: number; spec: Record<string, unknown>; note?: string };

describe('SpecEditor', { timeout: 20_000 }, () => {
  it('reads every quantity with its unit and sends SI, a new spec on version 0', async () => {
    signInAs('engineer');
    const api = mockApi({ 'PUT /api/house-parts/:id/spec': (call) => ({ body: saved(1, (call.body as Put).spec) }) });
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={null} />);

    // Pasted rather than typed key by key: seventeen fields are slow to type in jsdom on two cores.
    const type = async (label: string | RegExp, text: string) => {
      await user.click(screen.getByLabelText(label));
      await user.paste(text);
    };
    await type(/^Reference current/, '5 mA');
    await type(/^VZ min/, '4.8');
    await type(/^VZ nom/, '5100 mV');
    await type(/^VZ max/, '5.4 V');
    await type('Largest Zd at iRef', '30 ohm');
    await type('Knee current', '0.25 mA');
    await type('Largest ratio', '8');
    await type('Largest IR', '2 uA');
    await type('at VR', '2');
    await type('αVZ from', '-2.5 mV/°C');
    await type('αVZ to', '1');
    await type('Smallest PD rating', '0.3 W');
    await type('Use at most', '50');
    await type(/^Current from/, '2');
    await type(/^Current to/, '10 mA');
    await type(/^Ambient from/, '-40');
    await type(/^Ambient to/, '85 °C');
    await user.click(screen.getAllByRole('button', { name: 'Save as v1' })[0]);

    await waitFor(() => expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(1));
    const sent = api.callsTo('PUT', '/api/house-parts/5/spec')[0].body as Put;
    expect(sent.baseVersion).toBe(0);
    // SI prefixes (BIPM SI Brochure, 9th edition, table 7, from memory): m = 10⁻³, µ/u = 10⁻⁶;
    // a bare number is read in the field's unit (mA, V, µA, mV/K, %); a kelvin step equals a degree Celsius step.
    expect(sent.spec).toMatchObject({
      iRef: 0.005,
      vz: { min: 4.8, nom: 5.1, max: 5.4 },
      zdMax: 30,
      knee: { iKnee: 0.00025, maxRatio: 8, maxSpan: null },
      leakage: { irMax: 2e-6, vr: 2 },
      power: { pdMin: 0.3, deratingFraction: 0.5 },
      envelope: { iMin: 0.002, iMax: 0.01, taMin: -40, taMax: 85 },
      outputWindow: null,
    });
    const tc = sent.spec.tc as { min: number; max: number };
    expect(tc.min).toBeCloseTo(-0.0025, 12);
    expect(tc.max).toBeCloseTo(0.001, 12);
    expect(await screen.findByText('v1')).toBeInTheDocument();
  });

  it('names a unit that does not fit, and an incomplete group, on the field; sends nothing', async () => {
    signInAs('engineer');
    const api = mockApi({});
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    const iRef = screen.getByLabelText(/^Reference current/);
    await user.clear(iRef);
    await user.type(iRef, '5 mV');
    await user.tab();
    expect(screen.getByText(/Reference current: cannot read "5 mV" as a current/)).toBeInTheDocument();
    await user.clear(screen.getByLabelText('at VR'));
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    expect(screen.getByText('The leakage limit needs both the current and its reverse voltage')).toBeInTheDocument();
    expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(0);
    expect(iRef).toHaveValue('5 mV');
  });

  it('checks the window against the contracts’ spec rules before sending', async () => {
    signInAs('engineer');
    const api = mockApi({});
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    const vzMin = screen.getByLabelText(/^VZ min/);
    await user.clear(vzMin);
    await user.type(vzMin, '5.3');
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    expect(screen.getByText('VZ min (5.3 V) is above VZ nom (5.1 V)')).toBeInTheDocument();
    expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(0);
  });

  it('shows the API’s field errors under their inputs and keeps every value', async () => {
    signInAs('engineer');
    mockApi({
      'PUT /api/house-parts/:id/spec': {
        status: 400,
        body: errorBody('Invalid request: spec.leakage.vr: vr (5 V) must be below the window’s vz.min (4.8 V)', [
          { path: 'spec.leakage.vr', message: 'vr (5 V) must be below the window’s vz.min (4.8 V)' },
          { path: 'spec.power.deratingFraction', message: 'Too big: expected number to be <=1' },
        ]),
      },
    });
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    const vr = screen.getByLabelText('at VR');
    await user.clear(vr);
    await user.type(vr, '4.5');
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    expect(await screen.findByText('vr (5 V) must be below the window’s vz.min (4.8 V)')).toBeInTheDocument();
    expect(vr).toHaveAttribute('aria-invalid', 'true');
    // The fraction's error lands on the percentage input that stands for it.
    expect(screen.getByLabelText('Use at most')).toHaveAttribute('aria-invalid', 'true');
    expect(vr).toHaveValue('4.5');
    expect(screen.getByRole('alert')).toHaveTextContent('ref. c0ffee00-test');
  });

  it('on a stale base keeps the values and offers to save them on top of the newer version', async () => {
    signInAs('engineer');
    let puts = 0;
    const api = mockApi({
      'PUT /api/house-parts/:id/spec': (call) => {
        puts += 1;
        if (puts === 1) {
          return {
            status: 409,
            body: errorBody('The spec of OHI-ZD-9051 is now at version 2; you edited version 1.', [{ path: 'baseVersion', message: 'current version is 2' }]),
          };
        }
        return { body: saved(3, (call.body as Put).spec) };
      },
      'GET /api/house-parts/:id/spec': { body: saved(2, v1.spec) },
      'GET /api/house-parts/:id/spec/versions': { body: [] },
    });
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    const zd = screen.getByLabelText('Largest Zd at iRef');
    await user.clear(zd);
    await user.type(zd, '25 Ω');
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    expect(await screen.findByText(/now at version 2/)).toBeInTheDocument();
    expect(zd).toHaveValue('25 Ω');
    await user.click(screen.getByRole('button', { name: 'Save mine as v3' }));
    await waitFor(() => expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(2));
    const second = api.callsTo('PUT', '/api/house-parts/5/spec')[1].body as Put;
    expect(second.baseVersion).toBe(2);
    expect(second.spec.zdMax).toBe(25);
  });

  it('after a save shows the saved state, and a save that changes nothing sends nothing', async () => {
    signInAs('engineer');
    const api = mockApi({ 'PUT /api/house-parts/:id/spec': (call) => ({ body: saved(2, (call.body as Put).spec) }) });
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    // nothing typed yet: nothing to save
    expect(screen.getAllByRole('button', { name: /No changes to save|Saved/ })[0]).toBeDisabled();
    const zd = screen.getByLabelText('Largest Zd at iRef');
    await user.clear(zd);
    await user.type(zd, '25 Ω');
    await user.tab();
    expect(screen.getByText('unsaved changes')).toBeInTheDocument();
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    await waitFor(() => expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(1));
    expect(await screen.findByText('v2')).toBeInTheDocument();
    await waitFor(() => expect(screen.queryByText('unsaved changes')).toBeNull());
    expect(screen.queryByRole('button', { name: 'Save as v3' })).toBeNull();

    // Typing the same value again (in another unit) is no change: no badge, no version.
    await user.clear(zd);
    await user.type(zd, '0.025 kΩ');
    await user.tab();
    expect(screen.queryByText('unsaved changes')).toBeNull();
    const shown = vi.spyOn(notifications, 'show');
    await user.keyboard('{Control>}s{/Control}');
    await waitFor(() => expect(shown).toHaveBeenCalledWith(expect.objectContaining({ title: 'Nothing to save' })));
    expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(1);
  });

  it('warns, without blocking, on a Zener voltage, test current or power rating outside the usual range of regulator diodes', async () => {
    signInAs('engineer');
    const api = mockApi({ 'PUT /api/house-parts/:id/spec': (call) => ({ body: saved(2, (call.body as Put).spec) }) });
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    const vzMax = screen.getByLabelText(/^VZ max/);
    expect(document.querySelectorAll('[data-warning]')).toHaveLength(0);
    // Usual range 1.8 V … 400 V (common practice, no source; contracts/src/units/plausibility.ts).
    await user.clear(vzMax);
    await user.paste('5.4 kV');
    expect(await screen.findByText(/5.40 kV is outside the usual range of regulator diodes \(1.80 V … 400 V\): did you mean 5.40 V\?/)).toBeInTheDocument();
    expect(vzMax).toHaveAccessibleDescription(/outside the usual range of regulator diodes/);
    await user.clear(vzMax);
    await user.paste('5.4 V');
    expect(document.querySelectorAll('[data-warning]')).toHaveLength(0);
    const pd = screen.getByLabelText('Smallest PD rating');
    await user.clear(pd);
    await user.paste('300');
    await user.tab();
    // A bare number is read in mW here; 300 W would be typed with its unit.
    expect(document.querySelectorAll('[data-warning]')).toHaveLength(0);
    await user.clear(pd);
    await user.paste('300 W');
    expect(screen.getByText(/300 W is outside the usual range of regulator-diode power ratings .*did you mean 300 mW\?/)).toBeInTheDocument();
    await user.clear(pd);
    await user.paste('0.3 W');
    const iRef = screen.getByLabelText(/^Reference current/);
    await user.clear(iRef);
    await user.paste('5 A');
    expect(screen.getByText(/5.00 A is outside the usual range of regulator-diode test currents .*did you mean 5.00 mA\?/)).toBeInTheDocument();
    // A warning, not a block: the value is saved as typed.
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    await waitFor(() => expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(1));
    expect((api.callsTo('PUT', '/api/house-parts/5/spec')[0].body as Put).spec).toMatchObject({ iRef: 5 });
  });

  it('says beside "Use at most" what it will store, and offers the percentage when a fraction was typed', async () => {
    signInAs('engineer');
    const api = mockApi({ 'PUT /api/house-parts/:id/spec': (call) => ({ body: saved(2, (call.body as Put).spec) }) });
    const { user } = render(<SpecEditor housePartId={5} partNumber="OHI-ZD-9051" current={v1} />);
    const share = screen.getByLabelText('Use at most');
    expect(screen.getByTestId('derating-reading')).toHaveTextContent('stores 50 % of the derated rating (fraction 0.5)');
    await user.clear(share);
    await user.paste('0.5');
    await user.tab();
    // Not silently clamped or scaled: 0.5 stays 0.5 %, and the line says so and asks.
    expect(share).toHaveValue('0.5 %');
    expect(screen.getByTestId('derating-reading')).toHaveTextContent(
      'stores 0.5 % of the derated rating (fraction 0.005) — did you mean the fraction 0.5, that is 50 %?',
    );
    await user.click(screen.getByRole('button', { name: 'Use 50 %' }));
    expect(share).toHaveValue('50 %');
    expect(screen.getByTestId('derating-reading')).toHaveTextContent('stores 50 % of the derated rating (fraction 0.5)');
    expect(screen.queryByRole('button', { name: /^Use \d/ })).toBeNull();
    // Kept as typed when that was meant: 0.5 % is sent as the fraction 0.005.
    await user.clear(share);
    await user.paste('0.5');
    await user.click(screen.getAllByRole('button', { name: 'Save as v2' })[0]);
    await waitFor(() => expect(api.callsTo('PUT', '/api/house-parts/5/spec')).toHaveLength(1));
    expect((api.callsTo('PUT', '/api/house-parts/5/spec')[0].body as Put).spec).toMatchObject({ power: { pdMin: 0.3, deratingFraction: 0.005 } });
  });
});
