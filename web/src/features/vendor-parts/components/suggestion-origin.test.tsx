import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { ExtractedVariant, RatingCardView, VendorPartDetail } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { render, signInAs } from '@/testing/render';
import { RatingCardEditor } from './rating-card-editor';
import { needsCloserLook, originsOf } from './suggestion-origin';

// Invented part and datasheet (demo data, no real vendor).
const part: VendorPartDetail = {
  id: 52,
  manufacturer: 'Pellworth Semiconductor',
  mpn: 'PWZ-6V2B',
  package: 'SOD-123',
  lifecycleNote: null,
  card: null,
  createdAt: '2026-12-01T09:00:00.000Z',
  updatedAt: '2026-12-01T09:00:00.000Z',
  createdBy: { id: 2, name: 'Priya Raman' },
  datasheets: [{ id: 9, fileName: 'pellworth-pwz-scan.pdf', revision: 'A', pages: 2, createdAt: '2026-12-01T09:00:00.000Z' }],
  sourceOf: [],
};

const row = 'PWZ-6V2B 6.08 6.2 6.32 5 10';
const variant: ExtractedVariant = {
  mpn: 'PWZ-6V2B',
  fields: {
    // Read by OCR from a scanned page, in a table.
    vzNom: { value: '6.2', unit: 'V', si: 6.2, page: 2, text: row, method: 'table', ocr: true },
    // Worked out from the "B" (±2 %) suffix: 6.2 V × 0.98 = 6.076 V (common practice for tolerance suffixes, no source).
    vzMin: { value: '6.076', unit: 'V', si: 6.076, page: 1, text: 'B = ±2 %', method: 'list', derived: 'tolerance-suffix' },
    // A %/K figure converted with VZnom: 0.05 %/K of 6.2 V = 3.1 mV/K (the definition of a relative coefficient, no source).
    tc: {
      value: '0.05',
      unit: '%/K',
      si: 0.0031,
      page: 2,
      text: 'TC 0.05 %/K',
      method: 'sentence',
      derived: 'converted',
      note: 'converted from 0.05 %/K with VZnom = 6.2 V',
    },
    // Plainly printed in a table of a text page.
    izt: { value: '5', unit: 'mA', si: 0.005, page: 2, text: row, method: 'table' },
  },
};
const extraction = { datasheetId: 9, fileName: 'pellworth-pwz-scan.pdf', variants: [variant] };

const emptyCard: RatingCardView = {
  vendorPartId: 52,
  version: 0,
  fields: {},
  note: null,
  updatedAt: null,
  updatedBy: null,
  issues: [],
  engineering: { basis: null, result: null, reason: 'the card needs vzNom and izt' },
};

describe('suggestion origin in the card editor', () => {
  it('says per suggestion where it was read, and flags OCR and derived values to check first', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/vendor-parts/:id/rating-card/versions': { body: [] } });
    const { user } = render(<RatingCardEditor vendorPart={part} card={emptyCard} extraction={extraction} onShowSource={() => undefined} />);

    const vzNom = within(screen.getByTestId('origin-vzNom'));
    expect(vzNom.getByText('check: scan')).toBeInTheDocument();
    expect(vzNom.getByLabelText(/^scan: /)).toHaveAttribute('data-flagged', 'true');
    expect(vzNom.getByLabelText(/^table: /)).not.toHaveAttribute('data-flagged');
    expect(within(screen.getByTestId('origin-vzMin')).getByLabelText(/^from suffix: /)).toHaveAttribute('data-flagged', 'true');
    expect(within(screen.getByTestId('origin-tc')).getByLabelText(/^converted: /)).toHaveAttribute('data-flagged', 'true');
    expect(within(screen.getByTestId('origin-tc')).getByText('sentence')).toBeInTheDocument();
    // A plain table value carries its origin but no flag.
    const izt = within(screen.getByTestId('origin-izt'));
    expect(izt.getByText('table')).toBeInTheDocument();
    expect(izt.queryByText(/^check:/)).toBeNull();

    // The suggestion bar lists the flagged ones, in card order.
    expect(screen.getByTestId('check-first')).toHaveTextContent('Check first against the page: VZ min (from suffix), VZ nom (scan), αVZ (converted)');

    // The tooltip says in plain words what to check.
    await user.hover(vzNom.getByText('check: scan'));
    expect(await screen.findByText(/read from the page image by OCR/)).toBeInTheDocument();
  });

  it('flags nothing and shows no badge for a value with no recorded origin', () => {
    expect(originsOf({ page: 1 })).toEqual([]);
    expect(needsCloserLook({})).toBe(false);
    expect(needsCloserLook({ ocr: true })).toBe(true);
    expect(originsOf({ page: 3, method: 'list', derived: 'converted', note: 'from 0.05 %/K' }).map((o) => [o.label, o.flagged])).toEqual([
      ['converted', true],
      ['list', false],
    ]);
  });
});
