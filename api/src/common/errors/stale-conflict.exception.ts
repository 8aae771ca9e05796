import { ConflictException } from '@nestjs/common';
import { STALE_CONFLICT_CODE, type StaleConflictBody } from '@shuntwise/contracts';

/** What is stored now: at least its version (a rating card conflict sends the whole card view). */
export type StaleCurrent = { version: number } & Record<string, unknown>;

/**
 * A write based on a version that is no longer current: every such 409 in the API is this
 * exception, so every one answers the same body (`StaleConflictBody` in the contracts:
 * `{message, code: 'stale', errors?, current?, correlationId}`). The global exception filter
 * adds the correlation id; nothing else builds a stale body.
 */
export class StaleConflictException extends ConflictException {
  constructor(
    message: string,
    readonly details: { current?: StaleCurrent; errors?: StaleConflictBody['errors'] } = {},
  ) {
    super(message);
    this.name = 'StaleConflictException';
  }

  /** The body without the correlation id (the filter adds it). */
  body(): Omit<StaleConflictBody, 'correlationId'> {
    return {
      message: this.message,
      code: STALE_CONFLICT_CODE,
      ...(this.details.errors ? { errors: this.details.errors } : {}),
      ...(this.details.current ? { current: this.details.current } : {}),
    };
  }
}
