import { useMutation, useQueryClient } from '@tanstack/react-query';
import { extractionResultSchema, type ExtractionResult } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { datasheetKeys } from './datasheet-keys';

/** Has the stored file read again by the current datasheet reader (when its reading is outdated). */
export function readDatasheetAgain(datasheetId: number): Promise<ExtractionResult> {
  return apiRequest(`/datasheets/${datasheetId}/extraction`, { method: 'POST', schema: extractionResultSchema });
}

export function useReadDatasheetAgain() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: readDatasheetAgain,
    // The fresh reading is the extraction now; the datasheet's counts changed with it.
    onSuccess: (reading, datasheetId) => {
      queryClient.setQueryData(datasheetKeys.extraction(datasheetId), reading);
      return queryClient.invalidateQueries({ queryKey: datasheetKeys.detail(datasheetId) });
    },
  });
}
