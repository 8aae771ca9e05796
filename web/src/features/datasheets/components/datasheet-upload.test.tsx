import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { ExtractionResult } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { mockXhr } from '@/testing/mock-xhr';
import { render, signInAs } from '@/testing/render';
import { DatasheetUpload } from './datasheet-upload';

const extraction: ExtractionResult = {
  variants: [
    { mpn: 'PWZ-5V1', fields: { vzNom: { value: '5.1', unit: 'V', si: 5.1, page: 2, text: 'PWZ-5V1 5.1' } } },
    { mpn: 'PWZ-5V6', fields: { vzNom: { value: '5.6', unit: 'V', si: 5.6, page: 2, text: 'PWZ-5V6 5.6' } } },
  ],
  warnings: ['PWZ-6V2: zzt "n/a" could not be read'],
  pages: 2,
  hasText: true,
};

function pdf(name: string, bytes = 2048): File {
  return new File([new Uint8Array(bytes)], name, { type: 'application/pdf' });
}

function fileInput(): HTMLInputElement {
  return document.querySelector('input[type="file"]')!;
}

describe('DatasheetUpload', () => {
  it('uploads each file with its own progress and shows, per file, what was found or why it was refused', async () => {
    const session = signInAs('engineer');
    mockApi({ 'GET /api/datasheets/:id/extraction': { body: extraction } });
    const xhr = mockXhr((call) => {
      const file = call.form!.get('file') as File;
      if (file.name === 'renamed-image.pdf') {
        return {
          status: 415,
          body: {
            message: 'The file is not a PDF: it does not start with the PDF signature (%PDF-). It looks like a PNG image.',
            correlationId: 'c0ffee00-test',
          },
        };
      }
      return {
        status: 201,
        body: { id: 12, sha256: 'ab', pages: 2, sizeBytes: file.size, fileName: file.name, createdAt: '2026-12-01T10:00:00.000Z', existing: false },
      };
    });
    const onUploaded = vi.fn();
    const { user } = render(<DatasheetUpload vendorPartId={41} onUploaded={onUploaded} />);

    await user.upload(fileInput(), [pdf('pellworth-pwz.pdf'), pdf('renamed-image.pdf')]);

    const items = await screen.findAllByTestId('upload-item');
    expect(items).toHaveLength(2);
    const good = () => screen.getByRole('listitem', { name: 'Upload of pellworth-pwz.pdf' });
    const bad = () => screen.getByRole('listitem', { name: 'Upload of renamed-image.pdf' });

    await waitFor(() => expect(good()).toHaveAttribute('data-status', 'done'));
    expect(await within(good()).findByTestId('extraction-summary')).toHaveTextContent('2 pages · 2 parts found, 2 values · 1 warning');
    expect(within(good()).getByText('PWZ-5V1, PWZ-5V6')).toBeInTheDocument();
    expect(within(good()).getByText(/zzt "n\/a" could not be read/)).toBeInTheDocument();

    await waitFor(() => expect(bad()).toHaveAttribute('data-status', 'failed'));
    expect(within(bad()).getByRole('alert')).toHaveTextContent(
      'The file is not a PDF: it does not start with the PDF signature (%PDF-). It looks like a PNG image. (ref. c0ffee00-test)',
    );
    expect(screen.getByText('1 of 2 files refused; the others are not affected.')).toBeInTheDocument();

    // Multipart with the token and the vendor part, one request per file.
    expect(xhr.calls).toHaveLength(2);
    for (const call of xhr.calls) {
      expect(call.url).toBe('/api/datasheets');
      expect(call.headers.Authorization).toBe(`Bearer ${session.accessToken}`);
      expect(call.form!.get('vendorPartId')).toBe('41');
    }
    expect(onUploaded).toHaveBeenCalledTimes(1);
    expect(onUploaded.mock.calls[0][0]).toMatchObject({ id: 12, fileName: 'pellworth-pwz.pdf' });
  });

  it('shows the bar moving while a file goes up', async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/datasheets/:id/extraction': { body: extraction } });
    let release: () => void = () => {};
    mockXhr(
      () =>
        new Promise((resolve) => {
          release = () =>
            resolve({
              status: 200,
              body: { id: 4, sha256: 'cd', pages: 2, sizeBytes: 10, fileName: 'same.pdf', createdAt: '2026-12-01T10:00:00.000Z', existing: true },
              progress: [0.25, 0.75],
            });
        }),
    );
    const { user } = render(<DatasheetUpload />);
    await user.upload(fileInput(), [pdf('same.pdf')]);
    const item = await screen.findByRole('listitem', { name: 'Upload of same.pdf' });
    expect(within(item).getByRole('progressbar', { name: 'Upload progress of same.pdf' })).toBeInTheDocument();
    release();
    await waitFor(() => expect(within(item).getByText('75 %')).toBeInTheDocument());
    await waitFor(() => expect(item).toHaveAttribute('data-status', 'done'));
    // The same bytes again: the API answers with the stored datasheet, and the list says so.
    expect(within(item).getByText('already stored')).toBeInTheDocument();
    expect(await within(item).findByTestId('extraction-summary')).toHaveTextContent(/^Already stored \(same file\)/);
  });

  it('refuses a file that is not a PDF before sending it', async () => {
    signInAs('engineer');
    mockApi({});
    const xhr = mockXhr(() => ({ status: 500 }));
    render(<DatasheetUpload />);
    // Past the file chooser's own filter, as a drag and drop would be.
    fireEvent.change(fileInput(), { target: { files: [new File(['a,b'], 'series.csv', { type: 'text/csv' })] } });
    const item = await screen.findByRole('listitem', { name: 'Upload of series.csv' });
    expect(within(item).getByRole('alert')).toHaveTextContent('series.csv is not a PDF: upload datasheets as PDF files.');
    expect(xhr.calls).toHaveLength(0);
  });
});
