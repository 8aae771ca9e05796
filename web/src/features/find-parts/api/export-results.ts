import type { SearchItem } from '@shuntwise/contracts';
import type { SearchParams } from './find-parts-keys';
import { searchParts } from './search-parts';

/** The export reads at most this many parts (the API's largest page, repeated). */
export const EXPORT_LIMIT = 2000;
const PAGE = 100;

/** Every part the search matches, page after page, up to EXPORT_LIMIT; `total` says how many matched. */
export async function allSearchResults(params: SearchParams): Promise<{ items: SearchItem[]; total: number }> {
  const items: SearchItem[] = [];
  let total = 0;
  for (let pageIndex = 0; items.length < EXPORT_LIMIT; pageIndex++) {
    const page = await searchParts({ ...params, pageIndex, pageSize: PAGE });
    total = page.total;
    items.push(...page.items);
    if (page.items.length < PAGE || items.length >= page.total) break;
  }
  return { items: items.slice(0, EXPORT_LIMIT), total };
}
