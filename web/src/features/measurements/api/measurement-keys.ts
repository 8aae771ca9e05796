/** Query keys of the measurements feature; every variable of a query is in its key. */
export const measurementKeys = {
  all: ['measurements'] as const,
  forVendorPart: (vendorPartId: number, housePartId: number | null) => [...measurementKeys.all, 'vendor-part', vendorPartId, housePartId] as const,
};
