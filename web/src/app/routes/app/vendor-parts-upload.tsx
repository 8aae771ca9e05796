import { useState } from 'react';
import { Anchor, Button, Collapse, Paper, Stack, Text } from '@mantine/core';
import { IconTable } from '@tabler/icons-react';
import type { UploadDatasheetResponse } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { useExtraction } from '@/features/datasheets/api/get-extraction';
import { DatasheetUpload } from '@/features/datasheets/components/datasheet-upload';
import { SeriesReview } from '@/features/datasheets/components/series-review';
import { useManufacturers } from '@/features/vendor-parts/api/get-manufacturers';

/** The parts of one uploaded datasheet, reviewed in a table before they become vendor parts. */
function ReviewPanel({ result, manufacturers }: { result: UploadDatasheetResponse; manufacturers: string[] }) {
  const [open, setOpen] = useState(false);
  const extraction = useExtraction(result.id);
  const variants = extraction.data?.variants ?? [];
  if (variants.length === 0) return null;
  return (
    <Stack gap={6}>
      <Button size="compact-sm" variant={open ? 'subtle' : 'light'} leftSection={<IconTable size={14} />} onClick={() => setOpen((o) => !o)} w="fit-content">
        {open ? 'Hide the review' : `Review ${variants.length} part${variants.length === 1 ? '' : 's'} and create them`}
      </Button>
      <Collapse in={open}>
        {open && <SeriesReview datasheetId={result.id} fileName={result.fileName} variants={variants} manufacturers={manufacturers} />}
      </Collapse>
    </Stack>
  );
}

export function VendorPartsUploadRoute() {
  const manufacturers = useManufacturers();
  const names = (manufacturers.data ?? []).map((m) => m.name);
  return (
    <>
      <PageHeader
        title="Upload datasheets"
        description={
          <>
            Drop one or many vendor PDFs. Each is stored once, read for ratings with their pages, and its parts can be reviewed and created in one go.{' '}
            <Anchor component={Link} to="/vendor-parts" fz="sm" underline="always">
              Back to vendor parts
            </Anchor>
          </>
        }
      />
      <Paper>
        <DatasheetUpload renderResult={(result) => <ReviewPanel result={result} manufacturers={names} />} />
      </Paper>
      <Text fz="xs" c="dimmed" mt="sm">
        To add a datasheet to one part, open the part and upload it there: its values then appear as suggestions beside the card.
      </Text>
    </>
  );
}
