import { PageHeader } from '@/components/page-header';
import { QualificationsTable } from '@/features/qualifications/components/qualifications-table';

export function QualificationsRoute() {
  return (
    <>
      <PageHeader
        title="Qualifications"
        description="Second-source cases: each a vendor part checked against a house part's spec, signed off by a second engineer."
      />
      <QualificationsTable />
    </>
  );
}
