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

export const FIELD_KINDS: Record<ExtractionField, readonly QuantityKind[]> = {
  vzMin: ['voltage'],
  vzNom: ['voltage'],
  vzMax: ['voltage'],
  izt: ['current'],
  zzt: ['resistance'],
  izk: ['current'],
  zzk: ['resistance'],
  irMax: ['current'],
  vr: ['voltage'],
  tc: ['tempCoVoltage', 'tempCoPercent'],
  pdMax: ['power'],
  tjMax: ['temperature'],
  rthJA: ['thermalResistance'],
  izm: ['current'],
};

export class VariantDraft {
  readonly fields = new Map<ExtractionField, Candidate>();
  package?: PackageCandidate;

  constructor(
    readonly mpn: string,
    /** Where the part first appears, for output in reading order. */
    readonly order: number,
  ) {}

  offer(field: ExtractionField, c: Candidate): void {
    const current = this.fields.get(field);
    if (!current || c.rank > current.rank) this.fields.set(field, c);
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
