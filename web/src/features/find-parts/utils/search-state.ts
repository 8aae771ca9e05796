import type { SearchParams } from '../api/find-parts-keys';

export const PAGE_SIZES = ['10', '25', '50', '100'];
export const DEFAULT_PAGE_SIZE = 25;

export function numberParam(value: string | null): number | undefined {
  if (value === null || value === '') return undefined;
  const n = Number(value);
  return Number.isFinite(n) ? n : undefined;
}

/** The search as the address keeps it, so back, reload and a shared link show the same results. */
export function searchParamsFromUrl(search: URLSearchParams): SearchParams {
  const bool = (k: string) => (search.get(k) === 'true' ? true : undefined);
  return {
    pageIndex: numberParam(search.get('page')) ?? 0,
    pageSize: numberParam(search.get('size')) ?? DEFAULT_PAGE_SIZE,
    sort: search.get('sort') || 'relevance',
    q: search.get('q') || undefined,
    vzFrom: numberParam(search.get('vzFrom')),
    vzTo: numberParam(search.get('vzTo')),
    vzWindow: bool('vzWindow'),
    package: search.get('package') || undefined,
    pdMin: numberParam(search.get('pdMin')),
    toleranceMax: numberParam(search.get('toleranceMax')),
    manufacturer: search.get('manufacturer') || undefined,
    housePartId: numberParam(search.get('housePartId')),
    includeNotCleared: bool('includeNotCleared'),
  };
}

export const TOLERANCE_CHOICES = [
  { value: '', label: 'any' },
  { value: '0.01', label: '±1 % or better' },
  { value: '0.02', label: '±2 % or better' },
  { value: '0.05', label: '±5 % or better' },
];

export const SORT_CHOICES = [
  { value: 'relevance', label: 'Best match (else VZ)' },
  { value: 'vzNom', label: 'VZ, low to high' },
  { value: '-vzNom', label: 'VZ, high to low' },
  { value: '-pdMax', label: 'Power, high to low' },
  { value: 'pdMax', label: 'Power, low to high' },
  { value: 'mpn', label: 'Part number' },
  { value: 'manufacturer', label: 'Manufacturer' },
  { value: 'package', label: 'Package' },
];
