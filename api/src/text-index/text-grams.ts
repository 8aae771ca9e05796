/**
 * The text-index normalisation: one function decides what a name looks like to search,
 * and the index, the list filters and the ranking all use it. Pure, no database.
 */

/** What an index row belongs to (the `kind` column of text_grams). */
export const TEXT_KINDS = { vendorPart: 1, housePart: 2, manufacturer: 3 } as const;
export type TextKind = keyof typeof TEXT_KINDS;

/** The length of an index piece. */
export const GRAM = 3;

/** Lower case without separators, so "ohi-zd 1051" and "OHI-ZD-1051" look alike ("brz055v1" finds "BRZ05-5V1"). */
export function compact(text: string): string {
  return text.toLowerCase().replace(/[\s\-_./,]+/g, '');
}

/** The distinct three-character pieces of a text after `compact` (none when it is shorter than three characters). */
export function grams(text: string): string[] {
  const chars = Array.from(compact(text));
  const out = new Set<string>();
  for (let i = 0; i + GRAM <= chars.length; i++) out.add(chars.slice(i, i + GRAM).join(''));
  return [...out];
}

/** The text_grams rows of one record: the pieces of each of its names (no piece spans two names). */
export function indexRowsOf(kind: TextKind, id: number, texts: ReadonlyArray<string | null | undefined>): Array<[number, string, number]> {
  const all = new Set<string>();
  for (const text of texts) if (text) for (const g of grams(text)) all.add(g);
  return [...all].map((g) => [TEXT_KINDS[kind], g, id]);
}
