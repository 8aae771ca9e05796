import type { ReactNode } from 'react';
import { Alert, Anchor, Button, Center, Group, Loader, Stack, Text } from '@mantine/core';
import type { ComparePayload, CompareSource } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { DesignCaution } from '@/components/design-caution';
import { PageHeader } from '@/components/page-header';
import { Quantity } from '@/components/quantity';
import { describeError } from '@/lib/api-client';
import { useCompare } from '../api/get-compare';
import { ChecksMatrix } from './checks-matrix';
import { IvChart } from './iv-chart';
import { WindowBand } from './window-band';

function EnvelopeLine({ payload }: { payload: ComparePayload }) {
  const { envelope, specWindow } = payload;
  return (
    <>
      Spec v{payload.specVersion}: <Quantity value={specWindow.min} kind="voltage" /> … <Quantity value={specWindow.max} kind="voltage" /> at{' '}
      <Quantity value={specWindow.current} kind="current" />; operating <Quantity value={envelope.iMin} kind="current" /> …{' '}
      <Quantity value={envelope.iMax} kind="current" />, ambient <Quantity value={envelope.taMin} kind="temperature" /> …{' '}
      <Quantity value={envelope.taMax} kind="temperature" />
    </>
  );
}

/**
 * The approved source and the alternates of a house part side by side, each evaluated
 * now on the current spec and card: curves, worst-case windows and every check.
 */
export function CompareView({
  housePartId,
  renderSourceAction,
}: {
  housePartId: number;
  renderSourceAction?: (payload: ComparePayload, source: CompareSource) => ReactNode;
}) {
  const compare = useCompare(housePartId);

  if (compare.isPending) {
    return (
      <Center py="xl">
        <Loader aria-label="Loading the comparison" />
      </Center>
    );
  }
  if (compare.isError) {
    return (
      <Alert color="red" role="alert" title="The comparison could not be loaded">
        {describeError(compare.error)}
        <Group gap="xs" mt="xs">
          <Button size="xs" variant="default" onClick={() => void compare.refetch()}>
            Try again
          </Button>
          <Anchor component={Link} to={`/house-parts/${housePartId}`} fz="sm" underline="always">
            Open the house part
          </Anchor>
        </Group>
      </Alert>
    );
  }

  const payload = compare.data;
  const unreadable = payload.sources.filter((s) => !s.evaluation);
  return (
    <>
      <PageHeader
        title={`Compare sources of ${payload.housePart.partNumber}`}
        description={
          <>
            <Anchor component={Link} to={`/house-parts/${payload.housePart.id}`} fz="sm" underline="always">
              {payload.housePart.partNumber}
            </Anchor>{' '}
            {payload.housePart.description}
            <br />
            <EnvelopeLine payload={payload} />
          </>
        }
        actions={
          <Button component={Link} to="/board" variant="subtle">
            Board
          </Button>
        }
      />
      <Stack gap="md">
        {payload.sources.length === 0 && (
          <Alert color="gray" title="No source to compare">
            {payload.housePart.partNumber} has no source linked yet. Link the approved source and the alternates on the house part first.
          </Alert>
        )}
        {unreadable.length > 0 && (
          <Alert color="orange" p="xs">
            {unreadable.map((s) => (
              <Text key={s.vendorPart.id} fz="sm">
                {s.vendorPart.mpn}: not drawn — {s.reason ?? 'no evaluation'}
              </Text>
            ))}
          </Alert>
        )}
        {payload.sources.length > 0 && (
          <>
            <IvChart payload={payload} />
            <WindowBand payload={payload} />
            <ChecksMatrix payload={payload} renderSourceAction={renderSourceAction ? (i) => renderSourceAction(payload, payload.sources[i]) : undefined} />
          </>
        )}
        <DesignCaution p="xs" />
      </Stack>
    </>
  );
}
