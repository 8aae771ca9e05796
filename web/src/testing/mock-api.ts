import { vi } from 'vitest';

export interface RecordedCall {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}

export interface MockReply {
  status?: number;
  body?: unknown;
}

type Handler = (call: RecordedCall, params: Record<string, string>) => MockReply | Promise<MockReply>;

/**
 * Stubs `fetch` with a small route table: keys like `GET /api/users` or
 * `PATCH /api/users/:id`. Unknown routes answer 404 in the API's error shape and are
 * listed in `unmatched`, so a test sees a call it did not expect.
 */
export function mockApi(routes: Record<string, Handler | MockReply>) {
  const calls: RecordedCall[] = [];
  const unmatched: string[] = [];
  const table = Object.entries(routes).map(([key, handler]) => {
    const [method, pattern] = key.split(' ');
    const names: string[] = [];
    const regex = new RegExp(
      `^${pattern.replace(/:[a-zA-Z]+/g, (m) => {
        names.push(m.slice(1));
        return '([^/]+)';
      })}$`,
    );
    return { method, regex, names, handler };
  });

  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), 'http://127.0.0.1:8080');
    const method = (init.method ?? 'GET').toUpperCase();
    const headers = Object.fromEntries(Object.entries((init.headers ?? {}) as Record<string, string>));
    const call: RecordedCall = {
      method,
      path: url.pathname,
      headers,
      body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined,
    };
    calls.push(call);
    for (const route of table) {
      const match = route.method === method ? route.regex.exec(url.pathname) : null;
      if (!match) continue;
      const params = Object.fromEntries(route.names.map((n, i) => [n, decodeURIComponent(match[i + 1])]));
      const reply = typeof route.handler === 'function' ? await route.handler(call, params) : route.handler;
      return jsonResponse(reply.status ?? 200, reply.body);
    }
    unmatched.push(`${method} ${url.pathname}`);
    return jsonResponse(404, { message: `No mock for ${method} ${url.pathname}`, correlationId: 'test-404' });
  });

  vi.stubGlobal('fetch', fetchMock);
  return {
    calls,
    unmatched,
    fetch: fetchMock,
    callsTo: (method: string, path: string) => calls.filter((c) => c.method === method && c.path === path),
  };
}

function jsonResponse(status: number, body: unknown): Response {
  if (status === 204 || body === undefined) return new Response(null, { status });
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

/** An error body as the API sends it. */
export function errorBody(message: string, errors?: { path: string; message: string }[]) {
  return { message, ...(errors ? { errors } : {}), correlationId: 'c0ffee00-test' };
}
