import { useState } from 'react';
import { Group, Select, Text } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import type { HousePart } from '@shuntwise/contracts';
import { useHousePartChoices } from '../api/get-house-part-choices';

export interface HousePartSelectProps {
  label: string;
  description?: string;
  placeholder?: string;
  value: number | null;
  onChange: (id: number | null) => void;
  /** House parts that cannot be chosen, with why (e.g. already cleared for them). */
  exclude?: ReadonlyMap<number, string>;
  /** A case needs the house part's spec: parts without one are shown but cannot be chosen. */
  requireSpec?: boolean;
  required?: boolean;
  error?: string;
}

/** A house part chosen by number or description; the server finds the matches. */
export function HousePartSelect({
  label,
  description,
  placeholder,
  value,
  onChange,
  exclude,
  requireSpec = false,
  required = false,
  error,
}: HousePartSelectProps) {
  const [search, setSearch] = useState('');
  const [q] = useDebouncedValue(search.trim(), 250);
  const [chosen, setChosen] = useState<HousePart | null>(null);
  // After a choice the field shows its number; list every part again rather than that one only.
  const choices = useHousePartChoices(chosen && q === chosen.partNumber ? '' : q);
  const items = choices.data?.items ?? [];
  const all = chosen && !items.some((h) => h.id === chosen.id) ? [chosen, ...items] : items;
  const why = (h: HousePart) => exclude?.get(h.id) ?? (requireSpec && h.specVersion === null ? 'no spec yet' : null);
  const byId = new Map(all.map((h) => [String(h.id), h]));

  return (
    <Select
      label={label}
      description={description}
      placeholder={placeholder}
      required={required}
      error={error}
      searchable
      clearable
      searchValue={search}
      onSearchChange={setSearch}
      // The server matched number and description words; the list shows what it answered.
      filter={({ options }) => options}
      nothingFoundMessage={choices.isFetching ? 'Looking…' : 'No house part matches'}
      data={all.map((h) => ({ value: String(h.id), label: h.partNumber, disabled: why(h) !== null }))}
      value={value !== null ? String(value) : null}
      onChange={(v) => {
        const h = v ? (byId.get(v) ?? null) : null;
        setChosen(h);
        onChange(h ? h.id : null);
      }}
      renderOption={({ option }) => {
        const h = byId.get(option.value);
        const reason = h ? why(h) : null;
        return (
          <Group gap={6} wrap="nowrap" justify="space-between" w="100%">
            <div>
              <Text fz="sm" fw={500}>
                {option.label}
              </Text>
              <Text fz="xs" c="dimmed" lineClamp={1}>
                {h?.description}
              </Text>
            </div>
            {reason && (
              <Text fz="xs" c="dimmed" style={{ whiteSpace: 'nowrap' }}>
                {reason}
              </Text>
            )}
          </Group>
        );
      }}
      comboboxProps={{ withinPortal: true }}
      maxDropdownHeight={280}
    />
  );
}
