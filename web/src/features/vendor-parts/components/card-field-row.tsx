import { memo } from 'react';
import { Anchor, Badge, Button, Group, Table, Text, Tooltip } from '@mantine/core';
import { IconCheck, IconFileDownload } from '@tabler/icons-react';
import type { CardField, ExtractionBox, ProvenanceSource } from '@shuntwise/contracts';
import { formatForInput, QuantityInput } from '@/components/quantity-input';
import { TempCoInput } from '@/components/temp-co-input';
import { CARD_FIELD_META, cardFieldKind, formatCardValue } from '@/lib/card-fields';
import { formatDateTime, formatShortDate } from '@/lib/format-date';
import { sameFieldValue, type DraftField, type Suggestion } from '../utils/card-draft';
import { SuggestionOrigin } from './suggestion-origin';

export const SOURCE_LABEL: Record<ProvenanceSource, string> = { extracted: 'Extracted', entered: 'Entered', imported: 'Imported' };
export const SOURCE_COLOR: Record<ProvenanceSource, string> = { extracted: 'copper', entered: 'grape', imported: 'indigo' };

export interface SourceLocation {
  datasheetId: number;
  page: number;
  text: string | null;
  box?: ExtractionBox;
}

export interface CardFieldRowProps {
  field: CardField;
  value: DraftField | undefined;
  suggestion: Suggestion | undefined;
  /** Changed in this session, not saved yet. */
  changed: boolean;
  error: string | undefined;
  readOnly: boolean;
  onEnter: (field: CardField, value: number | null, printed: string | null, unit?: 'mV/K' | '%/K') => void;
  onAccept: (suggestion: Suggestion) => void;
  onShowSource: (location: SourceLocation) => void;
}

/** Where a value sits in its datasheet, with the box when the stored value is the suggestion itself. */
function locationOf(value: DraftField | undefined, suggestion: Suggestion | undefined): SourceLocation | null {
  if (!value || value.datasheetId === null || value.page === null) return null;
  const box =
    suggestion && suggestion.datasheetId === value.datasheetId && suggestion.page === value.page && sameFieldValue(value, suggestion)
      ? suggestion.box
      : undefined;
  return { datasheetId: value.datasheetId, page: value.page, text: value.text, box };
}

/** One card field: its value (typed with units), the datasheet's suggestion, and where the value came from. */
export const CardFieldRow = memo(function CardFieldRow({
  field,
  value,
  suggestion,
  changed,
  error,
  readOnly,
  onEnter,
  onAccept,
  onShowSource,
}: CardFieldRowProps) {
  const meta = CARD_FIELD_META[field];
  const location = locationOf(value, suggestion);
  const inputLabel = `${meta.symbol} (${meta.label})`;
  const matches = suggestion && value && value.source === 'extracted' && sameFieldValue(value, suggestion);
  const showLocation = () => location && onShowSource(location);

  const input =
    field === 'tc' ? (
      <TempCoInput
        size="xs"
        aria-label={inputLabel}
        fieldName={meta.symbol}
        value={value ? { value: value.value, unit: value.unit ?? 'mV/K' } : null}
        bareUnit={value?.unit ?? suggestion?.unit ?? 'mV/K'}
        onChange={(v) => onEnter(field, v ? v.value : null, v && !Number.isNaN(v.value) ? `${v.value} ${v.unit}` : null, v?.unit)}
        onFocus={showLocation}
        error={error}
        readOnly={readOnly}
        data-field={field}
      />
    ) : (
      <QuantityInput
        size="xs"
        aria-label={inputLabel}
        fieldName={meta.symbol}
        kind={cardFieldKind(field)}
        unit={meta.typingUnit}
        value={value ? value.value : null}
        onChange={(v) => onEnter(field, v, v === null || Number.isNaN(v) ? null : formatForInput(v, cardFieldKind(field)))}
        onFocus={showLocation}
        error={error}
        readOnly={readOnly}
        data-field={field}
      />
    );

  return (
    <Table.Tr data-field-row={field}>
      <Table.Td w={112} maw={112} title={meta.label}>
        <Text fz="sm" fw={500} lh={1.15}>
          {meta.symbol}
        </Text>
        <Text fz={11} c="dimmed" lh={1.15} truncate>
          {meta.label}
        </Text>
      </Table.Td>
      <Table.Td w={150}>{input}</Table.Td>
      <Table.Td>
        {suggestion &&
          (matches ? (
            <Tooltip label={`As printed on page ${suggestion.page}: ${suggestion.text}`} multiline maw={360}>
              <Anchor
                component="button"
                type="button"
                fz="xs"
                c="verdigris"
                onClick={() => onShowSource(suggestion)}
                aria-label={`${meta.symbol} as printed on page ${suggestion.page}`}
              >
                <Group gap={2} wrap="nowrap">
                  <IconCheck size={14} />
                  page {suggestion.page}
                </Group>
              </Anchor>
            </Tooltip>
          ) : (
            <Group gap={4} wrap="nowrap">
              <Tooltip label={`Page ${suggestion.page}: ${suggestion.text}${suggestion.note ? ` (${suggestion.note})` : ''}`} multiline maw={360}>
                <Button
                  size="compact-xs"
                  variant="light"
                  leftSection={<IconFileDownload size={12} />}
                  disabled={readOnly}
                  onClick={() => {
                    onAccept(suggestion);
                    onShowSource(suggestion);
                  }}
                  aria-label={`Use ${formatCardValue(field, suggestion.value, suggestion.unit)} for ${meta.symbol}`}
                >
                  {formatCardValue(field, suggestion.value, suggestion.unit)}
                </Button>
              </Tooltip>
              <Anchor
                component="button"
                type="button"
                fz="xs"
                onClick={() => onShowSource(suggestion)}
                aria-label={`Show ${meta.symbol} on page ${suggestion.page}`}
              >
                page {suggestion.page}
              </Anchor>
            </Group>
          ))}
        {suggestion && <SuggestionOrigin suggestion={suggestion} />}
      </Table.Td>
      <Table.Td w={200} maw={200}>
        {value && !Number.isNaN(value.value) && (
          <Group gap={4} wrap="nowrap" data-testid={`provenance-${field}`}>
            <Badge size="xs" color={SOURCE_COLOR[value.source]} data-source={value.source} style={{ flexShrink: 0 }}>
              {SOURCE_LABEL[value.source]}
            </Badge>
            {location && (
              <Anchor
                component="button"
                type="button"
                fz="xs"
                onClick={showLocation}
                aria-label={`Show the source of ${meta.symbol}, page ${location.page}`}
                style={{ flexShrink: 0 }}
              >
                page {location.page}
              </Anchor>
            )}
            <Text
              fz={11}
              c={changed ? 'yellow.8' : 'dimmed'}
              truncate
              title={
                value.confirmedBy
                  ? `Confirmed by ${value.confirmedBy.name}, ${formatDateTime(value.confirmedAt)}${value.text ? ` — “${value.text}”` : ''}`
                  : (value.text ?? undefined)
              }
            >
              {changed ? 'unsaved' : value.confirmedBy ? `${value.confirmedBy.name}, ${formatShortDate(value.confirmedAt)}` : 'not confirmed'}
            </Text>
          </Group>
        )}
      </Table.Td>
    </Table.Tr>
  );
});
