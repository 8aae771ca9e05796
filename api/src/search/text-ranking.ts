import Fuse, { type Expression, type IFuseOptions } from 'fuse.js';
import { compact } from '../text-index/text-grams';

/** What the text is matched against, per part. */
export interface TextRecord {
  id: number;
  mpn: string;
  manufacturer: string;
  package: string | null;
  /** House part numbers and descriptions of the house parts the part is a source of. */
  houseParts: string[];
  descriptions: string[];
}

interface IndexedRecord extends Omit<TextRecord, 'houseParts'> {
  /** The part number without separators, so "brz055v1" finds "BRZ05-5V1". */
  mpnCompact: string;
  housePartsCompact: string[];
}

export interface RankedMatch {
  id: number;
  /** Fuse's score: 0 is an exact match, 1 no match. */
  score: number;
}

// Part numbers are matched without separators on both sides; names and descriptions as written.
const KEYS = [
  { name: 'mpnCompact', weight: 3, compact: true },
  { name: 'housePartsCompact', weight: 2, compact: true },
  { name: 'manufacturer', weight: 1, compact: false },
  { name: 'descriptions', weight: 1, compact: false },
  { name: 'package', weight: 0.5, compact: false },
] as const;

const OPTIONS: IFuseOptions<IndexedRecord> = {
  keys: KEYS.map((k) => ({ name: k.name, weight: k.weight })),
  includeScore: true,
  // Part numbers are short: a location bias would punish a match at the end of "QHZ5V6A".
  ignoreLocation: true,
  threshold: 0.34,
  minMatchCharLength: 2,
  shouldSort: true,
};

// The one normalisation of names, shared with the text index.
export { compact };

/** Words of the typed text (at most 6, each at least 2 characters unless that leaves none). */
export function textTokens(text: string): string[] {
  const words = text.trim().split(/\s+/).filter(Boolean);
  const long = words.filter((w) => w.length >= 2);
  return (long.length > 0 ? long : words).slice(0, 6);
}

/**
 * Ranks parts by how well every word of `text` matches one of their names (fuse.js, each
 * word fuzzily, all words required). Ties keep the input order, which the SQL gives by Vz.
 */
export function rankByText(records: readonly TextRecord[], text: string): RankedMatch[] {
  const tokens = textTokens(text);
  if (tokens.length === 0) return records.map((r) => ({ id: r.id, score: 0 }));
  // Plain literals, not spreads: one object shape for every record (RECIPES: spreads were 25× slower in hot loops).
  const indexed: IndexedRecord[] = records.map((r) => ({
    id: r.id,
    mpn: r.mpn,
    manufacturer: r.manufacturer,
    package: r.package,
    descriptions: r.descriptions,
    mpnCompact: compact(r.mpn),
    housePartsCompact: r.houseParts.map(compact),
  }));
  const fuse = new Fuse(indexed, OPTIONS);
  // A logical query, not fuse's extended syntax: a typed "'" or "!" is then just a character.
  const query: Expression = { $and: tokens.map((t) => ({ $or: KEYS.map((k) => ({ [k.name]: k.compact ? compact(t) || t : t })) })) };
  const results = fuse.search(query);
  return results.map((r) => ({ id: r.item.id, score: r.score ?? 0 }));
}

/** Splits the repository's "number<TAB>description" lines. */
export function splitHouseParts(concat: string | null): { numbers: string[]; descriptions: string[] } {
  const numbers: string[] = [];
  const descriptions: string[] = [];
  if (!concat) return { numbers, descriptions };
  for (const line of concat.split('\n')) {
    const [number, description = ''] = line.split('\t');
    if (number) numbers.push(number);
    if (description) descriptions.push(description);
  }
  return { numbers, descriptions };
}
