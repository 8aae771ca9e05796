/**
 * Prints one random-layout document as the extractor sees it (lines per page), its answer key
 * and what was extracted, for working on the extractor:
 *   npx tsx api/scripts/debug-random-layout.ts --seed 4252 [--lines] [--set k=v]
 */
import { parseArgs } from 'node:util';
import { generateRandomDatasheet } from '@shuntwise/test-fixtures';
import { extractRatings } from '../src/extraction/rating-extractor';
import { readPdf } from '../src/extraction/pdf-text';
import { pageLines } from '../src/extraction/text-layout';

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: { seed: { type: 'string' }, lines: { type: 'boolean', default: false }, set: { type: 'string', multiple: true, default: [] } },
  });
  const overrides: Record<string, unknown> = {};
  for (const s of values.set ?? []) {
    const [k, v] = s.split('=');
    overrides[k] = v === 'true' ? true : v === 'false' ? false : /^\d+$/.test(v) ? Number(v) : v;
  }
  const doc = await generateRandomDatasheet(Number(values.seed), overrides);
  console.log(doc.answers.layout);
  console.log(JSON.stringify(doc.choices));
  const pdf = await readPdf(doc.pdf);
  if (values.lines) {
    for (const p of pdf.pages) {
      console.log(`--- page ${p.page}`);
      for (const l of pageLines(p)) console.log(`${l.y.toFixed(0).padStart(4)} | ${l.cells.map((c) => `[${c.x0.toFixed(0)}]${c.text}`).join(' ')}`);
    }
  }
  const r = extractRatings(pdf);
  const got = new Map(r.variants.map((v) => [v.mpn, v]));
  for (const v of doc.answers.variants) {
    const g = got.get(v.mpn);
    const row = Object.entries(v.fields).map(([f, a]) => {
      const e = g?.fields[f as keyof typeof g.fields];
      return `${f}=${a.value}${a.unit}${e ? (Math.abs(e.si - a.si) <= 1e-6 * Math.abs(a.si) + 1e-12 ? '✓' : `✗(${e.text})`) : '·'}`;
    });
    console.log(`${v.mpn}${g ? '' : ' (NOT FOUND)'}: ${row.join(' ')}`);
  }
  for (const v of r.variants) if (!doc.answers.variants.some((a) => a.mpn === v.mpn)) console.log(`invented: ${v.mpn}`);
  for (const w of r.warnings) console.log(`warn: ${w}`);
}
void main();
