import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { ExtractionResult } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { mockXhr } from '@/testing/mock-xhr';
import { render, signInAs } from '@/testing/render';
import { DatasheetUpload } from './datasheet-upload';

// Invented parts and files (demo data, no real vendor).
const ocrScan: ExtractionResult = {
  variants: [{ mpn: 'PWZ-5V1', fields: { vzNom: { value: '5.1', unit: 'V', si: 5.1, page: 1, text: 'PWZ-5V1 5.1', ocr: true, method: 'table' } } }],
  warnings: ['page 2: no text layer and OCR found no ratings. Enter that page’s ratings by hand.'],
  pages: 2,
  hasText: false,
};
const blankScan: ExtractionResult = { variants: [], warnings: ['page 1: no text layer and OCR found no ratings.'], pages: 1, hasText: false };

describe('DatasheetUpload of scans', () => {
  it.each([
    [ocrScan, '2 pages · a scan read by OCR: 1 part, 1 value to check against the page · 1 warning'],
    [blankScan, '1 page · no text layer (a scan): OCR found no ratings · 1 warning'],
  ])('says what OCR made of a scan', async (extraction, summary) => {
    signInAs('engineer');
    mockApi({ 'GET /api/datasheets/:id/extraction': { body: extraction } });
    mockXhr((call) => {
      const file = call.form!.get('file') as File;
      return {
        status: 201,
        body: {
          id: 13,
          sha256: 'cd',
          pages: extraction.pages,
          sizeBytes: file.size,
          fileName: file.name,
          createdAt: '2026-12-01T10:00:00.000Z',
          existing: false,
        },
      };
    });
    const { user } = render(<DatasheetUpload vendorPartId={41} onUploaded={() => undefined} />);
    await user.upload(document.querySelector('input[type="file"]') as HTMLInputElement, [
      new File([new Uint8Array(2048)], 'scan.pdf', { type: 'application/pdf' }),
    ]);
    const item = () => screen.getByRole('listitem', { name: 'Upload of scan.pdf' });
    await waitFor(() => expect(item()).toHaveAttribute('data-status', 'done'));
    expect(await within(item()).findByTestId('extraction-summary')).toHaveTextContent(summary);
    expect(within(item()).getByText(/no text layer and OCR found no ratings/)).toBeInTheDocument();
  });
});
