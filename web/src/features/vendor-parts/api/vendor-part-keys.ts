import type { NormalizeRequest } from '@shuntwise/contracts';
import { queryRoots, sharedKeys } from '@/lib/query-keys';

/** Query keys of the vendor-parts feature; every variable of a query is in its key. */
export interface VendorPartListParams {
  pageIndex: number;
  pageSize: number;
  sort: string;
  mpn?: string;
  manufacturer?: string;
  package?: string;
  vzNomMin?: number;
  vzNomMax?: number;
  hasCard?: boolean;
}

export const vendorPartKeys = {
  all: queryRoots.vendorParts,
  lists: () => [...vendorPartKeys.all, 'list'] as const,
  list: (params: VendorPartListParams) => [...vendorPartKeys.lists(), params] as const,
  manufacturers: () => [...vendorPartKeys.all, 'manufacturers'] as const,
  detail: (id: number) => [...vendorPartKeys.all, 'detail', id] as const,
  card: (id: number) => [...vendorPartKeys.detail(id), 'card'] as const,
  cardVersions: (id: number) => [...vendorPartKeys.detail(id), 'card-versions'] as const,
  cardVersion: (id: number, version: number) => [...vendorPartKeys.detail(id), 'card-version', version] as const,
  spec: sharedKeys.specBasis,
  normalize: (request: NormalizeRequest | null) => [...vendorPartKeys.all, 'normalize', request] as const,
};
