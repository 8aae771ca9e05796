import { errorBodySchema, type ErrorBody } from '@shuntwise/contracts';
import { clearSession, getSession } from './session';

/**
 * The one client for `/api`: JSON calls, uploads with progress and file downloads share
 * the bearer token, the 401 → sign-in rule and the reading of the error body, here.
 */
export const API_BASE = '/api';

const UNREACHABLE = 'Cannot reach the Shuntwise server. Check your connection and try again.';

/** A failed API call, carrying the uniform error body when the server sent one. */
export class ApiError extends Error {
  readonly status: number;
  readonly errors: ErrorBody['errors'];
  readonly correlationId: string | undefined;
  /** A conflict's kind (`stale`: saved on a version that is no longer current), when the body named one. */
  readonly code: string | undefined;
  /** What a 409 says is stored now (`current`: a whole card, or at least `{version}`), when it sent it. */
  readonly current: unknown;
  /** The whole error body as sent. */
  readonly body: unknown;

  constructor(status: number, message: string, body?: Partial<ErrorBody> & { code?: unknown; current?: unknown }) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.errors = body?.errors;
    this.correlationId = body?.correlationId;
    this.code = typeof body?.code === 'string' ? body.code : undefined;
    this.current = body?.current;
    this.body = body;
  }

  /** The server's message for one field (e.g. `email`), if it named one. */
  fieldError(path: string): string | undefined {
    return this.errors?.find((e) => e.path === path)?.message;
  }
}

/** Anything with zod's `parse`; the contracts schemas are passed in. */
interface Parser<T> {
  parse(data: unknown): T;
}

/**
 * The ApiError for a failed answer: the uniform body `{message, errors?, correlationId}`,
 * keeping what a conflict adds (`code`, `current`); anything else (a proxy's HTML page)
 * still names the status.
 */
function errorFromBody(status: number, statusText: string, raw: unknown): ApiError {
  const parsed = errorBodySchema.safeParse(raw);
  // The schema strips what it does not name; keep the raw body's extra fields.
  if (parsed.success) return new ApiError(status, parsed.data.message, { ...(raw as object), ...parsed.data });
  const text = statusText ? ` ${statusText}` : '';
  return new ApiError(status, `Request failed (${status}${text}).`);
}

/**
 * A failed answer becomes an ApiError. A 401 on a call that carried a token means the
 * session is over (expired, signed out elsewhere, deactivated): the session is cleared,
 * and the signed-in layout then sends the user to sign-in, keeping the page they were on.
 */
function failure(status: number, statusText: string, raw: unknown, sentToken: boolean): ApiError {
  if (status === 401 && sentToken) clearSession('expired');
  return errorFromBody(status, statusText, raw);
}

function bearer(auth: boolean): string | undefined {
  return auth ? getSession()?.accessToken : undefined;
}

/** fetch for `/api` with the token; a network failure or a non-2xx answer throws an ApiError. */
async function send(
  path: string,
  init: { method?: string; headers?: Record<string, string>; body?: string; signal?: AbortSignal },
  auth: boolean,
): Promise<Response> {
  const headers: Record<string, string> = { ...init.headers };
  const token = bearer(auth);
  if (token) headers.Authorization = `Bearer ${token}`;
  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, { ...init, headers });
  } catch (cause) {
    if ((cause as Error)?.name === 'AbortError') throw cause;
    throw new ApiError(0, UNREACHABLE);
  }
  if (!response.ok) {
    const raw: unknown = await response.json().catch(() => undefined);
    throw failure(response.status, response.statusText, raw, token !== undefined);
  }
  return response;
}

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  /** Schema from contracts that the answer must match; without it the answer is not read. */
  schema?: Parser<T>;
  /** Public calls (sign-in, invitation) send no token and never end the session. */
  auth?: boolean;
  signal?: AbortSignal;
}

/** A JSON call to `/api`: sends JSON and the bearer token, reads the answer with the schema. */
export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const { method = 'GET', body, schema, auth = true, signal } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  const response = await send(path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal }, auth);
  if (!schema || response.status === 204) return undefined as T;
  let data: unknown;
  try {
    data = await response.json();
  } catch {
    throw new ApiError(response.status, `The server's answer to ${method} ${path} was not JSON.`);
  }
  return schema.parse(data);
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
 * progress; token, errors and the 401 rule as for every other call.
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
    const token = bearer(true);
    if (token) xhr.setRequestHeader('Authorization', `Bearer ${token}`);
    xhr.responseType = 'text';

    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
    };
    xhr.onerror = () => reject(new ApiError(0, UNREACHABLE));
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
      reject(failure(xhr.status, xhr.statusText, body, token !== undefined));
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/**
 * The file name a Content-Disposition header offers (`filename*` wins over `filename`), if
 * any. The parser is loaded on first use so the sign-in page does not carry it.
 */
export async function fileNameFromDisposition(header: string | null): Promise<string | undefined> {
  if (!header) return undefined;
  const { parse } = await import('content-disposition');
  try {
    const name = parse(header).parameters.filename;
    return name ? name : undefined;
  } catch {
    // A header the RFC 6266 grammar refuses: the caller's own name is used.
    return undefined;
  }
}

/**
 * Fetches a file from `/api` with the session's token and hands it to the browser as a
 * download (a plain link cannot send the Authorization header). Returns the name used:
 * the server's, else `fallbackName`.
 */
export async function downloadFile(path: string, fallbackName: string): Promise<string> {
  const response = await send(path, {}, true);
  const name = (await fileNameFromDisposition(response.headers.get('Content-Disposition'))) ?? fallbackName;
  saveBlob(await response.blob(), name);
  return name;
}

/** A file's bytes, with the token (pdf.js reads a datasheet from memory). */
export async function fetchBytes(path: string, signal?: AbortSignal): Promise<Uint8Array> {
  const response = await send(path, { signal }, true);
  return new Uint8Array(await response.arrayBuffer());
}

/** Hands a file made in the page (a CSV of results, a .model text) or downloaded to the browser. */
export function saveBlob(blob: Blob, name: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  document.body.append(link);
  link.click();
  link.remove();
  // Give the browser a moment to start the download before the URL goes.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Message for a notification or alert, with the correlation id so support can find the log line. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) {
    return error.correlationId ? `${error.message} (ref. ${error.correlationId})` : error.message;
  }
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}
