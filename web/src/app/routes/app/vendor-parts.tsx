import { Button } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { IconFileImport, IconPlus, IconUpload } from '@tabler/icons-react';
import { Link, useNavigate } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { ExportButton } from '@/features/catalogue/components/export-button';
import { VendorPartFormModal } from '@/features/vendor-parts/components/vendor-part-form-modal';
import { VendorPartsTable } from '@/features/vendor-parts/components/vendor-parts-table';

export function VendorPartsRoute() {
  const [creating, { open, close }] = useDisclosure(false);
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        title="Vendor parts"
        description="Manufacturer parts with their datasheets and rating cards. Filters and sorting run on the server."
        actions={
          <>
            <ExportButton what="rating-cards" />
            <Button component={Link} to="/vendor-parts/import" variant="default" leftSection={<IconFileImport size={16} />}>
              Import CSV
            </Button>
            <Button component={Link} to="/vendor-parts/upload" variant="light" leftSection={<IconUpload size={16} />}>
              Upload datasheets
            </Button>
            <Button leftSection={<IconPlus size={16} />} onClick={open}>
              New vendor part
            </Button>
          </>
        }
      />
      <VendorPartsTable />
      <VendorPartFormModal opened={creating} onClose={close} onSaved={(part) => navigate(`/vendor-parts/${part.id}`)} />
    </>
  );
}
