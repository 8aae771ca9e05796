/**
 * Loads the large invented catalogue into its own local database (`.data/large-<parts>/`),
 * for the search load benchmark: `npx tsx api/bench/seed-large.ts [parts]` (default
 * 100 000; 1000000 for the million-part figures). Nothing here touches `.data/` itself.
 */
import { ensureLargeData, largeDataDir } from './large-data';

const parts = Number(process.argv[2] ?? process.env.LARGE_PARTS ?? 100_000);
console.log(`large catalogue of ${parts} vendor parts in ${largeDataDir(parts)}`);
ensureLargeData(parts).then(
  () => process.exit(0),
  (error) => {
    console.error(error);
    process.exit(1);
  },
);
