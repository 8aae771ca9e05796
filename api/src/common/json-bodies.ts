import { UnsupportedMediaTypeException } from '@nestjs/common';
import express, { type RequestHandler } from 'express';

/**
 * The API reads request bodies as JSON only (uploads are multipart, read by their routes).
 * A form-encoded body is refused with a 415 that says so, rather than reaching the schemas as
 * no body at all; a request without a body (every GET) passes straight on.
 */
export function jsonBodies(limit: string): RequestHandler {
  const parse = express.json({ limit });
  return function jsonBodies(req, res, next) {
    // null: no body; false: a body of another type (JSON, multipart, text…).
    if (req.is('application/x-www-form-urlencoded'))
      return next(new UnsupportedMediaTypeException('Send the body as JSON (Content-Type: application/json); form-encoded bodies are not read'));
    parse(req, res, next);
  };
}
