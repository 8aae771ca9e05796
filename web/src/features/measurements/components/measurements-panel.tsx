import { useState } from 'react';
import { Alert, Badge, Button, FileButton, Group, List, Paper, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconFileTypeCsv, IconUpload } from '@tabler/icons-react';
import type { MeasurementCsvReading, MeasurementSet, SpreadDto } from '@shuntwise/contracts';
import { MarginText } from '@/components/check-cells';
import { DesignCaution } from '@/components/design-caution';
import { Quantity } from '@/components/quantity';
import { VerdictBadge } from '@/components/verdict-badge';
import { describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useMeasurementSets } from '../api/get-measurement-sets';
import { usePreviewMeasurementFile, useUploadMeasurementSet } from '../api/upload-measurement-set';
import { MeasuredChart } from './measured-chart';

const EXAMPLE = 'sample,lot,current (mA),voltage (V),temperature (°C)';
// Mantine's list items do not wrap by default; these are sentences.
const WRAPPING_LIST = { item: { whiteSpace: 'normal' as const }, itemWrapper: { display: 'inline' } };

function Spread({ spread, kind }: { spread: SpreadDto | null; kind: 'voltage' | 'resistance' }) {
  if (!spread) return <>–</>;
  return (
    <span style={{ whiteSpace: 'nowrap' }}>
      <Quantity value={spread.mean} kind={kind} digits={4} /> (<Quantity value={spread.min} kind={kind} digits={4} /> …{' '}
      <Quantity value={spread.max} kind={kind} digits={4} />, σ <Quantity value={spread.stdDev} kind={kind} digits={2} />)
    </span>
  );
}

