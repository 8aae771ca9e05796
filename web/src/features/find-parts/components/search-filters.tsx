import { useEffect, useState } from 'react';
import { Button, Checkbox, Group, MultiSelect, Paper, Select, Stack, Switch, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { IconFilterOff, IconSearch } from '@tabler/icons-react';
import { QuantityInput } from '@/components/quantity-input';
import { useSearchFacets } from '../api/get-facets';
import type { SearchParams } from '../api/find-parts-keys';
import { TOLERANCE_CHOICES } from '../utils/search-state';

export type FilterChanges = Record<string, string | number | boolean | undefined | null>;

export interface SearchFiltersProps {
  params: SearchParams;
  /** Writes changes to the address (and so the query), back on the first page. */
  onChange: (changes: FilterChanges) => void;
}

const list = (text: string | undefined) => (text ? text.split(',').filter(Boolean) : []);

/**
 * The parametric filters and the text. Typed values reach the search after a pause; a
 * value that does not read is not sent (its field says why) and a reversed range is held back.
 */
export function SearchFilters({ params, onChange }: SearchFiltersProps) {
  const facets = useSearchFacets();
  const [text, setText] = useState(params.q ?? '');
  const [q] = useDebouncedValue(text.trim(), 250);
  const [vzFrom, setVzFrom] = useState<number | null>(params.vzFrom ?? null);
  const [vzTo, setVzTo] = useState<number | null>(params.vzTo ?? null);
  const [pdMin, setPdMin] = useState<number | null>(params.pdMin ?? null);

  const readable = (v: number | null) => (v === null || Number.isNaN(v) ? undefined : v);
  const rangeError = readable(vzFrom) !== undefined && readable(vzTo) !== undefined && vzFrom! > vzTo! ? 'VZ from is above VZ to' : undefined;
  // Each value on its own: a debounced object would be new on every render and never settle.
  const [typedVzFrom] = useDebouncedValue(readable(vzFrom), 300);
  const [typedVzTo] = useDebouncedValue(readable(vzTo), 300);
  const [typedPdMin] = useDebouncedValue(readable(pdMin), 300);

  useEffect(() => {
    const next = { q: q || undefined, vzFrom: rangeError ? params.vzFrom : typedVzFrom, vzTo: rangeError ? params.vzTo : typedVzTo, pdMin: typedPdMin };
    if (next.q !== params.q || next.vzFrom !== params.vzFrom || next.vzTo !== params.vzTo || next.pdMin !== params.pdMin) {
      // The window check needs a range; without one it is dropped rather than refused.
      const keepWindow = next.vzFrom !== undefined || next.vzTo !== undefined;
      onChange({ ...next, vzWindow: keepWindow ? params.vzWindow : undefined });
    }
  }, [q, typedVzFrom, typedVzTo, typedPdMin, rangeError, params, onChange]);

  const houseParts = (facets.data?.houseParts ?? []).filter((h) => h.cleared > 0 || h.id === params.housePartId);
  const anyFilter =
    text ||
    vzFrom !== null ||
    vzTo !== null ||
    pdMin !== null ||
    params.package ||
    params.manufacturer ||
    params.toleranceMax ||
    params.housePartId ||
    params.includeNotCleared ||
    params.vzWindow;

  return (
    <Paper p="sm" mb="md" role="search" aria-label="Find parts">
      <Stack gap="xs">
        <Group gap="sm" align="flex-end" wrap="wrap">
          <TextInput
            style={{ flex: '1 1 240px' }}
            label="Search"
            placeholder="Part number, manufacturer, house part number or description; typos are fine"
            leftSection={<IconSearch size={16} />}
            value={text}
            onChange={(e) => setText(e.currentTarget.value)}
            maxLength={100}
          />
          <Select
            w={200}
            label="For house part"
            placeholder="any"
            searchable
            clearable
            nothingFoundMessage="No house part with usable parts"
            data={houseParts.map((h) => ({ value: String(h.id), label: `${h.partNumber} (${h.cleared})` }))}
            value={params.housePartId !== undefined ? String(params.housePartId) : null}
            onChange={(v) => onChange({ housePartId: v ? Number(v) : undefined, includeNotCleared: v ? undefined : params.includeNotCleared })}
            disabled={params.includeNotCleared}
          />
          <MultiSelect
            w={230}
            label="Manufacturer"
            placeholder={params.manufacturer ? undefined : 'any'}
            data={(facets.data?.manufacturers ?? []).map((m) => ({ value: m.value, label: `${m.value} (${params.includeNotCleared ? m.total : m.cleared})` }))}
            value={list(params.manufacturer)}
            onChange={(v) => onChange({ manufacturer: v.join(',') || undefined })}
            searchable
            clearable
            // Mantine keeps 100 px for typing beside the pills, which pushes one pill onto a second line.
            styles={{ inputField: { minWidth: 40 } }}
          />
          <Switch
            mb={6}
            label="Include parts not cleared"
            checked={params.includeNotCleared ?? false}
            onChange={(e) =>
              onChange({ includeNotCleared: e.currentTarget.checked || undefined, housePartId: e.currentTarget.checked ? undefined : params.housePartId })
            }
          />
          {anyFilter && (
            <Button
              mb={4}
              variant="subtle"
              size="sm"
              leftSection={<IconFilterOff size={14} />}
              onClick={() => {
                setText('');
                setVzFrom(null);
                setVzTo(null);
                setPdMin(null);
                // The typed fields follow through their pause, as typing does.
                onChange({
                  vzWindow: undefined,
                  package: undefined,
                  manufacturer: undefined,
                  toleranceMax: undefined,
                  housePartId: undefined,
                  includeNotCleared: undefined,
                });
              }}
            >
              Clear filters
            </Button>
          )}
        </Group>
        <Group gap="sm" align="flex-end" wrap="wrap">
          <QuantityInput w={110} label="VZ from" kind="voltage" unit="V" value={vzFrom} onChange={setVzFrom} error={rangeError} />
          <QuantityInput w={110} label="VZ to" kind="voltage" unit="V" value={vzTo} onChange={setVzTo} />
          <Checkbox
            mb={8}
            label="Whole tolerance window inside"
            checked={params.vzWindow ?? false}
            disabled={params.vzFrom === undefined && params.vzTo === undefined}
            onChange={(e) => onChange({ vzWindow: e.currentTarget.checked || undefined })}
          />
          <Select
            w={160}
            label="VZ tolerance"

            data={TOLERANCE_CHOICES}
            value={params.toleranceMax !== undefined ? String(params.toleranceMax) : ''}
            onChange={(v) => onChange({ toleranceMax: v ? Number(v) : undefined })}
            allowDeselect={false}
          />
          <QuantityInput w={120} label="Power at least" kind="power" unit="mW" value={pdMin} onChange={setPdMin} />
          <MultiSelect
            w={260}
            label="Package"

            placeholder={params.package ? undefined : 'any'}
            data={(facets.data?.packages ?? []).map((p) => ({ value: p.value, label: `${p.value} (${params.includeNotCleared ? p.total : p.cleared})` }))}
            value={list(params.package)}
            onChange={(v) => onChange({ package: v.join(',') || undefined })}
            searchable
            clearable
            // Mantine keeps 100 px for typing beside the pills, which pushes one pill onto a second line.
            styles={{ inputField: { minWidth: 40 } }}
          />
        </Group>
        <Text fz="xs" c="dimmed">
          VZ is each part&apos;s own at its test current IZT, 25 °C; power is its rating PD max. The numbers beside packages and manufacturers count{' '}
          {params.includeNotCleared ? 'catalogue' : 'usable'} parts.
        </Text>
      </Stack>
    </Paper>
  );
}
