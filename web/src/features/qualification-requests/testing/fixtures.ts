import type { HousePart, HousePartPage, QualificationRequest, QualificationRequestPage } from '@shuntwise/contracts';

// Invented demo requests and house parts, shaped as the API answers them.
export function request(id: number, over: Partial<QualificationRequest> = {}): QualificationRequest {
  return {
    id,
    vendorPart: { id: 60, manufacturer: 'Nettlecombe Devices', mpn: 'NMZ-05V6', package: 'SOD-123' },
    housePart: null,
    note: 'Reference for the loop driver on the new transmitter board; the approved part is on allocation.',
    neededBy: '2027-03-31',
    state: 'open',
    requestedBy: { id: 4, name: 'Nadia Okafor' },
    createdAt: '2026-11-28T09:30:00.000Z',
    closedBy: null,
    closedAt: null,
    reply: null,
    case: null,
    ruledOut: null,
    ...over,
  };
}

export function requestPage(items: QualificationRequest[]): QualificationRequestPage {
  return { items, total: items.length, pageIndex: 0, pageSize: 200 };
}

export function housePart(id: number, partNumber: string, description: string, over: Partial<HousePart> = {}): HousePart {
  return {
    id,
    partNumber,
    description,
    status: 'active',
    specVersion: 1,
    sourceCount: 2,
    createdAt: '2026-09-01T08:00:00.000Z',
    updatedAt: '2026-09-01T08:00:00.000Z',
    createdBy: null,
    ...over,
  };
}

export const HOUSE_PARTS: HousePartPage = {
  items: [
    housePart(7, 'OHI-ZD-1051', 'Regulator diode 5.1 V, 5 V rail clamp'),
    housePart(8, 'OHI-ZD-1056', 'Regulator diode 5.6 V, loop-driver reference'),
    housePart(9, 'OHI-ZD-1099', 'Regulator diode 9.9 V, not specified yet', { specVersion: null }),
  ],
  total: 3,
  pageIndex: 0,
  pageSize: 50,
};