/** One measurement set: its checks, the points over the datasheet band, the spread per lot. */
export function MeasurementSetResult({ set }: { set: MeasurementSet }) {
  const a = set.analysis;
  return (
    <Paper withBorder p="sm" component="article" aria-label={`Measurement set ${set.fileName}`}>
      <Stack gap="xs">
        <Group justify="space-between" wrap="wrap">
          <Group gap="xs">
            <IconFileTypeCsv size={18} />
            <Text fw={600}>{set.fileName}</Text>
            <VerdictBadge verdict={a.overall} />
          </Group>
          <Text fz="xs" c="dimmed">
            {[
              set.lot && `lot ${set.lot}`,
              set.instrument,
              set.measuredOn && `measured ${set.measuredOn}`,
              `uploaded ${formatDateTime(set.createdAt)}${set.uploadedBy ? ` by ${set.uploadedBy.name}` : ''}`,
            ]
              .filter(Boolean)
              .join(' · ')}
          </Text>
        </Group>
        <Table.ScrollContainer minWidth={640}>
          <Table fz="sm" striped>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Check</Table.Th>
                <Table.Th>Worst sample</Table.Th>
                <Table.Th>Limit</Table.Th>
                <Table.Th>Margin</Table.Th>
                <Table.Th>Verdict</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {a.checks.map((c) => (
                <Table.Tr key={c.id}>
                  <Table.Td>
                    <Text fz="sm">{c.label}</Text>
                    <Text fz="xs" c="dimmed">
                      {c.detail}
                    </Text>
                  </Table.Td>
                  <Table.Td>
                    <Quantity value={c.value} kind={c.quantity === 'resistance' ? 'resistance' : 'voltage'} digits={4} />
                  </Table.Td>
                  <Table.Td style={{ whiteSpace: 'nowrap' }}>
                    {c.window ? (
                      <>
                        <Quantity value={c.window.min} kind="voltage" /> … <Quantity value={c.window.max} kind="voltage" />
                      </>
                    ) : (
                      <>
                        ≤ <Quantity value={c.limit} kind="resistance" />
                      </>
                    )}
                  </Table.Td>
                  <Table.Td>
                    <MarginText margin={c.margin} verdict={c.verdict} />
                  </Table.Td>
                  <Table.Td>
                    <VerdictBadge verdict={c.verdict} />
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
        <MeasuredChart set={set} />
        <Table.ScrollContainer minWidth={640}>
          <Table fz="sm">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Lot</Table.Th>
                <Table.Th>Samples</Table.Th>
                <Table.Th>Vz at the card’s test current: mean (min … max, σ)</Table.Th>
                <Table.Th>Zd at the card’s test current</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {a.lots.map((l) => (
                <Table.Tr key={l.lot ?? 'all'}>
                  <Table.Td>{l.lot ?? 'all lots'}</Table.Td>
                  <Table.Td>{l.samples}</Table.Td>
                  <Table.Td>
                    <Spread spread={l.vzAtIzt} kind="voltage" />
                  </Table.Td>
                  <Table.Td>
                    <Spread spread={l.zdAtIzt} kind="resistance" />
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
        {(a.warnings.length > 0 || a.samples.some((s) => s.warnings.length > 0)) && (
          <List fz="xs" c="dimmed" styles={WRAPPING_LIST}>
            {a.warnings.map((w) => (
              <List.Item key={w}>{w}</List.Item>
            ))}
            {a.samples.flatMap((s) => s.warnings.map((w) => <List.Item key={`${s.sampleId}-${w}`}>{`${s.sampleId}: ${w}`}</List.Item>))}
          </List>
        )}
      </Stack>
    </Paper>
  );
}

function ReadingSummary({ reading }: { reading: MeasurementCsvReading }) {
  const points = reading.samples.reduce((n, s) => n + s.points.length, 0);
  return (
    <Stack gap={4}>
      <Text fz="sm">
        {reading.samples.length} sample(s), {points} point(s) read
        {reading.errors.length > 0 ? `; ${reading.errors.length} row(s) cannot be read — correct the file and choose it again` : ''}.
      </Text>
      {reading.errors.length > 0 && (
        <List fz="sm" c="red.7" styles={WRAPPING_LIST} aria-label="Rows that cannot be read">
          {reading.errors.slice(0, 20).map((e) => (
            <List.Item key={`${e.row}-${e.column}`}>{`Row ${e.row}${e.column ? `, ${e.column}` : ''}: ${e.message}`}</List.Item>
          ))}
        </List>
      )}
      {reading.warnings.map((w) => (
        <Text key={w} fz="xs" c="dimmed">
          {w}
        </Text>
      ))}
    </Stack>
  );
}

/**
 * Bench measurements of this part's samples: an engineer uploads a CSV (previewed row by row
 * first), and every set is shown against the datasheet's limits and band, with the spread per lot.
 */
export function MeasurementsPanel({ vendorPartId, canUpload }: { vendorPartId: number; canUpload: boolean }) {
  const sets = useMeasurementSets(vendorPartId);
  const preview = usePreviewMeasurementFile();
  const upload = useUploadMeasurementSet();
  const [file, setFile] = useState<File | null>(null);
  const [lot, setLot] = useState('');
  const [instrument, setInstrument] = useState('');
  const [measuredOn, setMeasuredOn] = useState('');

  const choose = (chosen: File | null) => {
    setFile(chosen);
    upload.reset();
    if (chosen) preview.mutate(chosen);
    else preview.reset();
  };
  const reading = file ? preview.data : undefined;
  const store = () => {
    if (!file) return;
    upload.mutate(
      { vendorPartId, file, lot: lot.trim() || undefined, instrument: instrument.trim() || undefined, measuredOn: measuredOn || undefined },
      {
        onSuccess: (set) => {
          notifications.show({ color: 'verdigris', message: `Measurements stored: ${set.samples.length} sample(s) from ${set.fileName}` });
          setFile(null);
          preview.reset();
        },
      },
    );
  };

  return (
    <Paper component="section" aria-labelledby="measured-samples-title" mt="md">
      <Stack gap="sm">
        <Group justify="space-between">
          <Title order={2} fz="h4" id="measured-samples-title">
            Measured samples
          </Title>
          {canUpload && (
            <FileButton onChange={choose} accept=".csv,text/csv">
              {(props) => (
                <Button {...props} variant="default" leftSection={<IconUpload size={16} />}>
                  Choose a measurement CSV
                </Button>
              )}
            </FileButton>
          )}
        </Group>
        {canUpload && !file && (
          <Text fz="xs" c="dimmed">
            One row per point, with a header naming the columns and units, e.g. <code>{EXAMPLE}</code>. mA, µA or A; V or mV; reverse points may be negative.
          </Text>
        )}
        {file && (
          <Paper withBorder p="sm">
            <Stack gap="xs">
              <Text fz="sm" fw={500}>
                {file.name}
              </Text>
              {preview.isPending && <Text fz="sm">Reading…</Text>}
              {preview.isError && (
                <Alert color="red" role="alert">
                  {describeError(preview.error)}
                </Alert>
              )}
              {reading && <ReadingSummary reading={reading} />}
              <Group gap="sm" align="flex-end" wrap="wrap">
                <TextInput label="Lot or date code" value={lot} onChange={(e) => setLot(e.currentTarget.value)} maxLength={60} w={180} />
                <TextInput label="Instrument" value={instrument} onChange={(e) => setInstrument(e.currentTarget.value)} maxLength={120} w={220} />
                <TextInput label="Measured on" type="date" value={measuredOn} onChange={(e) => setMeasuredOn(e.currentTarget.value)} w={170} />
                <Button onClick={store} loading={upload.isPending} disabled={!reading || reading.errors.length > 0 || reading.samples.length === 0}>
                  Store measurements
                </Button>
                <Button variant="subtle" onClick={() => choose(null)}>
                  Cancel
                </Button>
              </Group>
              {upload.isError && (
                <Alert color="red" role="alert">
                  {describeError(upload.error)}
                </Alert>
              )}
            </Stack>
          </Paper>
        )}
        {sets.isError && (
          <Alert color="red" role="alert">
            The measurements could not be loaded: {describeError(sets.error)}
          </Alert>
        )}
        {sets.data?.length === 0 && (
          <Text fz="sm" c="dimmed">
            No bench measurements of this part yet.
          </Text>
        )}
        {sets.data?.map((set) => (
          <MeasurementSetResult key={set.id} set={set} />
        ))}
        {sets.data && sets.data.length > 0 && (
          <Badge variant="light" color="gray" w="fit-content">
            {sets.data.length} set(s)
          </Badge>
        )}
        {sets.data && sets.data.length > 0 && <DesignCaution />}
      </Stack>
    </Paper>
  );
}
