import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { Link } from 'react-router';
import { describe, expect, it, vi } from 'vitest';
import type { ExtractedVariant, NormalizeResponse, RatingCardView, VendorPartDetail } from '@shuntwise/contracts';
import { errorBody, mockApi, type RecordedCall } from '@/testing/mock-api';
import { currentLocation, render, signInAs } from '@/testing/render';
import { RatingCardEditor } from './rating-card-editor';

// Invented part and datasheet (demo data, no real vendor).
const part: VendorPartDetail = {
  id: 41,
  manufacturer: 'Pellworth Semiconductor',
  mpn: 'PWZ-5V1',
  package: 'SOD-123',
  lifecycleNote: null,
  card: null,
  createdAt: '2026-12-01T09:00:00.000Z',
  updatedAt: '2026-12-01T09:00:00.000Z',
  createdBy: { id: 2, name: 'Priya Raman' },
  datasheets: [{ id: 7, fileName: 'pellworth-pwz.pdf', revision: 'A', pages: 3, createdAt: '2026-12-01T09:00:00.000Z' }],
  sourceOf: [],
};

const box = { x: 300, y: 700, width: 30, height: 10 };
const variant: ExtractedVariant = {
  mpn: 'PWZ-5V1',
  fields: {
    vzMin: { value: '4.85', unit: 'V', si: 4.85, page: 2, text: 'PWZ-5V1 4.85 5.1 5.36 5 10', box },
    vzNom: { value: '5.1', unit: 'V', si: 5.1, page: 2, text: 'PWZ-5V1 4.85 5.1 5.36 5 10', box },
    vzMax: { value: '5.36', unit: 'V', si: 5.36, page: 2, text: 'PWZ-5V1 4.85 5.1 5.36 5 10' },
    izt: { value: '5', unit: 'mA', si: 0.005, page: 2, text: 'PWZ-5V1 4.85 5.1 5.36 5 10' },
    zzt: { value: '10', unit: 'Ω', si: 10, page: 2, text: 'PWZ-5V1 4.85 5.1 5.36 5 10' },
    tc: { value: '−0.8', unit: 'mV/°C', si: -0.0008, page: 2, text: 'αVZ −0.8 mV/°C' },
    pdMax: { value: '500', unit: 'mW', si: 0.5, page: 1, text: 'Ptot 500 mW' },
  },
};
const extraction = { datasheetId: 7, fileName: 'pellworth-pwz.pdf', variants: [variant] };

const emptyCard: RatingCardView = {
  vendorPartId: 41,
  version: 0,
  fields: {},
  note: null,
  updatedAt: null,
  updatedBy: null,
  issues: [],
  engineering: { basis: null, result: null, reason: 'the card needs vzNom and izt' },
};

function stored(value: number, printed: string, source: 'extracted' | 'entered', page: number | null, by = { id: 2, name: 'Priya Raman' }) {
  return {
    value,
    printed,
    provenance: {
      source,
      datasheetId: page ? 7 : null,
      page,
      text: page ? 'PWZ-5V1 4.85 5.1 5.36 5 10' : null,
      confirmedBy: by,
      confirmedAt: '2026-12-01T10:00:00.000Z',
    },
  };
}

const cardV1: RatingCardView = {
  ...emptyCard,
  version: 1,
  fields: {
    vzMin: stored(4.85, '4.85 V', 'extracted', 2),
    vzNom: stored(5.1, '5.1 V', 'extracted', 2),
    vzMax: stored(5.36, '5.36 V', 'extracted', 2),
    izt: stored(0.005, '5 mA', 'extracted', 2),
    zzt: stored(10, '10 Ω', 'extracted', 2),
  },
  updatedAt: '2026-12-01T10:00:00.000Z',
  updatedBy: { id: 2, name: 'Priya Raman' },
};

