import { queryRoots } from '@/lib/query-keys';

/** Query keys of the measurements feature; every variable of a query is in its key. */
export const measurementKeys = {
  all: queryRoots.measurements,
  /** Every measurement query of one vendor part (whatever house part it is read against). */
  vendorPart: (vendorPartId: number) => [...measurementKeys.all, 'vendor-part', vendorPartId] as const,
  forVendorPart: (vendorPartId: number, housePartId: number | null) => [...measurementKeys.vendorPart(vendorPartId), housePartId] as const,
};
