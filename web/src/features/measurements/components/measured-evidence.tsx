import { Alert, Paper, Stack, Text, Title } from '@mantine/core';
import { describeError } from '@/lib/api-client';
import { useMeasurementSets } from '../api/get-measurement-sets';
import { MeasurementSetResult } from './measurements-panel';

export interface MeasuredSource {
  vendorPartId: number;
  label: string;
}

function SourceSets({ source, housePartId }: { source: MeasuredSource; housePartId: number }) {
  const sets = useMeasurementSets(source.vendorPartId, housePartId);
  if (sets.isError) {
    return (
      <Alert color="red" role="alert">
        Measurements of {source.label} could not be loaded: {describeError(sets.error)}
      </Alert>
    );
  }
  if (!sets.data || sets.data.length === 0) return null;
  return (
    <Stack gap="xs">
      <Text fw={600}>{source.label}</Text>
      {sets.data.map((set) => (
        <MeasurementSetResult key={set.id} set={set} />
      ))}
    </Stack>
  );
}

/**
 * The bench measurements of each source, held against the house part's spec as well as the
 * datasheet: shown on Compare and on a case page, below the datasheet-based checks.
 */
export function MeasuredEvidence({ housePartId, sources }: { housePartId: number; sources: MeasuredSource[] }) {
  return (
    <Paper component="section" aria-labelledby="measured-evidence-title" mt="md">
      <Stack gap="sm">
        <Title order={2} fz="h4" id="measured-evidence-title">
          Measured samples against the spec
        </Title>
        <Text fz="xs" c="dimmed">
          Bench measurements uploaded on each vendor part, fitted per sample and read at the spec&apos;s reference current; parts without measurements are not
          listed.
        </Text>
        {sources.map((s) => (
          <SourceSets key={s.vendorPartId} source={s} housePartId={housePartId} />
        ))}
      </Stack>
    </Paper>
  );
}
