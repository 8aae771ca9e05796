/**
 * Writes the invented demo datasheets, their answer keys, the bad-upload fixtures and the
 * demo catalogue. Deterministic: a second run writes the same bytes.
 *
 *   npm run generate -w test-fixtures
 */
import { mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { corruptPdf, encryptedPdf, notAPdf, scannedPdf, truncatedPdf } from './lib/bad-uploads';
import { buildCatalogue } from './lib/catalogue';
import { rasterisePdf } from './lib/raster';
import { brackenford, Built, corriebank, lumenvale } from './lib/datasheets-a';
import { aldmoor, nettlecombe, quarryhill } from './lib/datasheets-b';
import { ostrander, tevorrow } from './lib/datasheets-c';
import { buildSeries, SERIES, SeriesData } from './lib/series';
import { AnswerKey } from './lib/types';

const root = join(__dirname, '..');
const datasheetDir = join(root, 'datasheets');
const badDir = join(root, 'bad-uploads');
const catalogueDir = join(root, 'catalogue');
const scannedDir = join(root, 'scanned');
/** Datasheets that also get a scanned copy (image-only pages, the same answer key page for page). */
const SCANNED: Array<{ layout: keyof typeof SERIES; seed: number }> = [
  { layout: 'brz', seed: 301 },
  { layout: 'cbx', seed: 302 },
];

const LAYOUTS: Array<[keyof typeof SERIES, (d: SeriesData) => Promise<Built>]> = [
  ['brz', brackenford],
  ['lvd', lumenvale],
  ['cbx', corriebank],
  ['amzr', aldmoor],
  ['nmz', nettlecombe],
  ['qhz', quarryhill],
  ['tpz', tevorrow],
  ['odw', ostrander],
];

function json(value: unknown): string {
  return `${JSON.stringify(value, null, 2)}\n`;
}

async function main(): Promise<void> {
  for (const dir of [datasheetDir, badDir, catalogueDir, scannedDir]) {
    mkdirSync(dir, { recursive: true });
    for (const f of readdirSync(dir)) rmSync(join(dir, f));
  }
  const series: SeriesData[] = [];
  const keys: AnswerKey[] = [];
  const pdfs = new Map<string, Buffer>();
  for (const [name, layout] of LAYOUTS) {
    const data = buildSeries(SERIES[name]);
    const built = await layout(data);
    writeFileSync(join(datasheetDir, data.def.file), built.pdf);
    writeFileSync(join(datasheetDir, data.def.file.replace(/\.pdf$/, '.answers.json')), json(built.answers));
    series.push(data);
    keys.push(built.answers);
    pdfs.set(name, built.pdf);
    console.log(`${data.def.file}: ${built.answers.pages} pages, ${built.answers.variants.length} variants, ${built.pdf.length} bytes`);
  }

  writeFileSync(join(badDir, 'not-a-pdf.pdf'), notAPdf());
  writeFileSync(join(badDir, 'empty.pdf'), Buffer.alloc(0));
  writeFileSync(join(badDir, 'truncated.pdf'), truncatedPdf(pdfs.get('lvd')!));
  writeFileSync(join(badDir, 'corrupt.pdf'), corruptPdf());
  writeFileSync(join(badDir, 'encrypted.pdf'), await encryptedPdf());
  writeFileSync(join(badDir, 'scanned.pdf'), await scannedPdf());
  for (const { layout, seed } of SCANNED) {
    const file = SERIES[layout].file;
    const scan = await rasterisePdf(pdfs.get(layout)!, { seed });
    writeFileSync(join(scannedDir, file.replace(/\.pdf$/, '.scanned.pdf')), scan.pdf);
    console.log(`scanned/${file}: ${scan.pages.length} pages at ${scan.dpi} dpi, ${scan.pdf.length} bytes`);
  }
  console.log(`bad-uploads: ${readdirSync(badDir).length} files`);

  const catalogue = buildCatalogue(series, keys);
  writeFileSync(join(catalogueDir, 'demo-catalogue.json'), json(catalogue));
  console.log(`catalogue: ${catalogue.houseParts.length} house parts, ${catalogue.vendors.length} vendors, ${catalogue.vendorParts.length} vendor parts`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
