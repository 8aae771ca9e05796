import { randomUUID } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';

export const CORRELATION_HEADER = 'x-correlation-id';

export interface RequestWithCorrelation extends Request {
  correlationId?: string;
}

/** Gives every request an id (the caller's, if sane) that appears in logs and error bodies. */
export function correlationIdMiddleware(req: RequestWithCorrelation, res: Response, next: NextFunction): void {
  const given = req.header(CORRELATION_HEADER);
  const id = given && /^[A-Za-z0-9._-]{8,80}$/.test(given) ? given : randomUUID();
  req.correlationId = id;
  res.setHeader(CORRELATION_HEADER, id);
  next();
}
