import { PageHeader } from '@/components/page-header';
import { SourcesTable } from '@/features/sources/components/sources-table';

export function SourcesRoute() {
  return (
    <>
      <PageHeader title="Sources" description="Per house part, every source: whether it is cleared, on what conditions, since when and who decided." />
      <SourcesTable />
    </>
  );
}
