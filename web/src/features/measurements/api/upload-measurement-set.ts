import { useMutation, useQueryClient } from '@tanstack/react-query';
import { measurementCsvReadingSchema, measurementSetSchema, type MeasurementCsvReading, type MeasurementSet } from '@shuntwise/contracts';
import { uploadFile } from '@/lib/api-client';
import { measurementKeys } from './measurement-keys';

export interface MeasurementUpload {
  vendorPartId: number;
  file: File;
  lot?: string;
  instrument?: string;
  measuredOn?: string;
  note?: string;
}

/** What the file would give, with its row errors; nothing is stored. */
export function previewMeasurementFile(file: File): Promise<MeasurementCsvReading> {
  return uploadFile('/measurement-sets/preview', file, { schema: measurementCsvReadingSchema });
}

export function uploadMeasurementSet({ file, vendorPartId, ...fields }: MeasurementUpload): Promise<MeasurementSet> {
  return uploadFile('/measurement-sets', file, { schema: measurementSetSchema, fields: { vendorPartId: String(vendorPartId), ...fields } });
}

export function usePreviewMeasurementFile() {
  return useMutation({ mutationFn: previewMeasurementFile });
}

export function useUploadMeasurementSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadMeasurementSet,
    onSuccess: (_set, variables) => queryClient.invalidateQueries({ queryKey: measurementKeys.vendorPart(variables.vendorPartId) }),
  });
}
