import type { ReactNode } from 'react';
import { QueryClientProvider, type QueryKey } from '@tanstack/react-query';
import { act, renderHook } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { SpecVersion } from '@shuntwise/contracts';
import { boardKeys } from '@/features/board/api/board-keys';
import { compareKeys } from '@/features/compare/api/compare-keys';
import { usePutSpec } from '@/features/house-parts/api/spec';
import { housePartKeys } from '@/features/house-parts/api/house-part-keys';
import { qualificationKeys } from '@/features/qualifications/api/qualification-keys';
import { vendorPartKeys } from '@/features/vendor-parts/api/vendor-part-keys';
import { mockApi } from '@/testing/mock-api';
import { createTestQueryClient, signInAs } from '@/testing/render';

// Cache keys across features: each owner's factory, never a literal. This test sits in app/
// because it is the one place allowed to import several features.

const spec: SpecVersion = {
  housePartId: 5,
  version: 2,
  spec: {
    iRef: 0.005,
    vz: { min: 4.8, nom: 5.1, max: 5.4 },
    zdMax: 30,
    knee: null,
    leakage: { irMax: 2e-6, vr: 2 },
    tc: null,
    power: { pdMin: 0.3, deratingFraction: 0.5 },
    packages: ['SOD-123'],
    envelope: { iMin: 0.002, iMax: 0.01, taMin: -40, taMax: 85 },
    outputWindow: null,
    marginalBandPercent: 5,
  } as SpecVersion['spec'],
  note: null,
  createdAt: '2026-12-01T10:00:00.000Z',
  createdBy: { id: 2, name: 'Priya Raman' },
};

describe('saving a spec', () => {
  it("refreshes the vendor parts' spec basis, Compare and the Board for that house part, and leaves other house parts alone", async () => {
    signInAs('engineer');
    mockApi({ 'PUT /api/house-parts/:id/spec': { body: spec } });
    const queryClient = createTestQueryClient();
    const seeded: Record<string, QueryKey> = {
      specBasis: vendorPartKeys.spec(5),
      compare: compareKeys.housePart(5),
      board: boardKeys.page({ pageIndex: 0, pageSize: 25 }),
      boardFiltered: boardKeys.page({ pageIndex: 1, pageSize: 25, state: 'approved' }),
      caseDetail: qualificationKeys.detail(11),
      otherSpecBasis: vendorPartKeys.spec(6),
      otherCompare: compareKeys.housePart(6),
      card: vendorPartKeys.card(3),
    };
    for (const key of Object.values(seeded)) queryClient.setQueryData(key, { seeded: true });

    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => usePutSpec(), { wrapper });
    await act(() => result.current.mutateAsync({ housePartId: 5, request: { baseVersion: 1, spec: spec.spec } as never }));

    const stale = (key: QueryKey) => queryClient.getQueryState(key)?.isInvalidated;
    expect(stale(seeded.specBasis)).toBe(true);
    expect(stale(seeded.compare)).toBe(true);
    expect(stale(seeded.board)).toBe(true);
    expect(stale(seeded.boardFiltered)).toBe(true);
    expect(stale(seeded.caseDetail)).toBe(true);
    expect(stale(seeded.otherSpecBasis)).toBe(false);
    expect(stale(seeded.otherCompare)).toBe(false);
    expect(stale(seeded.card)).toBe(false);
    // The saved spec itself is stored as answered, not read again.
    expect(queryClient.getQueryData(housePartKeys.spec(5))).toEqual(spec);
  });
});
