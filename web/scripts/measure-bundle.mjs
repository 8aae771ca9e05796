// Adds up the JavaScript a browser downloads to show the sign-in page (the entry chunk,
// the sign-in route's chunk and every chunk they import statically), gzipped, and fails
// when it is over the budget. Also checks that the data-grid library stays out of it.
// Run after `vite build`: node scripts/measure-bundle.mjs [budgetKiB]
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

const dist = join(dirname(fileURLToPath(import.meta.url)), '..', 'dist');
const budgetKiB = Number(process.argv[2] ?? 150);
const manifest = JSON.parse(readFileSync(join(dist, '.vite', 'manifest.json'), 'utf8'));

function closure(keys) {
  const seen = new Set();
  const visit = (key) => {
    if (seen.has(key)) return;
    seen.add(key);
    for (const dep of manifest[key]?.imports ?? []) visit(dep);
  };
  keys.forEach(visit);
  return seen;
}

const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
const signInKey = Object.keys(manifest).find((k) => k.endsWith('src/app/routes/sign-in.tsx'));
if (!entryKey || !signInKey) {
  console.error('measure-bundle: entry or sign-in route not found in the manifest');
  process.exit(1);
}

const files = [...closure([entryKey, signInKey])].map((k) => manifest[k].file).filter((f) => f.endsWith('.js'));
let total = 0;
let raw = 0;
const rows = files.map((file) => {
  const code = readFileSync(join(dist, file));
  const gz = gzipSync(code).length;
  total += gz;
  raw += code.length;
  return { file, kB: (gz / 1000).toFixed(2) };
});
rows.sort((a, b) => Number(b.kB) - Number(a.kB));
for (const row of rows) console.log(`  ${row.kB.padStart(8)} kB gzip  ${row.file}`);

const gridInSignIn = files.some((file) => readFileSync(join(dist, file), 'utf8').includes('mrt-row-actions'));
const kB = total / 1000;
console.log(`sign-in page JavaScript: ${kB.toFixed(1)} kB gzip (${(raw / 1000).toFixed(1)} kB raw) in ${files.length} files; budget ${budgetKiB} kB`);
console.log(`data-grid library in the sign-in chunks: ${gridInSignIn ? 'yes' : 'no'}`);
if (kB > budgetKiB || gridInSignIn) process.exit(1);
