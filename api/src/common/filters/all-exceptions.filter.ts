import { ArgumentsHost, Catch, HttpException, HttpStatus, Logger, type ExceptionFilter } from '@nestjs/common';
import { fieldName, issueMessage, type ErrorBody, type LabelledIssue, type StaleConflictBody } from '@shuntwise/contracts';
import type { Response } from 'express';
import { ZodValidationException } from 'nestjs-zod';
import { OptimisticLockError, UniqueConstraintError, ForeignKeyConstraintError } from 'sequelize';
import { ZodError } from 'zod';
import { EngineeringInputError } from '../../engineering/engineering-input.error';
import type { RequestWithCorrelation } from '../correlation-id.middleware';
import { StaleConflictException } from '../errors/stale-conflict.exception';
import { isDatabaseUnavailable, isDroppedConnection, isTransactionConflict } from '../database-unavailable';

/** Seconds a client should wait before retrying while the database is away. */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

/** A body before the correlation id is added: the usual error body, or a stale-write conflict's. */
type Described = { status: number; body: Omit<ErrorBody, 'correlationId'> | Omit<StaleConflictBody, 'correlationId'> };

/**
 * One error body for the whole API: {message, errors?, correlationId}; a stale write's 409
 * adds `code: 'stale'` and `current` (StaleConflictException, StaleConflictBody). Known errors keep
 * their status; a database that cannot be reached is a 503 with Retry-After (for every
 * route, here and nowhere else); anything else is logged and answered as a 500 without internals.
 */
@Catch()
export class AllExceptionsFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(exception: unknown, host: ArgumentsHost): void {
    const ctx = host.switchToHttp();
    const req = ctx.getRequest<RequestWithCorrelation>();
    const res = ctx.getResponse<Response>();
    const correlationId = req.correlationId ?? 'none';
    const { status, body } = this.describe(exception);
    if (status === HttpStatus.SERVICE_UNAVAILABLE) {
      // Expected while a service is away: one line, no stack trace per request.
      this.logger.warn(`${req.method} ${req.originalUrl} [${correlationId}] unavailable: ${(exception as Error).message}`);
      if ((isDatabaseUnavailable(exception) || isDroppedConnection(exception) || isTransactionConflict(exception)) && !res.headersSent)
        res.setHeader('Retry-After', String(DATABASE_RETRY_AFTER_SECONDS));
    } else if (status >= 500) {
      this.logger.error(`${req.method} ${req.originalUrl} [${correlationId}] ${exception instanceof Error ? exception.stack : String(exception)}`);
    }
    if (res.headersSent) return;
    res.status(status).json({ ...body, correlationId } satisfies ErrorBody | StaleConflictBody);
  }

  private describe(exception: unknown): Described {
    if (isDatabaseUnavailable(exception)) {
      return {
        status: HttpStatus.SERVICE_UNAVAILABLE,
        body: { message: 'The database is unavailable; try again in a few seconds. If this was a change, check whether it was saved before repeating it.' },
      };
    }
    if (isDroppedConnection(exception)) {
      // A socket that a backing service (most often the database mid-restart) closed under a request.
      return {
        status: HttpStatus.SERVICE_UNAVAILABLE,
        body: {
          message:
            'A connection dropped under this request; most likely the database is unavailable or restarting. Try again in a few seconds; if this was a change, check whether it was saved before repeating it.',
        },
      };
    }
    if (isTransactionConflict(exception)) {
      return {
        status: HttpStatus.SERVICE_UNAVAILABLE,
        body: { message: 'The database turned this change away because of a conflicting change made at the same moment; nothing was saved. Try again.' },
      };
    }
    if (exception instanceof ZodValidationException) return this.fromZod(exception.getZodError() as ZodError);
    if (exception instanceof ZodError) return this.fromZod(exception);
    if (exception instanceof StaleConflictException) return { status: HttpStatus.CONFLICT, body: exception.body() };
    if (exception instanceof HttpException) {
      const status = exception.getStatus();
      const response = exception.getResponse();
      if (typeof response === 'string') return { status, body: { message: response } };
      const r = response as { message?: unknown; errors?: ErrorBody['errors'] };
      const message = Array.isArray(r.message) ? r.message.join('; ') : typeof r.message === 'string' ? r.message : exception.message;
      return { status, body: r.errors ? { message, errors: r.errors } : { message } };
    }
    if (exception instanceof EngineeringInputError) {
      const errors = exception.problems.map((p) => ({ path: p.field, message: p.message }));
      return { status: HttpStatus.UNPROCESSABLE_ENTITY, body: { message: `Cannot compute from this card: ${exception.message}`, errors } };
    }
    if (exception instanceof UniqueConstraintError) {
      const fields = Object.keys(exception.fields ?? {});
      return {
        status: HttpStatus.CONFLICT,
        body: {
          message: `Already exists${fields.length ? ` (${fields.join(', ')})` : ''}`,
          errors: fields.map((f) => ({ path: f, message: 'must be unique' })),
        },
      };
    }
    if (exception instanceof ForeignKeyConstraintError) {
      return { status: HttpStatus.CONFLICT, body: { message: 'A referenced record does not exist or is still in use' } };
    }
    if (exception instanceof OptimisticLockError) {
      return { status: HttpStatus.CONFLICT, body: new StaleConflictException('Someone else changed this record; reload and merge').body() };
    }
    const e = exception as { type?: string; status?: number; message?: string };
    // body-parser errors (malformed JSON, too large) carry a status of their own.
    if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
      return { status: e.status, body: { message: e.type === 'entity.parse.failed' ? 'The request body is not valid JSON' : (e.message ?? 'Bad request') } };
    }
    return { status: HttpStatus.INTERNAL_SERVER_ERROR, body: { message: 'Internal error; quote the correlation id when reporting it' } };
  }

  private fromZod(error: ZodError): { status: number; body: Omit<ErrorBody, 'correlationId'> } {
    // Messages in the form's words (labels, prefixed values), from the contracts' one map.
    const errors = error.issues.map((i) => ({ path: i.path.join('.') || '(body)', message: issueMessage(i as LabelledIssue) }));
    const first = errors[0];
    return {
      status: HttpStatus.BAD_REQUEST,
      body: { message: first ? `Invalid request: ${named(first.path, first.message)}` : 'Invalid request', errors },
    };
  }
}

/** A message with the field's label in front unless it names it already. */
function named(path: string, message: string): string {
  const name = fieldName(path);
  return message.includes(name) ? message : `${name}: ${message}`;
}
