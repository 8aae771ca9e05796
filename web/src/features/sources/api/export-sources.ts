import { useMutation } from '@tanstack/react-query';
import { downloadFile } from '@/lib/api-client';
import { sourcesSearch } from './get-sources';
import type { SourcesParams } from './sources-keys';

/** The Sources view as CSV, with the same filters as the screen, downloaded with the session's token. */
export function exportSources(params: SourcesParams): Promise<string> {
  return downloadFile(`/qualification-views/sources.csv${sourcesSearch(params)}`, 'sources.csv');
}

export function useExportSources() {
  return useMutation({ mutationFn: exportSources });
}
