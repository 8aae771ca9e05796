import { useMutation } from '@tanstack/react-query';
import { downloadFile } from '@/lib/api-client';

/** The cards as CSV, optionally one manufacturer's. */
export function exportRatingCards(manufacturer?: string): Promise<string> {
  const search = manufacturer ? `?manufacturer=${encodeURIComponent(manufacturer)}` : '';
  return downloadFile(`/exports/rating-cards${search}`, 'rating-cards.csv');
}

/** House parts with their approved and alternate sources as CSV. */
export function exportHouseParts(): Promise<string> {
  return downloadFile('/exports/house-parts', 'house-parts-and-sources.csv');
}

export function useExportRatingCards() {
  return useMutation({ mutationFn: exportRatingCards });
}

export function useExportHouseParts() {
  return useMutation({ mutationFn: exportHouseParts });
}