/** A stand-in for the engineering core's answer; the editor only has to show it. */
function normalized(bv: number): NormalizeResponse {
  return {
    model: { bv, ibv: 0.005, nbv: 1.9, rs: 4.2, nbvVt: 0.049, alphaVz: null, basis: 'izt-only', assumptions: [] },
    points: [{ current: 0.005, tempC: 25, tjC: 25.5, vzMin: 4.85, vzNom: 5.1, vzMax: 5.36, zd: 10 }],
    mechanism: 'mixed',
    warnings: ['one impedance point only'],
    assumptions: [],
    issues: [],
    spiceModel: `.model DZ D(BV=${bv} IBV=5m NBV=1.9 RS=4.2)`,
    caution: 'estimates',
  };
}

function api(overrides: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'POST /api/engineering/normalize': () => ({ body: normalized(5.02) }),
    'PUT /api/vendor-parts/:id/rating-card': (call) => ({ body: { ...cardV1, version: ((call.body as { version: number }).version ?? 0) + 1 } }),
    'GET /api/vendor-parts/:id/rating-card/versions': { body: [] },
    ...overrides,
  });
}

type PutBody = {
  version: number;
  fields: Record<string, { value: number; printed?: string; unit?: string; provenance: Record<string, unknown>; confirmed: boolean }>;
};
const body = (call: RecordedCall) => call.body as PutBody;

