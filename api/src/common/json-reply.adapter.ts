import { ExpressAdapter } from '@nestjs/platform-express';
import type { Response } from 'express';

/**
 * Nest's Express adapter with one change: a handler's plain object or array, answered 200 or
 * 201 with no Content-Type set yet, is written as JSON directly — `JSON.stringify`, Content-Type
 * and Content-Length, one `res.end` with a string. Express's `res.json` → `res.send` did the same
 * and more that an API answer never needs (reading the app's JSON settings, parsing and
 * re-formatting the Content-Type to add the charset, a freshness check that cannot succeed
 * without an ETag or Last-Modified), and turned a body over 1 000 bytes into a Buffer, which
 * node then sent as a second chunk beside the headers (a `writev`; a string goes out in one
 * write). A card read spent about a sixth of its CPU in that path. Everything else — no body,
 * other statuses (204 and 304 carry no body), streams, buffers, errors, text — goes to Nest's
 * own reply unchanged. HEAD gets the headers only: node drops the body of a HEAD answer.
 */
export class JsonReplyAdapter extends ExpressAdapter {
  override reply(response: Response, body: unknown, statusCode?: number): unknown {
    const status = statusCode ?? response.statusCode;
    if (
      (status === 200 || status === 201) &&
      body !== null &&
      typeof body === 'object' &&
      (Array.isArray(body) || Object.getPrototypeOf(body) === Object.prototype) &&
      !response.hasHeader('content-type')
    ) {
      const json = JSON.stringify(body);
      response.statusCode = status;
      response.setHeader('Content-Type', 'application/json; charset=utf-8');
      response.setHeader('Content-Length', Buffer.byteLength(json));
      return response.end(json);
    }
    return super.reply(response, body, statusCode);
  }
}
