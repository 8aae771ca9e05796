import { API_BASE, errorFromBody, ApiError } from './api-client';
import { clearSession, getSession } from './session';

/** The file name a Content-Disposition header offers (the UTF-8 form wins), if any. */
export function fileNameFromDisposition(header: string | null): string | undefined {
  if (!header) return undefined;
  const utf8 = /filename\*=UTF-8''([^;]+)/i.exec(header);
  if (utf8) {
    try {
      return decodeURIComponent(utf8[1].trim());
    } catch {
      // fall through to the plain name
    }
  }
  return /filename="?([^";]+)"?/i.exec(header)?.[1];
}

/**
 * Fetches a file from `/api` with the session's token and hands it to the browser as a
 * download (a plain link cannot send the Authorization header). Failures are ApiErrors.
 */
export async function downloadFile(path: string, fallbackName: string): Promise<string> {
  const token = getSession()?.accessToken;
  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, { headers: token ? { Authorization: `Bearer ${token}` } : {} });
  } catch {
    throw new ApiError(0, 'Cannot reach the Shuntwise server. Check your connection and try again.');
  }
  if (!response.ok) {
    const body = await response.json().catch(() => undefined);
    if (response.status === 401 && token) clearSession('expired');
    throw errorFromBody(response.status, response.statusText, body);
  }
  const name = fileNameFromDisposition(response.headers.get('Content-Disposition')) ?? fallbackName;
  saveBlob(await response.blob(), name);
  return name;
}

/** Hands a file made in the page (a CSV of results, a .model text) to the browser as a download. */
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

/** The PDF bytes of a datasheet, with the token (pdf.js reads them from memory). */
export async function fetchBytes(path: string, signal?: AbortSignal): Promise<Uint8Array> {
  const token = getSession()?.accessToken;
  const response = await fetch(`${API_BASE}${path}`, { headers: token ? { Authorization: `Bearer ${token}` } : {}, signal });
  if (!response.ok) {
    const body = await response.json().catch(() => undefined);
    if (response.status === 401 && token) clearSession('expired');
    throw errorFromBody(response.status, response.statusText, body);
  }
  return new Uint8Array(await response.arrayBuffer());
}
