import { useMemo, useState } from 'react';
import { Alert, Anchor, Autocomplete, Badge, Button, Checkbox, Group, List, Stack, Table, Text, TextInput } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import {
  cardDraftFromExtraction,
  cardFieldProblems,
  EXTRACTION_FIELDS,
  type CardField,
  type CreateVariantsResponse,
  type ExtractedVariant,
  type ExtractionField,
  type RatingCardFieldsInput,
  type TempCoUnit,
} from '@shuntwise/contracts';
import { Link } from 'react-router';
import { formatForInput, QuantityInput } from '@/components/quantity-input';
import { TempCoInput } from '@/components/temp-co-input';
import { ApiError, describeError } from '@/lib/api-client';
import { CARD_FIELD_META, cardFieldKind } from '@/lib/card-fields';
import { useCreateVariants } from '../api/create-variants';

type FieldsInput = Partial<RatingCardFieldsInput>;
type FieldValue = { value: number; printed?: string | null; unit?: TempCoUnit; provenance: { source: 'extracted' | 'entered' } };

interface ReviewRow {
  key: string;
  selected: boolean;
  mpn: string;
  package: string;
  fields: FieldsInput;
}

function rowsFrom(variants: readonly ExtractedVariant[], datasheetId: number): ReviewRow[] {
  return variants.map((v, i) => ({
    key: `${i}-${v.mpn}`,
    selected: true,
    mpn: v.mpn,
    package: v.package?.value ?? '',
    fields: cardDraftFromExtraction(v, datasheetId),
  }));
}

/** Client-side checks per row: the same rules the API applies, so most mistakes show before sending. */
function rowProblems(row: ReviewRow): Partial<Record<string, string>> {
  const out: Partial<Record<string, string>> = {};
  if (!row.mpn.trim()) out.mpn = 'Enter the part number';
  const fields = row.fields as Record<string, FieldValue | undefined>;
  for (const field of EXTRACTION_FIELDS) if (fields[field] && Number.isNaN(fields[field]!.value)) out[field] = 'Does not read';
  if (!fields.vzNom) out.vzNom = 'Needed';
  if (!fields.izt) out.izt = 'Needed';
  if (Object.keys(out).length === 0) {
    for (const p of cardFieldProblems(fields as Parameters<typeof cardFieldProblems>[0])) out[p.path[0]] ??= p.message;
  }
  return out;
}

export interface SeriesReviewProps {
  datasheetId: number;
  fileName: string;
  variants: ExtractedVariant[];
  /** Manufacturers already in the catalogue, offered as you type. */
  manufacturers: string[];
  onCreated?: (result: CreateVariantsResponse) => void;
}

/**
 * The parts a series datasheet describes, one row each, every value editable: the
 * engineer reviews, picks the rows to keep and creates their vendor parts and cards at
 * once. An edited value is recorded as entered; the rest keep their page and text.
 */
