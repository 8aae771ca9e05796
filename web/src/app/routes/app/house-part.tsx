import { useRef, useState } from 'react';
import { Alert, Anchor, Button, Center, Grid, Group, Loader, Stack, Text } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { IconArrowLeft, IconPencil } from '@tabler/icons-react';
import { Link, useParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { useHousePart } from '@/features/house-parts/api/get-house-part';
import { useSpec } from '@/features/house-parts/api/spec';
import { HousePartFormModal } from '@/features/house-parts/components/house-part-form-modal';
import { HousePartStatusBadge } from '@/features/house-parts/components/house-part-status';
import { SourcesPanel } from '@/features/house-parts/components/sources-panel';
import { SpecEditor } from '@/features/house-parts/components/spec-editor';
import { SpecVersions } from '@/features/house-parts/components/spec-versions';
import { specToForm, type SpecFormValues } from '@/features/house-parts/utils/spec-form';
import { describeError } from '@/lib/api-client';

export function HousePartRoute() {
  const id = Number(useParams().id);
  const valid = Number.isInteger(id) && id > 0;
  const part = useHousePart(valid ? id : 0);
  const spec = useSpec(valid ? id : 0);
  const [editing, editModal] = useDisclosure(false);
  const [startFrom, setStartFrom] = useState<{ version: number; values: SpecFormValues; nonce: number } | null>(null);
  const nonce = useRef(0);

  if (!valid) {
    return (
      <Alert color="red" role="alert" title="Not a house part">
        The address does not name a house part.{' '}
        <Anchor component={Link} to="/house-parts">
          Go to the list
        </Anchor>
      </Alert>
    );
  }
  if (part.isPending || spec.isPending) {
    return (
      <Center py="xl">
        <Loader aria-label="Loading the house part" />
      </Center>
    );
  }
  if (part.isError || spec.isError) {
    return (
      <Alert color="red" role="alert" title="The house part could not be loaded">
        {describeError(part.error ?? spec.error)}{' '}
        <Anchor component={Link} to="/house-parts">
          Back to the list
        </Anchor>
      </Alert>
    );
  }

  const p = part.data;
  return (
    <>
      <PageHeader
        title={p.partNumber}
        description={
          <Group gap="xs" component="span">
            <HousePartStatusBadge status={p.status} />
            <Text span fz="sm" c="dimmed">
              {p.description || 'no description'}
            </Text>
          </Group>
        }
        actions={
          <>
            <Button component={Link} to="/house-parts" variant="subtle" leftSection={<IconArrowLeft size={16} />}>
              House parts
            </Button>
            <Button variant="default" leftSection={<IconPencil size={16} />} onClick={editModal.open}>
              Edit
            </Button>
          </>
        }
      />
      <Stack gap="md">
        <Grid gutter="md">
          <Grid.Col span={{ base: 12, lg: 9 }}>
            <SpecEditor housePartId={p.id} partNumber={p.partNumber} current={spec.data} startFrom={startFrom} />
          </Grid.Col>
          <Grid.Col span={{ base: 12, lg: 3 }}>
            <SpecVersions
              housePartId={p.id}
              onStartFrom={(version, s) => {
                nonce.current += 1;
                setStartFrom({ version, values: specToForm(s), nonce: nonce.current });
              }}
            />
          </Grid.Col>
        </Grid>
        <SourcesPanel housePartId={p.id} partNumber={p.partNumber} />
      </Stack>
      <HousePartFormModal key={p.updatedAt} opened={editing} onClose={editModal.close} part={p} />
    </>
  );
}
