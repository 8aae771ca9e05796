import { queryRoots } from '@/lib/query-keys';

export const datasheetKeys = {
  all: queryRoots.datasheets,
  detail: (id: number) => [...datasheetKeys.all, 'detail', id] as const,
  extraction: (id: number) => [...datasheetKeys.all, 'extraction', id] as const,
  file: (id: number) => [...datasheetKeys.all, 'file', id] as const,
};
