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
 * How many of the candidates that do not contain the text outright fuse.js re-ranks (the
 * first ones in the SQL order, which is the n-gram index's score): the typo and
 * transposition matches are among the closest by pieces, and fuzzy scoring costs about
 * 50 µs a candidate, so ranking all SEARCH_TEXT_CANDIDATES cost up to ~17 ms a search.
 */
export const FUZZY_RERANK = 40;

/** Key tiers of an outright match, in fuse's weight order: part number, house part number, maker, description, package. */
const EXACT_TIERS = KEYS.length;

/**
 * Which key holds every word of the text outright (each word in any key, as fuse's $and of
 * $or reads it; part numbers compared compacted, names case-blind): the sum over words of
 * the best key's place in KEYS, lower is better; null when some word is in no key.
 */
function exactTier(record: TextRecord, words: ReadonlyArray<{ compact: string; plain: string }>): number | null {
  const mpn = compact(record.mpn);
  let total = 0;
  for (const w of words) {
    let tier: number = EXACT_TIERS;
    if (mpn.includes(w.compact)) tier = 0;
    else if (record.houseParts.some((h) => compact(h).includes(w.compact))) tier = 1;
    else if (record.manufacturer.toLowerCase().includes(w.plain)) tier = 2;
    else if (record.descriptions.some((d) => d.toLowerCase().includes(w.plain))) tier = 3;
    else if (record.package?.toLowerCase().includes(w.plain)) tier = 4;
    if (tier === EXACT_TIERS) return null;
    total += tier;
  }
  return total;
}

/**
 * Ranks parts by how well every word of `text` matches one of their names. Parts that hold
 * every word outright come first, score 0, by the key they hold it in (part number first)
 * and then in the input order, which the SQL gives by index score and Vz; fuse.js scores
 * only the first `fuzzyLimit` of the others (each word fuzzily, all words required) and
 * drops those too far off. Ties keep the input order.
 */
export function rankByText(records: readonly TextRecord[], text: string, fuzzyLimit = FUZZY_RERANK): RankedMatch[] {
  const tokens = textTokens(text);
  if (tokens.length === 0) return records.map((r) => ({ id: r.id, score: 0 }));
  const words = tokens.map((t) => ({ compact: compact(t) || t.toLowerCase(), plain: t.toLowerCase() }));
  const exact: Array<{ id: number; tier: number; at: number }> = [];
  const rest: TextRecord[] = [];
  records.forEach((r, at) => {
    const tier = exactTier(r, words);
    if (tier !== null) exact.push({ id: r.id, tier, at });
    else if (rest.length < fuzzyLimit) rest.push(r);
  });
  exact.sort((a, b) => a.tier - b.tier || a.at - b.at);
  const ranked: RankedMatch[] = exact.map((e) => ({ id: e.id, score: 0 }));
  if (rest.length === 0) return ranked;
  // Plain literals, not spreads: one object shape for every record (RECIPES: spreads were 25× slower in hot loops).
  const indexed: IndexedRecord[] = rest.map((r) => ({
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
  for (const r of fuse.search(query)) ranked.push({ id: r.item.id, score: r.score ?? 0 });
  return ranked;
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
