import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { render } from '@/testing/render';
import { searchItem } from '../testing/fixtures';
import { ClearanceList } from './clearance-list';

// Invented demo data: a part a second engineer rejected for one house part.
const RULED_OUT = {
  housePart: { id: 9, partNumber: 'OHI-ZD-2082', description: 'Regulator diode 8.2 V', status: 'active' as const },
  state: 'rejected' as const,
  caseId: 14,
  reason: 'Reverse leakage is 25 % above the spec limit at 5.7 V.',
  at: '2026-11-15T10:00:00.000Z',
  by: { id: 3, name: 'Tomas Eklund' },
};

describe('ClearanceList', () => {
  it('tells the designer which house part the part was rejected for, why and by whom', () => {
    render(<ClearanceList item={searchItem(7, 'TPZ15-8V2', { cleared: false, clearances: [], ruledOut: [RULED_OUT] })} linkHouseParts={false} />);
    const list = screen.getByLabelText('Ruled out');
    expect(list).toHaveTextContent('Rejected');
    expect(list).toHaveTextContent('OHI-ZD-2082');
    expect(list).toHaveTextContent('by Tomas Eklund');
    expect(list).toHaveTextContent('Rejected: Reverse leakage is 25 % above the spec limit at 5.7 V.');
  });

  it('says it beside the clearances of a part cleared for another house part', () => {
    render(
      <ClearanceList
        item={searchItem(7, 'TPZ15-8V2', { ruledOut: [{ ...RULED_OUT, state: 'revoked', reason: 'Assembly moved to a new site.' }] })}
        linkHouseParts={false}
      />,
    );
    expect(screen.getByLabelText('Ruled out')).toHaveTextContent('Revoked: Assembly moved to a new site.');
  });

  it('shows nothing of the kind when no decision ruled the part out', () => {
    render(<ClearanceList item={searchItem(7, 'TPZ15-11')} linkHouseParts={false} />);
    expect(screen.queryByLabelText('Ruled out')).not.toBeInTheDocument();
  });
});
