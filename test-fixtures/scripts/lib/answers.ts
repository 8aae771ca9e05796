import { SeriesData } from './series';
import { AnswerKey, AnswerVariant, Field, Printed } from './types';

/** Collects, while a layout draws, which value it printed on which page. */
export class AnswerRecorder {
  readonly variants: AnswerVariant[];

  constructor(readonly data: SeriesData) {
    this.variants = data.variants.map((v) => ({ mpn: v.mpn, package: { value: v.package, page: 0 }, fields: {} }));
  }

  /** A value printed in a variant's own row or block. */
  value(index: number, field: Field, page: number): void {
    const printed = this.data.variants[index].values[field];
    if (!printed) throw new Error(`${this.data.variants[index].mpn}: ${field} is not part of this series`);
    this.variants[index].fields[field] = { ...printed, page };
  }

  /** A value printed once and valid for every variant (power, junction temperature, …). */
  device(field: 'pdMax' | 'tjMax' | 'rthJA', page: number, printedAs: { value?: string; unit?: string } = {}): void {
    const printed: Printed = { ...this.data.device[field], ...printedAs };
    for (const v of this.variants) v.fields[field] = { ...printed, page };
  }

  packagePage(indexes: number[], page: number): void {
    for (const i of indexes) if (this.variants[i].package.page === 0) this.variants[i].package.page = page;
  }

  key(layout: string, title: string, pages: number): AnswerKey {
    for (const v of this.variants) if (v.package.page === 0) throw new Error(`${v.mpn}: package page not recorded`);
    return { file: this.data.def.file, vendor: this.data.def.vendor, title, layout, pages, variants: this.variants };
  }
}
