import { errorBodySchema, type ErrorBody } from '@shuntwise/contracts';
import { clearSession, getSession } from './session';

export const API_BASE = '/api';

/** A failed API call, carrying the uniform error body when the server sent one. */
export class ApiError extends Error {
  readonly status: number;
  readonly errors: ErrorBody['errors'];
  readonly correlationId: string | undefined;
  /** The whole error body as sent; some answers carry more (a 409 on a card sends the current card). */
  readonly body: unknown;

  constructor(status: number, message: string, body?: Partial<ErrorBody>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.errors = body?.errors;
    this.correlationId = body?.correlationId;
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

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  /** Schema from contracts that the answer must match; without it the answer is not read. */
  schema?: Parser<T>;
  /** Public calls (sign-in, invitation) send no token and never end the session. */
  auth?: boolean;
  signal?: AbortSignal;
}

/**
 * fetch for `/api`: sends JSON and the bearer token, turns every failure into an
 * ApiError. A 401 on a call that carried a token means the session is over (expired,
 * signed out elsewhere, deactivated): the session is cleared, and the signed-in layout
 * then sends the user to sign-in, keeping the page they were on.
 */
export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const { method = 'GET', body, schema, auth = true, signal } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  const token = auth ? getSession()?.accessToken : undefined;
  if (token) headers.Authorization = `Bearer ${token}`;
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (cause) {
    if ((cause as Error)?.name === 'AbortError') throw cause;
    throw new ApiError(0, 'Cannot reach the Shuntwise server. Check your connection and try again.');
  }

  if (!response.ok) {
    const error = await toApiError(response);
    if (response.status === 401 && token) clearSession('expired');
    throw error;
  }
  if (!schema || response.status === 204) return undefined as T;
  let data: unknown;
  try {
    data = await response.json();
  } catch {
    throw new ApiError(response.status, `The server's answer to ${method} ${path} was not JSON.`);
  }
  return schema.parse(data);
}

async function toApiError(response: Response): Promise<ApiError> {
  let raw: unknown;
  try {
    raw = await response.json();
  } catch {
    raw = undefined;
  }
  return errorFromBody(response.status, response.statusText, raw);
}

/** The ApiError for a failed answer's status and parsed JSON body (also used by uploads over XMLHttpRequest). */
export function errorFromBody(status: number, statusText: string, raw: unknown): ApiError {
  const parsed = errorBodySchema.safeParse(raw);
  // Keep the raw body: the schema strips what it does not name (a 409's current card).
  if (parsed.success) return new ApiError(status, parsed.data.message, { ...(raw as object), ...parsed.data });
  const text = statusText ? ` ${statusText}` : '';
  return new ApiError(status, `Request failed (${status}${text}).`);
}

/** Message for a notification or alert, with the correlation id so support can find the log line. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) {
    return error.correlationId ? `${error.message} (ref. ${error.correlationId})` : error.message;
  }
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}
