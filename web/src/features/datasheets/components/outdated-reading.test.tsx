import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { ExtractionResult } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { createTestQueryClient, render, signInAs } from '@/testing/render';
import { datasheetKeys } from '../api/datasheet-keys';
import { OutdatedReading } from './outdated-reading';

const fresh: ExtractionResult = {
  variants: [{ mpn: 'PWZ-5V1', fields: { vzNom: { value: '5.1', unit: 'V', si: 5.1, page: 2, text: 'PWZ-5V1 5.1' } } }],
  warnings: [],
  pages: 2,
  hasText: true,
  outdated: false,
};

describe('OutdatedReading', () => {
  it('has an engineer read the stored file again and puts the fresh reading in place of the old', async () => {
    signInAs('engineer');
    const api = mockApi({ 'POST /api/datasheets/:id/extraction': { body: fresh }, 'GET /api/datasheets/:id': { body: {} } });
    const queryClient = createTestQueryClient();
    queryClient.setQueryData(datasheetKeys.extraction(12), { ...fresh, variants: [], outdated: true });
    const { user } = render(<OutdatedReading datasheetId={12} canReadAgain />, { queryClient });
    expect(screen.getByTestId('outdated-reading')).toHaveTextContent(/earlier version of the datasheet reader/);
    await user.click(screen.getByRole('button', { name: 'Read the datasheet again' }));
    await waitFor(() => expect(queryClient.getQueryData(datasheetKeys.extraction(12))).toEqual(fresh));
    expect(api.calls.filter((c) => c.method === 'POST').map((c) => c.path)).toEqual(['/api/datasheets/12/extraction']);
  });

  it('names the reason when the file could not be read again', async () => {
    signInAs('engineer');
    mockApi({
      'POST /api/datasheets/:id/extraction': {
        status: 422,
        body: { message: 'The PDF could not be read: its page tree is broken.', correlationId: 'c0ffee00-test' },
      },
    });
    const { user } = render(<OutdatedReading datasheetId={12} canReadAgain />);
    await user.click(screen.getByRole('button', { name: 'Read the datasheet again' }));
    expect(await screen.findByText(/Not read again/)).toHaveTextContent(
      'Not read again: The PDF could not be read: its page tree is broken. (ref. c0ffee00-test)',
    );
  });

  it('offers no button to someone who may not read a file again', () => {
    signInAs('designer');
    mockApi({});
    render(<OutdatedReading datasheetId={12} canReadAgain={false} />);
    expect(screen.queryByRole('button', { name: 'Read the datasheet again' })).toBeNull();
    expect(screen.getByText('An engineer can have it read again.')).toBeInTheDocument();
  });
});
