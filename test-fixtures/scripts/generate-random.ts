/**
 * Writes random-layout datasheets and their answer keys to a folder, for looking at.
 *
 *   npm run generate:random -w test-fixtures -- --seed 123 --count 10 --out /tmp/x
 *
 * Document i uses seed + i, as the extraction test does.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { generateRandomDatasheet } from './lib/random-layout';

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: { seed: { type: 'string', default: '1' }, count: { type: 'string', default: '10' }, out: { type: 'string', default: 'random-datasheets' } },
  });
  const seed = Number(values.seed);
  const count = Number(values.count);
  if (!Number.isInteger(seed) || !Number.isInteger(count) || count < 1) throw new Error('--seed and --count must be whole numbers (count at least 1)');
  const out = resolve(process.cwd(), values.out!);
  mkdirSync(out, { recursive: true });
  for (let i = 0; i < count; i++) {
    const { pdf, answers } = await generateRandomDatasheet(seed + i);
    writeFileSync(join(out, answers.file), pdf);
    writeFileSync(join(out, answers.file.replace(/\.pdf$/, '.answers.json')), `${JSON.stringify(answers, null, 2)}\n`);
    console.log(`${answers.file}: ${answers.pages} pages, ${answers.variants.length} variants, ${answers.layout}`);
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
