import { useState } from 'react';
import { Alert, Anchor, Autocomplete, Badge, Button, FileButton, Group, List, Paper, Stack, Table, Text, Textarea, Title } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconEye, IconFileImport, IconFileTypeCsv } from '@tabler/icons-react';
import { CARD_FIELDS, type CardField, type CsvImportPreview, type CsvImportResult, type CsvRowAction, type TempCoUnit } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { describeError } from '@/lib/api-client';
import { CARD_FIELD_META, formatCardValue } from '@/lib/card-fields';
import { useImportVendorSeries, usePreviewVendorSeries } from '../api/import-vendor-series';

// Mantine's list items do not wrap (white-space: nowrap); these are sentences.
const WRAPPING_LIST = { item: { whiteSpace: 'normal' as const }, itemWrapper: { display: 'inline' } };

const ACTION: Record<CsvRowAction, { label: string; title: string; color: string }> = {
  create: { label: 'new', title: 'a new vendor part with its card', color: 'verdigris' },
  'add-card': { label: 'adds card', title: 'the part exists without a card: the card is added', color: 'copper' },
  unchanged: { label: 'unchanged', title: 'the part already has this very card', color: 'gray' },
  conflict: { label: 'left alone', title: 'the part has a different card, which an import never overwrites', color: 'yellow' },
};

const EXAMPLE = `manufacturer,mpn,package,vzNom (V),izt (mA),zzt (ohm),izk (mA),zzk (ohm),irMax (uA),vr (V),tc (mV/K),pdMax (mW)`;

export interface CsvImportProps {
  manufacturers: string[];
}

/**
 * A vendor series from CSV: the API reads it and answers row by row what an import
 * would do, with every cell it cannot read; nothing is written until the engineer
 * confirms, and then every row is written or none.
 */
