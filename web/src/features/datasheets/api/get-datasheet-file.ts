import { useQuery } from '@tanstack/react-query';
import { fetchBytes } from '@/lib/api-client';
import { datasheetKeys } from './datasheet-keys';

/** The PDF's bytes (stored files never change, so they are read once per session). */
export function useDatasheetFile(datasheetId: number | null) {
  return useQuery({
    queryKey: datasheetKeys.file(datasheetId ?? 0),
    queryFn: ({ signal }) => fetchBytes(`/datasheets/${datasheetId}/file`, signal),
    enabled: datasheetId !== null,
    staleTime: Infinity,
    gcTime: 10 * 60_000,
  });
}
