import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { measurementSetSchema, type MeasurementCsvReading, type MeasurementSet } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { mockXhr } from '@/testing/mock-xhr';
import { render, signInAs } from '@/testing/render';
import { MeasurementsPanel } from './measurements-panel';

const point = (current: number, voltage: number) => ({ current, voltage, tempC: 25 });
const sample = (sampleId: string, lot: string, v: number) => ({
  sampleId,
  lot,
  points: [point(0.0005, v - 0.1), point(0.001, v - 0.07), point(0.005, v), point(0.02, v + 0.08)],
});
const result = (sampleId: string, lot: string, vzAtIzt: number) => ({
  sampleId,
  lot,
  points: 4,
  temperaturesC: [25],
  model: { bv: vzAtIzt - 0.02, ibv: 0.005, nbv: 2, rs: 4, nbvVt: 0.0514, alphaVz: null, basis: 'measured' as const, assumptions: [] },
  residualRms: 0.0002,
  currentRange: { min: 0.0005, max: 0.02 },
  vzAtIzt,
  vzAtIRef: null,
  zdAtIzt: 14.3,
  zdAtIRef: null,
  zdAtKnee: 210,
  alphaVz: null,
  warnings: [],
  error: null,
});

const SET: MeasurementSet = measurementSetSchema.parse({
  id: 4,
  vendorPartId: 9,
  fileName: 'lot-2351.csv',
  sha256: 'a'.repeat(64),
  sizeBytes: 400,
  lot: null,
  instrument: 'curve tracer 2',
  measuredOn: '2026-11-30',
  note: null,
  uploadedBy: { id: 2, name: 'Priya Raman' },
  createdAt: '2026-12-01T09:00:00.000Z',
  samples: [sample('A1', 'L2340', 5.1), sample('B1', 'L2351', 5.42)],
  analysis: {
    cardVersion: 2,
    housePartId: null,
    specVersion: null,
    referenceCurrent: 0.005,
    samples: [result('A1', 'L2340', 5.1), result('B1', 'L2351', 5.42)],
    lots: [
      { lot: 'L2340', samples: 1, vzAtIzt: { n: 1, mean: 5.1, min: 5.1, max: 5.1, stdDev: 0 }, vzAtIRef: null, zdAtIzt: null, zdAtKnee: null },
      { lot: 'L2351', samples: 1, vzAtIzt: { n: 1, mean: 5.42, min: 5.42, max: 5.42, stdDev: 0 }, vzAtIRef: null, zdAtIzt: null, zdAtKnee: null },
      { lot: null, samples: 2, vzAtIzt: { n: 2, mean: 5.26, min: 5.1, max: 5.42, stdDev: 0.226 }, vzAtIRef: null, zdAtIzt: null, zdAtKnee: null },
    ],
    checks: [
      {
        id: 'card-vz',
        label: 'Zener voltage at the card’s test current, within the datasheet’s limits',
        against: 'card',
        verdict: 'fail',
        quantity: 'voltage',
        limitKind: 'window',
        value: 5.42,
        limit: 5.36,
        window: { min: 4.85, max: 5.36 },
        margin: -1.12,
        failingSamples: ['B1'],
        detail: '2 sample(s) at 5 mA, 25 °C: 5.10 V … 5.42 V against 4.85 V … 5.36 V; outside: B1',
      },
    ],
    datasheetBand: [
      { current: 0.0005, low: 4.75, nom: 5.0, high: 5.26 },
      { current: 0.02, low: 4.93, nom: 5.18, high: 5.44 },
    ],
    overall: 'fail',
    assumptions: [],
    warnings: [],
    caution: 'Estimates.',
  },
});

const reading = (errors: MeasurementCsvReading['errors']): MeasurementCsvReading => ({
  columns: [],
  samples: [{ sampleId: 'C1', lot: null, points: [point(0.001, 5), point(0.002, 5.02), point(0.005, 5.05), point(0.01, 5.08)] }],
  errors,
  warnings: [],
});

describe('Measured samples on the vendor part', () => {
  it('shows each set against the datasheet limits, naming the samples outside them, with the spread per lot', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/vendor-parts/9/measurement-sets': { body: [SET] } });
    render(<MeasurementsPanel vendorPartId={9} canUpload />);
    const set = await screen.findByRole('article', { name: 'Measurement set lot-2351.csv' });
    expect(within(set).getByRole('cell', { name: /outside: B1/ })).toBeInTheDocument();
    expect(within(set).getAllByText('fail').length).toBeGreaterThan(0);
    expect(set).toHaveTextContent('−1.1 %');
    expect(set).toHaveTextContent('all lots');
    expect(set).toHaveTextContent('curve tracer 2');
    expect(screen.getByRole('img', { name: /Measured points of 2 sample/ })).toBeInTheDocument();
  });

  it('previews a file: row errors keep it from being stored; a clean file is stored with its lot and instrument', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/vendor-parts/9/measurement-sets': { body: [] } });
    let previewErrors: MeasurementCsvReading['errors'] = [{ row: 3, column: 'current (mA)', message: '"x" is not a current' }];
    const xhr = mockXhr((call) => (call.url.endsWith('/preview') ? { status: 200, body: reading(previewErrors) } : { status: 201, body: SET }));
    const { user } = render(<MeasurementsPanel vendorPartId={9} canUpload />);
    await screen.findByText('No bench measurements of this part yet.');
    const input = document.querySelector('input[type="file"]') as HTMLInputElement;
    await user.upload(input, new File(['sample,current (mA)\n'], 'bad.csv', { type: 'text/csv' }));
    expect(await screen.findByText('Row 3, current (mA): "x" is not a current')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Store measurements' })).toBeDisabled();

    previewErrors = [];
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    await user.upload(document.querySelector('input[type="file"]') as HTMLInputElement, new File(['ok'], 'good.csv', { type: 'text/csv' }));
    await screen.findByText(/1 sample\(s\), 4 point\(s\) read\./);
    await user.type(screen.getByLabelText('Lot or date code'), 'L2351');
    await user.type(screen.getByLabelText('Instrument'), 'curve tracer 2');
    await user.click(screen.getByRole('button', { name: 'Store measurements' }));
    await waitFor(() => expect(xhr.calls.filter((c) => c.url === '/api/measurement-sets')).toHaveLength(1));
    const form = xhr.calls.find((c) => c.url === '/api/measurement-sets')!.form!;
    expect(form.get('vendorPartId')).toBe('9');
    expect(form.get('lot')).toBe('L2351');
    expect(form.get('instrument')).toBe('curve tracer 2');
  });

  it('offers no upload to a reader', async () => {
    signInAs('admin');
    mockApi({ 'GET /api/vendor-parts/9/measurement-sets': { body: [] } });
    render(<MeasurementsPanel vendorPartId={9} canUpload={false} />);
    await screen.findByText('No bench measurements of this part yet.');
    expect(screen.queryByRole('button', { name: /Choose a measurement CSV/ })).toBeNull();
  });
});
