import { Anchor } from '@mantine/core';
import { Link } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { CsvImport } from '@/features/catalogue/components/csv-import';
import { useManufacturers } from '@/features/vendor-parts/api/get-manufacturers';

export function VendorPartsImportRoute() {
  const manufacturers = useManufacturers();
  return (
    <>
      <PageHeader
        title="Import a vendor series"
        description={
          <>
            A CSV with one row per part. The preview shows what each row would do and every cell that does not read; nothing is written until you import.{' '}
            <Anchor component={Link} to="/vendor-parts" fz="sm">
              Back to vendor parts
            </Anchor>
          </>
        }
      />
      <CsvImport manufacturers={(manufacturers.data ?? []).map((m) => m.name)} />
    </>
  );
}