describe('RatingCardEditor', () => {
  it('takes a suggestion with one click, keeping its datasheet, page and text, and jumps the viewer there', async () => {
    signInAs('engineer');
    const calls = api();
    const onShowSource = vi.fn();
    const { user } = render(<RatingCardEditor vendorPart={part} card={emptyCard} extraction={extraction} onShowSource={onShowSource} />);

    await user.click(screen.getByRole('button', { name: 'Use 5.10 V for VZ nom' }));
    expect(screen.getByLabelText(/^VZ nom \(/)).toHaveValue('5.1 V');
    expect(within(screen.getByTestId('provenance-vzNom')).getByText('Extracted')).toBeInTheDocument();
    expect(within(screen.getByTestId('provenance-vzNom')).getByText('page 2')).toBeInTheDocument();
    expect(onShowSource).toHaveBeenLastCalledWith(expect.objectContaining({ datasheetId: 7, page: 2, box }));

    // The rest in one go; the temperature coefficient keeps the unit the datasheet used.
    await user.click(screen.getByRole('button', { name: /Accept all suggestions \(6\)/ }));
    expect(screen.getByLabelText(/^αVZ \(/)).toHaveValue('-0.8 mV/K');
    await user.click(screen.getAllByRole('button', { name: 'Save card' })[0]);

    await waitFor(() => expect(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')).toHaveLength(1));
    const sent = body(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')[0]);
    expect(sent.version).toBe(0);
    expect(sent.fields.vzNom).toEqual({
      value: 5.1,
      printed: '5.1 V',
      provenance: { source: 'extracted', datasheetId: 7, page: 2, text: 'PWZ-5V1 4.85 5.1 5.36 5 10' },
      confirmed: true,
    });
    expect(sent.fields.izt.value).toBe(0.005);
    // −0.8 mV/°C is −0.8 mV/K: a kelvin and a degree Celsius are the same step (SI Brochure, 9th ed., from memory).
    expect(sent.fields.tc).toMatchObject({ value: -0.8, unit: 'mV/K', provenance: { source: 'extracted', page: 2 } });
    expect(Object.keys(sent.fields).sort()).toEqual(['izt', 'pdMax', 'tc', 'vzMax', 'vzMin', 'vzNom', 'zzt']);
  });

  it('marks a typed value as entered, reads its unit and shows the live engineering reading', async () => {
    signInAs('engineer');
    const calls = api();
    const { user } = render(<RatingCardEditor vendorPart={part} card={cardV1} extraction={extraction} onShowSource={() => {}} />);

    const zzt = screen.getByLabelText(/^ZZT \(/);
    await user.clear(zzt);
    await user.type(zzt, '8 ohm');
    expect(within(screen.getByTestId('provenance-zzt')).getByText('Entered')).toBeInTheDocument();
    expect(within(screen.getByTestId('provenance-zzt')).getByText('unsaved')).toBeInTheDocument();
    expect(screen.getByTestId('unsaved')).toHaveTextContent('1 unsaved change');
    // The datasheet still offers its own figure beside the corrected one.
    expect(screen.getByRole('button', { name: 'Use 10.0 Ω for ZZT' })).toBeInTheDocument();

    // The engineering core is asked with the card as typed: 8 Ω, in SI.
    await waitFor(() =>
      expect(calls.callsTo('POST', '/api/engineering/normalize').some((c) => (c.body as { card: { zzt: number } }).card.zzt === 8)).toBe(true),
    );
    const request = calls.callsTo('POST', '/api/engineering/normalize').at(-1)!.body as { currents: number[]; temperaturesC: number[] };
    // No house part: its own test current and the standard 1, 5, 10, 20 mA, once each.
    expect(request.currents).toEqual([0.001, 0.005, 0.01, 0.02]);
    expect(request.temperaturesC).toEqual([25]);
    expect(await screen.findByTestId('mechanism')).toHaveTextContent('Mixed');
    expect(screen.getByTestId('spice-model')).toHaveTextContent('.model DZ D(BV=5.02');

    await user.click(screen.getAllByRole('button', { name: 'Save card' })[0]);
    await waitFor(() => expect(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')).toHaveLength(1));
    const sent = body(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')[0]);
    expect(sent.version).toBe(1);
    expect(sent.fields.zzt).toEqual({ value: 8, printed: '8 Ω', provenance: { source: 'entered' }, confirmed: true });
    expect(sent.fields.vzNom.provenance).toMatchObject({ source: 'extracted', page: 2 });
  });

  it('refuses an unreadable value on the field itself and sends nothing', async () => {
    signInAs('engineer');
    const calls = api();
    const { user } = render(<RatingCardEditor vendorPart={part} card={cardV1} extraction={extraction} onShowSource={() => {}} />);
    const izt = screen.getByLabelText(/^IZT \(/);
    await user.clear(izt);
    await user.type(izt, '5 mV');
    await user.tab();
    expect(screen.getByText(/IZT: cannot read "5 mV" as a current/)).toBeInTheDocument();
    await user.click(screen.getAllByRole('button', { name: 'Save card' })[0]);
    expect(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')).toHaveLength(0);
    expect(izt).toHaveValue('5 mV');
  });

  it('puts the API’s field errors on their fields and keeps the values', async () => {
    signInAs('engineer');
    api({
      'PUT /api/vendor-parts/:id/rating-card': {
        status: 400,
        body: errorBody('Invalid request: fields.zzt.value: zzt (900 Ω) × izt (0.005 A) is not below vzNom', [
          { path: 'fields.zzt.value', message: 'ZZT (900 Ω) × IZT (5 mA) is not below VZ nom (5.1 V)' },
        ]),
      },
    });
    const { user } = render(<RatingCardEditor vendorPart={part} card={cardV1} extraction={extraction} onShowSource={() => {}} />);
    const vzMax = screen.getByLabelText(/^VZ max \(/);
    await user.clear(vzMax);
    await user.type(vzMax, '5.4 V');
    await user.click(screen.getAllByRole('button', { name: 'Save card' })[0]);
    expect(await screen.findByText('ZZT (900 Ω) × IZT (5 mA) is not below VZ nom (5.1 V)')).toBeInTheDocument();
    expect(screen.getByLabelText(/^ZZT \(/)).toHaveAttribute('aria-invalid', 'true');
    expect(vzMax).toHaveValue('5.4 V');
  });

  it('on a stale save shows both versions to merge, loses nothing typed, and saves the merge on top of the newer version', async () => {
    signInAs('engineer');
    const theirs: RatingCardView = {
      ...cardV1,
      version: 2,
      fields: {
        ...cardV1.fields,
        zzt: stored(11, '11 Ω', 'entered', null, { id: 3, name: 'Tomas Eklund' }),
        vzMax: stored(5.4, '5.4 V', 'entered', null, { id: 3, name: 'Tomas Eklund' }),
      },
      updatedBy: { id: 3, name: 'Tomas Eklund' },
      updatedAt: '2026-12-01T11:00:00.000Z',
    };
    let puts = 0;
    const calls = api({
      'PUT /api/vendor-parts/:id/rating-card': () => {
        puts += 1;
        if (puts === 1)
          return {
            status: 409,
            body: { message: 'The card is at version 2; you edited version 1', code: 'stale', correlationId: 'c0ffee00-test', current: theirs },
          };
        return { body: { ...theirs, version: 3, fields: { ...theirs.fields, zzt: stored(8, '8 Ω', 'entered', null) } } };
      },
    });
    const { user } = render(<RatingCardEditor vendorPart={part} card={cardV1} extraction={extraction} onShowSource={() => {}} />);

    const zzt = screen.getByLabelText(/^ZZT \(/);
    await user.clear(zzt);
    await user.type(zzt, '8');
    await user.click(screen.getAllByRole('button', { name: 'Save card' })[0]);

    const dialog = await screen.findByRole('dialog', { name: 'The card was saved by someone else meanwhile' });
    const table = within(dialog).getByRole('table', { name: 'Both versions of the card' });
    const zztRow = within(table).getByText('ZZT').closest('tr')!;
    expect(zztRow).toHaveAttribute('data-conflict', 'true');
    expect(within(zztRow).getByText('both changed')).toBeInTheDocument();
    expect(within(zztRow).getByText('8.000 Ω')).toBeInTheDocument();
    expect(within(zztRow).getByText('11.00 Ω')).toBeInTheDocument();
    // Only the other side changed VZ max: theirs is preselected; ZZT (both changed) keeps ours.
    const vzMaxRow = within(table).getByText('VZ max').closest('tr')!;
    expect(within(vzMaxRow).getByRole('radio', { name: 'v2' })).toBeChecked();
    expect(within(zztRow).getByRole('radio', { name: 'yours' })).toBeChecked();

    // Closing keeps everything typed.
    await user.click(within(dialog).getByRole('button', { name: 'Keep editing' }));
    expect(screen.getByLabelText(/^ZZT \(/)).toHaveValue('8');
    await user.click(screen.getByRole('button', { name: 'Compare and merge' }));
    const again = await screen.findByRole('dialog', { name: 'The card was saved by someone else meanwhile' });
    await user.click(within(again).getByRole('button', { name: 'Save the chosen values as v3' }));

    await waitFor(() => expect(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')).toHaveLength(2));
    const sent = body(calls.callsTo('PUT', '/api/vendor-parts/41/rating-card')[1]);
    expect(sent.version).toBe(2);
    expect(sent.fields.zzt.value).toBe(8);
    expect(sent.fields.vzMax.value).toBe(5.4);
    expect(sent.fields.vzNom.value).toBe(5.1);
    await waitFor(() => expect(screen.getByTestId('card-version')).toHaveTextContent('v3'));
  }, 20_000);

  it('asks before a link leaves unsaved edits, and stays when told to', { timeout: 60_000 }, async () => {
    signInAs('engineer');
    api();
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    const { user } = render(
      <>
        <Link to="/board">Board</Link>
        <RatingCardEditor vendorPart={part} card={cardV1} extraction={extraction} onShowSource={() => {}} />
      </>,
      { route: '/vendor-parts/5' },
    );
    const zzt = screen.getByLabelText(/^ZZT \(/);
    await user.clear(zzt);
    await user.type(zzt, '9 Ω');
    await user.tab();
    fireEvent.click(screen.getByRole('link', { name: 'Board' }));
    expect(confirm).toHaveBeenCalledWith(expect.stringMatching(/rating card has unsaved changes/));
    expect(currentLocation()).toBe('/vendor-parts/5');
    expect(zzt).toHaveValue('9 Ω');
    confirm.mockReturnValue(true);
    fireEvent.click(screen.getByRole('link', { name: 'Board' }));
    await waitFor(() => expect(currentLocation()).toBe('/board'));
    confirm.mockRestore();
  });
});
