import type { QueryClient, QueryKey } from '@tanstack/react-query';

/**
 * The root of every feature's query keys. Each feature's key factory builds below its
 * root; features never import each other, so a change in one that makes another's data
 * stale names that data here — never by a string literal, which silently stops matching
 * when a factory changes.
 */
export const queryRoots = {
  auth: ['auth'],
  board: ['board'],
  compare: ['compare'],
  datasheets: ['datasheets'],
  findParts: ['find-parts'],
  houseParts: ['house-parts'],
  measurements: ['measurements'],
  outbox: ['outbox'],
  qualificationRequests: ['qualification-requests'],
  qualifications: ['qualifications'],
  sources: ['sources-view'],
  users: ['users'],
  vendorParts: ['vendor-parts'],
} as const;

/** Keys one feature owns that another feature's change makes stale; the owner's factory uses these too. */
export const sharedKeys = {
  /** A house part's spec as the vendor-part pages read it (the basis a card is checked against). */
  specBasis: (housePartId: number) => [...queryRoots.vendorParts, 'spec-basis', housePartId] as const,
  /** Compare of one house part's sources. */
  compare: (housePartId: number) => [...queryRoots.compare, housePartId] as const,
};

/**
 * What a change makes stale outside the feature that made it. A saved spec or card flags
 * decided cases "needs re-check" on the server (CatalogueEvents), so the case pages, the
 * Board, Compare and Sources read again.
 */
export const staleAfter = {
  specSaved: (housePartId: number): QueryKey[] => [
    sharedKeys.specBasis(housePartId),
    sharedKeys.compare(housePartId),
    queryRoots.board,
    queryRoots.qualifications,
    queryRoots.sources,
  ],
  cardSaved: (): QueryKey[] => [queryRoots.compare, queryRoots.board, queryRoots.qualifications, queryRoots.sources, queryRoots.findParts],
  caseChanged: (): QueryKey[] => [queryRoots.board, queryRoots.compare, queryRoots.sources, queryRoots.houseParts, queryRoots.vendorParts],
  /** A case opened from a designer's request: every list that shows cases, and search (it filters by standing). */
  caseOpened: (): QueryKey[] => [
    queryRoots.qualifications,
    queryRoots.board,
    queryRoots.compare,
    queryRoots.sources,
    queryRoots.houseParts,
    queryRoots.vendorParts,
    queryRoots.findParts,
  ],
  /** A source linked or changed: the vendor part's page lists what it is a source of. */
  sourcesChanged: (): QueryKey[] => [queryRoots.vendorParts],
  /** Vendor parts added (datasheet variants, a CSV import). */
  vendorPartsAdded: (): QueryKey[] => [queryRoots.vendorParts],
};

export function invalidateKeys(queryClient: QueryClient, keys: readonly QueryKey[]): Promise<void[]> {
  return Promise.all(keys.map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}
