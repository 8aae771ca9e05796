import { ArgumentsHost, Catch, HttpStatus, type ExceptionFilter } from '@nestjs/common';
import type { RatingCardConflict } from '@shuntwise/contracts';
import type { Response } from 'express';
import type { RequestWithCorrelation } from '../common/correlation-id.middleware';
import { RatingCardConflictError } from './rating-cards.service';

/** A stale card save: the usual error body plus the card as it is now, so the editor can merge. */
@Catch(RatingCardConflictError)
export class RatingCardConflictFilter implements ExceptionFilter {
  catch(exception: RatingCardConflictError, host: ArgumentsHost): void {
    const ctx = host.switchToHttp();
    const req = ctx.getRequest<RequestWithCorrelation>();
    const body: RatingCardConflict = { message: exception.message, correlationId: req.correlationId ?? 'none', current: exception.current };
    ctx.getResponse<Response>().status(HttpStatus.CONFLICT).json(body);
  }
}