export function CsvImport({ manufacturers }: CsvImportProps) {
  const [csv, setCsv] = useState('');
  const [fileName, setFileName] = useState<string | null>(null);
  const [manufacturer, setManufacturer] = useState('');
  const [previewed, setPreviewed] = useState<{ csv: string; manufacturer: string; preview: CsvImportPreview } | null>(null);
  const [result, setResult] = useState<CsvImportResult | null>(null);
  const preview = usePreviewVendorSeries();
  const confirm = useImportVendorSeries();

  const request = { csv, manufacturer: manufacturer.trim() || undefined };
  const stale = previewed !== null && (previewed.csv !== csv || previewed.manufacturer !== manufacturer);
  const shown = previewed?.preview;

  const readFile = async (file: File | null) => {
    if (!file) return;
    setFileName(file.name);
    setCsv(await file.text());
    setResult(null);
  };

  const runPreview = () =>
    preview.mutate(request, {
      onSuccess: (p) => {
        setPreviewed({ csv, manufacturer, preview: p });
        setResult(null);
      },
    });

  const runImport = () =>
    confirm.mutate(request, {
      onSuccess: (r) => {
        setResult(r);
        notifications.show({ color: 'verdigris', title: 'Import written', message: `${r.created} new parts, ${r.cardsAdded} cards added.` });
      },
    });

  const writable = shown ? shown.summary.create + shown.summary.addCard : 0;
  const usedFields = shown ? CARD_FIELDS.filter((f) => shown.columns.some((c) => c.field === f)) : [];

  return (
    <Stack gap="md">
      <Paper>
        <Stack gap="sm">
          <Group align="flex-end" gap="sm">
            <FileButton onChange={readFile} accept=".csv,text/csv,text/plain">
              {(props) => (
                <Button variant="default" leftSection={<IconFileTypeCsv size={16} />} {...props}>
                  Choose a CSV file
                </Button>
              )}
            </FileButton>
            <Text fz="sm" c="dimmed">
              {fileName ?? 'or paste the rows below'}
            </Text>
            <Autocomplete
              ml="auto"
              w={260}
              size="sm"
              label="Manufacturer for rows without one"
              data={manufacturers}
              value={manufacturer}
              onChange={setManufacturer}
            />
          </Group>
          <Textarea
            label="CSV"
            description={`One row per part; units in the header — izt (mA), izt [mA] — or in each cell (5 mA). Example header: ${EXAMPLE}`}
            autosize
            minRows={6}
            maxRows={14}
            value={csv}
            onChange={(e) => setCsv(e.currentTarget.value)}
            styles={{ input: { fontFamily: 'var(--mantine-font-family-monospace)', fontSize: 12 } }}
            spellCheck={false}
          />
          <Group justify="flex-end" gap="xs">
            <Button variant="light" leftSection={<IconEye size={16} />} onClick={runPreview} loading={preview.isPending} disabled={csv.trim() === ''}>
              Preview
            </Button>
            <Button
              leftSection={<IconFileImport size={16} />}
              onClick={runImport}
              loading={confirm.isPending}
              disabled={!shown || stale || shown.summary.withErrors > 0 || writable === 0 || result !== null}
            >
              {shown && shown.summary.withErrors > 0
                ? `Import (fix ${shown.summary.withErrors} row${shown.summary.withErrors === 1 ? '' : 's'} first)`
                : `Import ${writable} row${writable === 1 ? '' : 's'}`}
            </Button>
          </Group>
          {preview.isError && (
            <Alert color="red" role="alert" title="The CSV could not be read">
              {describeError(preview.error)}
            </Alert>
          )}
          {confirm.isError && (
            <Alert color="red" role="alert" title="Nothing was imported">
              {describeError(confirm.error)}
            </Alert>
          )}
          {stale && (
            <Alert color="yellow" p="xs">
              The text changed since the preview: preview again before importing.
            </Alert>
          )}
        </Stack>
      </Paper>

      {result && (
        <Alert color="verdigris" title="Imported" data-testid="csv-result">
          {result.created} new vendor parts with their cards, {result.cardsAdded} cards added to parts that had none, {result.unchanged} unchanged.
          {result.conflicts.length > 0 && ` ${result.conflicts.length} rows left alone because the part has a different card.`}
          <Group gap="xs" mt={4}>
            <Text span fz="xs">
              Open:
            </Text>
            {result.vendorPartIds.slice(0, 20).map((id) => (
              <Anchor key={id} component={Link} to={`/vendor-parts/${id}`} fz="xs">
                #{id}
              </Anchor>
            ))}
          </Group>
        </Alert>
      )}

      {shown && (
        <Stack gap="xs" opacity={stale ? 0.6 : 1}>
          <Group gap="xs">
            <Title order={3} fz="h5">
              Preview
            </Title>
            <Badge color="gray">{shown.summary.rows} rows</Badge>
            {shown.summary.withErrors > 0 && <Badge color="red">{shown.summary.withErrors} with errors</Badge>}
            <Badge color="verdigris">{shown.summary.create} new</Badge>
            <Badge color="copper">{shown.summary.addCard} add a card</Badge>
            {shown.summary.unchanged > 0 && <Badge color="gray">{shown.summary.unchanged} unchanged</Badge>}
            {shown.summary.conflict > 0 && <Badge color="yellow">{shown.summary.conflict} left alone</Badge>}
            <Text fz="xs" c="dimmed">
              Nothing is written until you import.
            </Text>
          </Group>
          {shown.warnings.length > 0 && (
            <Alert color="yellow" p="xs" title="Warnings">
              <List size="sm" styles={WRAPPING_LIST}>
                {shown.warnings.map((w) => (
                  <List.Item key={w}>{w}</List.Item>
                ))}
              </List>
            </Alert>
          )}
          <Text fz="xs" c="dimmed">
            Columns read as: {shown.columns.map((c) => `${c.header} → ${c.field ?? 'not used'}${c.unit ? ` (${c.unit})` : ''}`).join(' · ')}
          </Text>
          <Table.ScrollContainer minWidth={600} maxHeight={560}>
            <Table stickyHeader aria-label="Import preview">
              <Table.Thead>
                <Table.Tr>
                  <Table.Th>Row</Table.Th>
                  <Table.Th>Manufacturer</Table.Th>
                  <Table.Th>Part number</Table.Th>
                  <Table.Th>Package</Table.Th>
                  <Table.Th>Does</Table.Th>
                  {usedFields.map((f) => (
                    <Table.Th key={f} style={{ whiteSpace: 'nowrap' }}>
                      {CARD_FIELD_META[f].symbol}
                    </Table.Th>
                  ))}
                  <Table.Th>Problems</Table.Th>
                </Table.Tr>
              </Table.Thead>
              <Table.Tbody>
                {shown.rows.map((row) => (
                  <Table.Tr key={row.row} bg={row.errors.length ? 'var(--mantine-color-red-light)' : undefined} data-errors={row.errors.length || undefined}>
                    <Table.Td>{row.row}</Table.Td>
                    <Table.Td>{row.manufacturer ?? '–'}</Table.Td>
                    <Table.Td>{row.mpn ?? '–'}</Table.Td>
                    <Table.Td>{row.package ?? '–'}</Table.Td>
                    <Table.Td>
                      {row.action && (
                        <Badge size="xs" color={ACTION[row.action].color} title={ACTION[row.action].title}>
                          {ACTION[row.action].label}
                        </Badge>
                      )}
                    </Table.Td>
                    {usedFields.map((f) => {
                      const v = row.values[f];
                      const columnError = row.errors.some((e) => shown.columns.find((c) => c.header === e.column)?.field === f);
                      return (
                        <Table.Td
                          key={f}
                          style={{ whiteSpace: 'nowrap', fontVariantNumeric: 'tabular-nums' }}
                          c={columnError ? 'red' : undefined}
                          title={v?.printed}
                        >
                          {v ? formatCardValue(f as CardField, v.value, (v.unit as TempCoUnit | undefined) ?? null) : columnError ? '?' : ''}
                        </Table.Td>
                      );
                    })}
                    <Table.Td>
                      {row.errors.map((e) => (
                        <Text key={`${e.column}-${e.message}`} fz="xs" c="red">
                          {e.column}: {e.message}
                        </Text>
                      ))}
                    </Table.Td>
                  </Table.Tr>
                ))}
              </Table.Tbody>
            </Table>
          </Table.ScrollContainer>
        </Stack>
      )}
    </Stack>
  );
}
