import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { RatingCardVersionSummary } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { render, signInAs } from '@/testing/render';
import { CardVersionsModal, describeChange } from './card-versions-modal';

// Invented card history (demo data). Expected texts: SI prefixes (BIPM SI Brochure, 9th
// edition, from memory), four figures as the version view prints them, a true minus U+2212.
const versions: RatingCardVersionSummary[] = [
  {
    version: 2,
    changedFields: ['zzt', 'tc', 'irMax', 'izk'],
    changes: [
      { field: 'zzt', from: { value: 40 }, to: { value: 38 } },
      { field: 'tc', from: { value: 0.3, unit: 'mV/K' }, to: { value: -0.6, unit: 'mV/K' } },
      { field: 'irMax', from: null, to: { value: 2e-6 } },
      { field: 'izk', from: { value: 0.00025 }, to: { value: 0.00025 } },
    ],
    note: 'datasheet rev B',
    changedBy: { id: 3, name: 'Tomas Eklund' },
    createdAt: '2026-12-02T10:00:00.000Z',
  },
  {
    version: 1,
    changedFields: ['vzNom', 'izt'],
    changes: [
      { field: 'vzNom', from: null, to: { value: 5.1 } },
      { field: 'izt', from: null, to: { value: 0.005 } },
    ],
    note: null,
    changedBy: { id: 2, name: 'Priya Raman' },
    createdAt: '2026-12-01T09:00:00.000Z',
  },
];

describe('card history', () => {
  it('says old → new for each changed field, in the shared formatter’s units', () => {
    expect(describeChange(versions[0].changes[0])).toBe('ZZT 40.00 Ω → 38.00 Ω');
    expect(describeChange(versions[0].changes[1])).toBe('αVZ 0.300 mV/K → \u22120.600 mV/K');
    expect(describeChange(versions[0].changes[2])).toBe('IR max – → 2.000 µA');
    expect(describeChange(versions[0].changes[3])).toBe('IZK 250.0 µA: source or confirmation');
  });

  it('lists each version with its changes, the first as the fields it set', async () => {
    signInAs('designer');
    mockApi({ 'GET /api/vendor-parts/:id/rating-card/versions': { body: versions } });
    render(<CardVersionsModal vendorPartId={52} opened onClose={() => undefined} />);
    const table = await screen.findByRole('table', { name: 'Card versions' });
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('ZZT 40.00 Ω → 38.00 Ω');
    expect(rows[1]).toHaveTextContent('αVZ 0.300 mV/K → −0.600 mV/K');
    expect(rows[2]).toHaveTextContent('first version: VZ nom, IZT');
  });
});
