import type { RegulatorRequest } from '@shuntwise/contracts';
import { queryRoots } from '@/lib/query-keys';

/** What the search sends, as the address keeps it (SI numbers, comma lists). */
export interface SearchParams {
  pageIndex: number;
  pageSize: number;
  sort: string;
  q?: string;
  vzFrom?: number;
  vzTo?: number;
  vzWindow?: boolean;
  package?: string;
  pdMin?: number;
  toleranceMax?: number;
  manufacturer?: string;
  housePartId?: number;
  includeNotCleared?: boolean;
}

/** Query keys of the Find parts feature; every variable of a query is in its key. */
export const findPartsKeys = {
  all: queryRoots.findParts,
  searches: () => [...findPartsKeys.all, 'search'] as const,
  search: (params: SearchParams) => [...findPartsKeys.searches(), params] as const,
  facets: () => [...findPartsKeys.all, 'facets'] as const,
  circuit: (request: RegulatorRequest) => [...findPartsKeys.all, 'circuit', request] as const,
};
