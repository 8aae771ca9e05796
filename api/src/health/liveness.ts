import type { IncomingMessage, RequestListener, Server, ServerResponse } from 'node:http';

/** Where a load balancer or orchestrator asks whether this process answers at all. */
export const LIVENESS_PATH = '/api/health/live';

/**
 * Answers GET/HEAD /api/health/live on the HTTP server itself, before Express and Nest: it
 * says only that the process's event loop answers (no database, no other service, no user
 * data), and a probe polled by every load balancer should cost next to nothing. Readiness
 * (database and services) stays a normal route. Every other request goes on unchanged.
 */
export function answerLivenessFirst(server: Server): void {
  const handlers = server.listeners('request') as RequestListener[];
  server.removeAllListeners('request');
  server.on('request', (req: IncomingMessage, res: ServerResponse) => {
    if (req.url === LIVENESS_PATH && (req.method === 'GET' || req.method === 'HEAD')) {
      // The same answer as the health controller's liveness route, without Express in the way.
      const body = `{"status":"up","uptimeSeconds":${Math.round(process.uptime())}}`;
      // The headers every response carries (common/security), fixed here: a JSON answer needs no policy beyond 'none'.
      res.writeHead(200, {
        'content-type': 'application/json; charset=utf-8',
        'cache-control': 'no-store',
        'x-content-type-options': 'nosniff',
        'content-security-policy': "default-src 'none'; frame-ancestors 'none'",
        'x-frame-options': 'DENY',
        'referrer-policy': 'no-referrer',
        'content-length': Buffer.byteLength(body),
      });
      res.end(req.method === 'HEAD' ? undefined : body);
      return;
    }
    for (const handler of handlers) handler(req, res);
  });
}
