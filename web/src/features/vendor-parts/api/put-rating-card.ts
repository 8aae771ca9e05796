import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ratingCardViewSchema, type PutRatingCardRequest, type RatingCardView } from '@shuntwise/contracts';
import { apiRequest, ApiError } from '@/lib/api-client';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';
import { vendorPartKeys } from './vendor-part-keys';

export interface PutRatingCardVariables {
  vendorPartId: number;
  request: PutRatingCardRequest;
}

export function putRatingCard({ vendorPartId, request }: PutRatingCardVariables): Promise<RatingCardView> {
  return apiRequest(`/vendor-parts/${vendorPartId}/rating-card`, { method: 'PUT', body: request, schema: ratingCardViewSchema });
}

/** The card someone else saved meanwhile, when a save failed with 409; else null. */
export function conflictingCard(error: unknown): RatingCardView | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const parsed = ratingCardViewSchema.safeParse(error.current);
  return parsed.success ? parsed.data : null;
}

export function usePutRatingCard() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: putRatingCard,
    onSuccess: (card) => {
      queryClient.setQueryData(vendorPartKeys.card(card.vendorPartId), card);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.cardVersions(card.vendorPartId) }),
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.detail(card.vendorPartId), exact: true }),
        queryClient.invalidateQueries({ queryKey: vendorPartKeys.lists() }),
        // Compare, the Board, the flagged cases and search results show the card's values.
        invalidateKeys(queryClient, staleAfter.cardSaved()),
      ]);
    },
  });
}
