import { queryOptions, useQuery } from '@tanstack/react-query';
import { ratingCardVersionSummarySchema, ratingCardViewSchema, type RatingCardVersionSummary, type RatingCardView } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

export function getRatingCard(vendorPartId: number, version?: number, signal?: AbortSignal): Promise<RatingCardView> {
  const search = version ? `?version=${version}` : '';
  return apiRequest(`/vendor-parts/${vendorPartId}/rating-card${search}`, { schema: ratingCardViewSchema, signal });
}

export const ratingCardQueryOptions = (vendorPartId: number) =>
  queryOptions({ queryKey: vendorPartKeys.card(vendorPartId), queryFn: ({ signal }) => getRatingCard(vendorPartId, undefined, signal) });

export function useRatingCard(vendorPartId: number) {
  return useQuery(ratingCardQueryOptions(vendorPartId));
}

/** An earlier version, read-only (immutable, so cached for good). */
export function useRatingCardVersion(vendorPartId: number, version: number | null) {
  return useQuery({
    queryKey: vendorPartKeys.cardVersion(vendorPartId, version ?? 0),
    queryFn: ({ signal }) => getRatingCard(vendorPartId, version!, signal),
    enabled: version !== null && version > 0,
    staleTime: Infinity,
  });
}

const versionsSchema = ratingCardVersionSummarySchema.array();

export function getRatingCardVersions(vendorPartId: number, signal?: AbortSignal): Promise<RatingCardVersionSummary[]> {
  return apiRequest(`/vendor-parts/${vendorPartId}/rating-card/versions`, { schema: versionsSchema, signal });
}

export function useRatingCardVersions(vendorPartId: number) {
  return useQuery({
    queryKey: vendorPartKeys.cardVersions(vendorPartId),
    queryFn: ({ signal }) => getRatingCardVersions(vendorPartId, signal),
  });
}
