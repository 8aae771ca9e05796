import { API_BASE, ApiError, errorFromBody } from './api-client';
import { clearSession, getSession } from './session';

/** Anything with zod's `parse`; the contracts schemas are passed in. */
interface Parser<T> {
  parse(data: unknown): T;
}

export interface UploadOptions<T> {
  /** Multipart fields besides the file, as strings (forms send strings). */
  fields?: Record<string, string | undefined>;
  /** Name of the file's multipart field (default `file`). */
  fileField?: string;
  schema: Parser<T>;
  /** Called with the fraction of the request body sent so far (0..1). */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

/**
 * A multipart upload to `/api` over XMLHttpRequest, because fetch cannot report upload
 * progress. Same contract as apiRequest: the bearer token, every failure an ApiError
 * with the server's message, a 401 ends the session.
 */
export function uploadFile<T>(path: string, file: File, options: UploadOptions<T>): Promise<T> {
  const { fields = {}, fileField = 'file', schema, onProgress, signal } = options;
  return new Promise<T>((resolve, reject) => {
    const form = new FormData();
    for (const [name, value] of Object.entries(fields)) if (value !== undefined) form.append(name, value);
    form.append(fileField, file, file.name);

    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${API_BASE}${path}`);
    xhr.setRequestHeader('Accept', 'application/json');
    const token = getSession()?.accessToken;
    if (token) xhr.setRequestHeader('Authorization', `Bearer ${token}`);
    xhr.responseType = 'text';

    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
    };
    xhr.onerror = () => reject(new ApiError(0, 'Cannot reach the Shuntwise server. Check your connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress?.(1);
        try {
          resolve(schema.parse(body));
        } catch {
          reject(new ApiError(xhr.status, `The server's answer to POST ${path} was not what Shuntwise expects.`));
        }
        return;
      }
      if (xhr.status === 401 && token) clearSession('expired');
      reject(errorFromBody(xhr.status, xhr.statusText, body));
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}
