import { screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SourcesView } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, render, renderApp, signInAs } from '@/testing/render';
import { DecisionRecordButton } from './decision-record-button';

// Invented demo data: one house part, a source never qualified and one cleared with conditions.
const VIEW: SourcesView = {
  items: [
    {
      housePart: { id: 4, partNumber: 'OHI-ZD-1047', description: 'Regulator diode 4.7 V, sensor supply clamp', status: 'active' },
      sources: [
        {
          vendorPart: { id: 11, manufacturer: 'Brackenford Semiconductor', mpn: 'BRZ05-4V7', package: 'SOD-123' },
          role: 'approved',
          standing: 'not-qualified',
          caseId: null,
          revision: null,
          conditions: null,
          since: null,
          decidedBy: null,
          openCase: null,
          needsRecheck: false,
          waivers: [],
        },
        {
          vendorPart: { id: 40, manufacturer: 'Quarryhill Semitech', mpn: 'QHZ4V7A', package: 'SOD-123' },
          role: 'alternate',
          standing: 'cleared-with-conditions',
          caseId: 3,
          revision: 2,
          conditions: 'Incoming inspection of leakage on five pieces per lot',
          since: '2026-11-05T18:25:27.000Z',
          decidedBy: { id: 3, name: 'Tomas Eklund' },
          openCase: null,
          needsRecheck: false,
          waivers: [],
        },
      ],
    },
  ],
};

describe('decision record button', () => {
  let clicked: HTMLAnchorElement[];
  beforeEach(() => {
    clicked = [];
    // jsdom has no object URLs and does not download: record what would be saved.
    URL.createObjectURL = vi.fn(() => 'blob:record');
    URL.revokeObjectURL = vi.fn();
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push(this);
    });
  });
  afterEach(() => vi.restoreAllMocks());

  it('is not shown for a case that is not decided', () => {
    render(<DecisionRecordButton caseId={9} state="in-review" />);
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    render(<DecisionRecordButton caseId={9} state="rejected" />);
    expect(screen.getByRole('button', { name: 'Decision record of case #9 (PDF)' })).toBeInTheDocument();
  });

  it('downloads the record of a decided source from Sources with the session token', async () => {
    signInAs('buyer');
    const calls = mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.buyer },
      'GET /api/qualification-views/sources': { body: VIEW },
      'GET /api/qualifications/:id/record': { body: '%PDF-1.3 invented' },
    });
    const { user } = renderApp('/sources');
    const tr = (await screen.findByText('QHZ4V7A')).closest('tr')!;
    // the never-qualified source has no record
    expect(within(screen.getByText('BRZ05-4V7').closest('tr')!).queryByRole('button', { name: /Decision record/ })).not.toBeInTheDocument();
    await user.click(within(tr).getByRole('button', { name: 'Decision record of case #3 (PDF)' }));
    await waitFor(() => expect(calls.callsTo('GET', '/api/qualifications/3/record')).toHaveLength(1));
    expect(calls.callsTo('GET', '/api/qualifications/3/record')[0].headers.Authorization).toBe('Bearer test-token-buyer');
    await waitFor(() => expect(clicked).toHaveLength(1));
    expect(clicked[0].download).toBe('decision-record-case-3.pdf');
    expect(await screen.findByText('decision-record-case-3.pdf was downloaded.')).toBeInTheDocument();
  });

  it('says plainly when the record cannot be fetched', async () => {
    signInAs('buyer');
    mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.buyer },
      'GET /api/qualification-views/sources': { body: VIEW },
      'GET /api/qualifications/:id/record': { status: 503, body: errorBody('The record of case #3 is waiting for the object store; try again in a moment') },
    });
    const { user } = renderApp('/sources');
    await user.click(await screen.findByRole('button', { name: 'Decision record of case #3 (PDF)' }));
    expect(await screen.findByText('Record not downloaded')).toBeInTheDocument();
    expect(screen.getByText(/waiting for the object store/)).toBeInTheDocument();
    expect(clicked).toHaveLength(0);
  });
});
