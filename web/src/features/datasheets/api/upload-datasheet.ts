import { uploadDatasheetResponseSchema, type UploadDatasheetResponse } from '@shuntwise/contracts';
import { uploadFile } from '@/lib/api-client';

export interface UploadDatasheetOptions {
  vendorPartId?: number;
  revision?: string;
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

/** `POST /datasheets` (multipart): the stored datasheet, or the one already stored with the same bytes. */
export function uploadDatasheet(file: File, { vendorPartId, revision, onProgress, signal }: UploadDatasheetOptions = {}): Promise<UploadDatasheetResponse> {
  return uploadFile('/datasheets', file, {
    fields: { vendorPartId: vendorPartId === undefined ? undefined : String(vendorPartId), revision },
    schema: uploadDatasheetResponseSchema,
    onProgress,
    signal,
  });
}