export function SeriesReview({ datasheetId, fileName, variants, manufacturers, onCreated }: SeriesReviewProps) {
  const [rows, setRows] = useState<ReviewRow[]>(() => rowsFrom(variants, datasheetId));
  const [entered, setEntered] = useState<ReadonlySet<string>>(new Set());
  const [manufacturer, setManufacturer] = useState('');
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [tried, setTried] = useState(false);
  const create = useCreateVariants();
  const [result, setResult] = useState<CreateVariantsResponse | null>(null);

  const columns = useMemo(() => EXTRACTION_FIELDS.filter((f) => rows.some((r) => (r.fields as Record<string, unknown>)[f])), [rows]);
  const problems = useMemo(() => rows.map(rowProblems), [rows]);
  const selected = rows.filter((r) => r.selected);
  const selectedWithProblems = rows.filter((r, i) => r.selected && Object.keys(problems[i]).length > 0).length;

  const update = (key: string, change: (row: ReviewRow) => ReviewRow) => setRows((list) => list.map((r) => (r.key === key ? change(r) : r)));
  const setField = (row: ReviewRow, field: ExtractionField, value: FieldValue | null) => {
    update(row.key, (r) => {
      const fields = { ...r.fields } as Record<string, unknown>;
      if (value === null) delete fields[field];
      else fields[field] = value;
      return { ...r, fields: fields as FieldsInput };
    });
    setEntered((s) => new Set(s).add(`${row.key}.${field}`));
  };

  const submit = () => {
    setTried(true);
    if (!manufacturer.trim()) return;
    if (selected.length === 0 || selectedWithProblems > 0) return;
    setServerErrors({});
    const chosen = rows.filter((r) => r.selected);
    create.mutate(
      {
        datasheetId,
        request: {
          manufacturer: manufacturer.trim(),
          variants: chosen.map((r) => ({ mpn: r.mpn.trim(), package: r.package.trim() || null, fields: r.fields as RatingCardFieldsInput })),
        },
      },
      {
        onSuccess: (created) => {
          setResult(created);
          onCreated?.(created);
          notifications.show({ color: 'verdigris', title: 'Vendor parts created', message: `${created.vendorParts.length} parts from ${fileName}.` });
        },
        onError: (error) => {
          const byCell: Record<string, string> = {};
          if (error instanceof ApiError) {
            for (const e of error.errors ?? []) {
              // variants.3.fields.zzt.value → the row's key and the field
              const m = /^variants\.(\d+)\.(?:fields\.)?(\w+)/.exec(e.path);
              if (m && chosen[Number(m[1])]) byCell[`${chosen[Number(m[1])].key}.${m[2]}`] = e.message;
              else if (e.path === 'manufacturer') byCell.manufacturer = e.message;
            }
          }
          setServerErrors(byCell);
        },
      },
    );
  };

  if (result) {
    return (
      <Alert color="verdigris" title={`${result.vendorParts.length} vendor parts with cards from ${fileName}`} data-testid="series-created">
        <List size="sm" spacing={2}>
          {result.vendorParts.map((p) => (
            <List.Item key={p.vendorPartId}>
              <Anchor component={Link} to={`/vendor-parts/${p.vendorPartId}`}>
                {p.mpn}
              </Anchor>{' '}
              <Text span fz="xs" c="dimmed">
                {p.created ? 'new part' : 'existing part'}, card v{p.cardVersion}
              </Text>
            </List.Item>
          ))}
        </List>
      </Alert>
    );
  }

  const allSelected = rows.every((r) => r.selected);
  return (
    <Stack gap="xs" data-testid="series-review">
      <Group align="flex-end" gap="sm">
        <Autocomplete
          size="xs"
          w={260}
          label="Manufacturer of these parts"
          placeholder="e.g. a maker already listed, or a new one"
          data={manufacturers}
          value={manufacturer}
          onChange={setManufacturer}
          error={serverErrors.manufacturer ?? (tried && !manufacturer.trim() ? 'Enter the manufacturer' : undefined)}
          withAsterisk
        />
        <Text fz="xs" c="dimmed" style={{ flex: 1 }}>
          {selected.length} of {rows.length} parts chosen. Values come from the datasheet; edit any of them — an edited value is recorded as entered.
        </Text>
        <Button size="xs" onClick={submit} loading={create.isPending} disabled={selected.length === 0}>
          Create {selected.length} vendor part{selected.length === 1 ? '' : 's'} with cards
        </Button>
      </Group>
      {tried && selectedWithProblems > 0 && (
        <Alert color="red" p="xs" role="alert">
          {selectedWithProblems} chosen row{selectedWithProblems === 1 ? ' needs' : 's need'} attention (marked in red). Fix or unselect them.
        </Alert>
      )}
      {create.isError && (
        <Alert color="red" p="xs" role="alert" title="Nothing was created">
          {describeError(create.error)}
        </Alert>
      )}
      <Table.ScrollContainer minWidth={400} maxHeight={520}>
        <Table stickyHeader aria-label={`Parts found in ${fileName}`} verticalSpacing={2} horizontalSpacing={4}>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>
                <Checkbox
                  size="xs"
                  aria-label="Choose all parts"
                  checked={allSelected}
                  indeterminate={!allSelected && selected.length > 0}
                  onChange={() => setRows((list) => list.map((r) => ({ ...r, selected: !allSelected })))}
                />
              </Table.Th>
              <Table.Th>Part number</Table.Th>
              <Table.Th>Package</Table.Th>
              {columns.map((f) => (
                <Table.Th key={f} title={CARD_FIELD_META[f].label} style={{ whiteSpace: 'nowrap' }}>
                  {CARD_FIELD_META[f].symbol}
                </Table.Th>
              ))}
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {rows.map((row, index) => {
              const rowProblem = problems[index];
              const cellError = (name: string) => serverErrors[`${row.key}.${name}`] ?? (tried && row.selected ? rowProblem[name] : undefined);
              return (
                <Table.Tr key={row.key} opacity={row.selected ? 1 : 0.5} data-row={row.mpn}>
                  <Table.Td>
                    <Checkbox
                      size="xs"
                      aria-label={`Choose ${row.mpn}`}
                      checked={row.selected}
                      onChange={(e) => {
                        const checked = e.currentTarget.checked;
                        update(row.key, (r) => ({ ...r, selected: checked }));
                      }}
                    />
                  </Table.Td>
                  <Table.Td>
                    <TextInput
                      size="xs"
                      w={130}
                      aria-label={`Part number of row ${index + 1}`}
                      value={row.mpn}
                      error={cellError('mpn')}
                      onChange={(e) => {
                        const mpn = e.currentTarget.value;
                        update(row.key, (r) => ({ ...r, mpn }));
                      }}
                    />
                  </Table.Td>
                  <Table.Td>
                    <TextInput
                      size="xs"
                      w={90}
                      aria-label={`Package of ${row.mpn}`}
                      value={row.package}
                      onChange={(e) => {
                        const pkg = e.currentTarget.value;
                        update(row.key, (r) => ({ ...r, package: pkg }));
                      }}
                    />
                  </Table.Td>
                  {columns.map((field) => {
                    const value = (row.fields as Record<string, FieldValue | undefined>)[field];
                    const isEntered = entered.has(`${row.key}.${field}`);
                    const common = {
                      size: 'xs' as const,
                      w: field === 'tc' ? 104 : 84,
                      'aria-label': `${CARD_FIELD_META[field].symbol} of ${row.mpn}`,
                      error: cellError(field),
                      styles: isEntered ? { input: { borderColor: 'var(--mantine-color-grape-5)' } } : undefined,
                      'data-entered': isEntered || undefined,
                    };
                    return (
                      <Table.Td key={field}>
                        {field === 'tc' ? (
                          <TempCoInput
                            {...common}
                            value={value ? { value: value.value, unit: value.unit ?? 'mV/K' } : null}
                            onChange={(v) =>
                              setField(
                                row,
                                'tc',
                                v ? { value: v.value, unit: v.unit, printed: `${v.value} ${v.unit}`, provenance: { source: 'entered' } } : null,
                              )
                            }
                          />
                        ) : (
                          <QuantityInput
                            {...common}
                            kind={cardFieldKind(field as Exclude<CardField, 'tc'>)}
                            unit={CARD_FIELD_META[field].typingUnit}
                            value={value ? value.value : null}
                            onChange={(v) =>
                              setField(
                                row,
                                field,
                                v === null
                                  ? null
                                  : {
                                      value: v,
                                      printed: Number.isNaN(v) ? null : formatForInput(v, cardFieldKind(field as Exclude<CardField, 'tc'>)),
                                      provenance: { source: 'entered' },
                                    },
                              )
                            }
                          />
                        )}
                      </Table.Td>
                    );
                  })}
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
      <Group gap={6}>
        <Badge size="xs" variant="outline" color="grape">
          purple frame
        </Badge>
        <Text fz="xs" c="dimmed">
          edited here (saved as entered); other values keep their datasheet page.
        </Text>
      </Group>
    </Stack>
  );
}
