import type { ExtractionBox, ExtractionField, QuantityKind } from '@shuntwise/contracts';

/** Candidates collected per part number while the readers walk the document. */

export interface Candidate {
  value: string;
  unit: string;
  kind: QuantityKind;
  /** SI value; for a %/K coefficient the %/K figure until it is converted with VZnom. */
  si: number;
  page: number;
  text: string;
  box?: ExtractionBox;
  note?: string;
  /** Where on the page it was found. */
  method: 'table' | 'list' | 'sentence';
  derived?: 'tolerance-suffix' | 'converted';
  /** Higher wins: a value in its own column or line beats one taken from a test condition. */
  rank: number;
}

export interface PackageCandidate {
  value: string;
  page: number;
  text: string;
  box?: ExtractionBox;
  rank: number;
}

export { FIELD_KINDS } from './vocabulary';
import { PLAUSIBLE } from './vocabulary';

export class VariantDraft {
  readonly fields = new Map<ExtractionField, Candidate>();
  /** Fields where two equally good candidates disagree: returned empty, with the reason. */
  readonly conflicts = new Map<ExtractionField, string>();
  package?: PackageCandidate;

  constructor(
    readonly mpn: string,
    /** Where the part first appears, for output in reading order. */
    readonly order: number,
  ) {}

  offer(field: ExtractionField, c: Candidate): void {
    const [lo, hi] = PLAUSIBLE[field];
    // A %/K coefficient is checked after conversion; its printed figure is a percentage.
    const x = c.kind === 'tempCoPercent' ? c.si / 100 : field === 'tc' ? c.si : Math.abs(c.si);
    if (!(x >= lo && x <= hi)) return;
    const current = this.fields.get(field);
    if (!current || c.rank > current.rank) {
      this.fields.set(field, c);
      this.conflicts.delete(field);
    } else if (c.rank === current.rank && !sameValue(c, current)) {
      this.conflicts.set(field, `"${current.text}" (page ${current.page}) and "${c.text}" (page ${c.page}) give different values`);
    }
  }

  offerPackage(p: PackageCandidate): void {
    if (!this.package || p.rank > this.package.rank) this.package = p;
  }
}

export class VariantDrafts {
  private readonly byMpn = new Map<string, VariantDraft>();

  get(mpn: string, order: number): VariantDraft {
    const key = mpn.toUpperCase();
    let d = this.byMpn.get(key);
    if (!d) {
      d = new VariantDraft(mpn, order);
      this.byMpn.set(key, d);
    }
    return d;
  }

  all(): VariantDraft[] {
    return [...this.byMpn.values()].sort((a, b) => a.order - b.order);
  }
}

export function orderOf(page: number, lineIndex: number): number {
  return page * 100_000 + lineIndex;
}

function sameValue(a: Candidate, b: Candidate): boolean {
  return a.kind === b.kind && Math.abs(a.si - b.si) <= 1e-9 * Math.max(Math.abs(a.si), Math.abs(b.si), 1e-12);
}
