import { Button } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { IconPlus } from '@tabler/icons-react';
import { useNavigate } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { ExportButton } from '@/features/catalogue/components/export-button';
import { HousePartFormModal } from '@/features/house-parts/components/house-part-form-modal';
import { HousePartsTable } from '@/features/house-parts/components/house-parts-table';

export function HousePartsRoute() {
  const [creating, { open, close }] = useDisclosure(false);
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        title="House parts"
        description="Internal part numbers with their specs and sources."
        actions={
          <>
            <ExportButton what="house-parts" />
            <Button leftSection={<IconPlus size={16} />} onClick={open}>
              New house part
            </Button>
          </>
        }
      />
      <HousePartsTable />
      <HousePartFormModal opened={creating} onClose={close} onSaved={(part) => navigate(`/house-parts/${part.id}`)} />
    </>
  );
}
