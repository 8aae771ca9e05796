import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Transaction, TransactionOptions } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

/**
 * Runs a service's multi-step write in one transaction, so the service holds the unit of
 * work without holding the connection: every query inside stays with the repositories,
 * which take the transaction as their last argument.
 */
@Injectable()
export class UnitOfWork {
  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  run<T>(work: (transaction: Transaction) => Promise<T>, options: TransactionOptions = {}): Promise<T> {
    return this.sequelize.transaction(options, work);
  }

  /** A transaction the caller commits or rolls back itself (an upload that writes an object between its steps). */
  begin(): Promise<Transaction> {
    return this.sequelize.transaction();
  }
}
