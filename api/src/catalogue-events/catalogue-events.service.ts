import { Injectable } from '@nestjs/common';
import type { Transaction } from 'sequelize';

/** A rating card got a new version (a save that changed nothing makes none). */
export interface CardChanged {
  kind: 'card-changed';
  vendorPartId: number;
  version: number;
  /** null for the card's first version. */
  previousVersion: number | null;
  changedFields: string[];
  userId: number | null;
}

/** A house part's spec got a new version. */
export interface SpecChanged {
  kind: 'spec-changed';
  housePartId: number;
  version: number;
  previousVersion: number | null;
  userId: number | null;
}

/** A vendor part that already had a datasheet got another one (a new revision). */
export interface DatasheetRevised {
  kind: 'datasheet-revised';
  vendorPartId: number;
  datasheetId: number;
  revision: string | null;
  previousDatasheetIds: number[];
  userId: number | null;
}

/** Bench measurements of a vendor part's samples were added: new evidence for its cases. */
export interface MeasurementsAdded {
  kind: 'measurements-added';
  vendorPartId: number;
  measurementSetId: number;
  samples: number;
  userId: number | null;
}

export type CatalogueChange = CardChanged | SpecChanged | DatasheetRevised | MeasurementsAdded;
export type CatalogueChangeHandler = (change: CatalogueChange, transaction: Transaction) => Promise<void> | void;

/**
 * The hook for whoever must react to catalogue changes (the qualification marks decided
 * cases "needs re-check"). Handlers run inside the transaction that makes the change, so
 * the reaction commits with it or not at all; a handler that throws rolls the change back.
 * Subscribe in onModuleInit; the returned function unsubscribes.
 */
@Injectable()
export class CatalogueEvents {
  private readonly handlers = new Set<CatalogueChangeHandler>();

  subscribe(handler: CatalogueChangeHandler): () => void {
    this.handlers.add(handler);
    return () => this.handlers.delete(handler);
  }

  async publish(change: CatalogueChange, transaction: Transaction): Promise<void> {
    for (const handler of this.handlers) await handler(change, transaction);
  }
}
