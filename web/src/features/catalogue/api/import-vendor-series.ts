import { useMutation, useQueryClient } from '@tanstack/react-query';
import { csvImportPreviewSchema, csvImportResultSchema, type CsvImportPreview, type CsvImportRequest, type CsvImportResult } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';

/** Reads the CSV and says, row by row, what an import would do. Writes nothing. */
export function previewVendorSeries(request: CsvImportRequest): Promise<CsvImportPreview> {
  return apiRequest('/imports/vendor-series/preview', { method: 'POST', body: request, schema: csvImportPreviewSchema });
}

/** Writes the same CSV: every row or none. */
export function importVendorSeries(request: CsvImportRequest): Promise<CsvImportResult> {
  return apiRequest('/imports/vendor-series', { method: 'POST', body: request, schema: csvImportResultSchema });
}

export function usePreviewVendorSeries() {
  return useMutation({ mutationFn: previewVendorSeries });
}

export function useImportVendorSeries() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importVendorSeries,
    // New vendor parts and cards: the vendor-part lists are stale.
    onSuccess: () => invalidateKeys(queryClient, staleAfter.vendorPartsAdded()),
  });
}
