import type { CardFieldProblem } from '@shuntwise/contracts';

/**
 * A card the core cannot compute from, with every field-named problem. The HTTP schemas
 * reject the same cards with a 400 before the core runs; direct callers get this.
 */
export class EngineeringInputError extends Error {
  constructor(readonly problems: readonly CardFieldProblem[]) {
    super(problems.map((p) => `${p.field}: ${p.message}`).join('; '));
    this.name = 'EngineeringInputError';
  }
}
