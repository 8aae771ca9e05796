import type { ExtractionResult } from '@shuntwise/contracts';
import type { AnswerKey } from '@shuntwise/test-fixtures';

/**
 * Scores an extraction of a rasterised datasheet against the answer key the generator wrote
 * for the original (outside the extractor: the values the generator printed).
 *  - expected: the answer values printed on the scanned pages that the text extractor also
 *    finds in the original's text layer (what OCR has to give back),
 *  - recall: expected values the OCR run returned with the right SI value,
 *  - precision: of all values the OCR run returned, those that match the answer key.
 */
export interface OcrScore {
  expected: number;
  recalled: number;
  returned: number;
  correct: number;
  wrong: string[];
  missed: string[];
}

const same = (a: number, b: number) => Math.abs(a - b) <= 1e-9 + 1e-6 * Math.abs(b);

export function scoreOcr(answers: AnswerKey, pages: number[], fromText: ExtractionResult, fromOcr: ExtractionResult): OcrScore {
  const onPages = new Set(pages);
  const key = new Map<string, number>();
  for (const v of answers.variants) {
    for (const [f, a] of Object.entries(v.fields)) if (a && onPages.has(a.page)) key.set(`${v.mpn.toUpperCase()} ${f}`, a.si);
  }
  const found = (r: ExtractionResult) => {
    const m = new Map<string, number>();
    for (const v of r.variants) for (const [f, x] of Object.entries(v.fields)) if (x && onPages.has(x.page)) m.set(`${v.mpn.toUpperCase()} ${f}`, x.si);
    return m;
  };
  const text = found(fromText);
  const ocr = found(fromOcr);
  const expected = [...key].filter(([k, si]) => text.has(k) && same(text.get(k)!, si));
  const recalledKeys = expected.filter(([k, si]) => ocr.has(k) && same(ocr.get(k)!, si));
  const wrong = [...ocr].filter(([k, si]) => !(key.has(k) && same(key.get(k)!, si))).map(([k, si]) => `${k} = ${si} (key: ${key.get(k) ?? 'none'})`);
  return {
    expected: expected.length,
    recalled: recalledKeys.length,
    returned: ocr.size,
    correct: ocr.size - wrong.length,
    wrong,
    missed: expected.filter(([k]) => !recalledKeys.some(([r]) => r === k)).map(([k, si]) => `${k} = ${si}`),
  };
}
