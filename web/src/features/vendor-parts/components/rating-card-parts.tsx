import { Badge, Button, Group, Select, Table, Text, TextInput, Title } from '@mantine/core';
import { IconDeviceFloppy, IconHistory, IconListCheck } from '@tabler/icons-react';
import { formatNumber, type CardField, type ExtractedVariant, type NormalizeResponse, type RatingCardView, type TempCoUnit } from '@shuntwise/contracts';
import { Quantity } from '@/components/quantity';
import { CARD_FIELD_GROUPS } from '@/lib/card-fields';
import { formatDateTime } from '@/lib/format-date';
import type { CardDraft, Suggestion } from '../utils/card-draft';
import { MECHANISM_LABEL } from './card-engineering-panel';
import { CardFieldRow, type SourceLocation } from './card-field-row';
import { CheckFirstNote } from './suggestion-origin';

// The rating-card editor's presentational parts: props in, events out, no state of their own.

export function CardEditorHeader(props: {
  baseVersion: number;
  changedCount: number;
  dirty: boolean;
  loaded: RatingCardView;
  readOnly: boolean;
  saving: boolean;
  onHistory: () => void;
  onSave: () => void;
}) {
  const { baseVersion, changedCount, dirty, loaded, readOnly, saving } = props;
  return (
    <Group justify="space-between" wrap="wrap" gap="xs">
      <Group gap="xs">
        <Title order={3} fz="h5" id="card-title">
          Rating card
        </Title>
        <Badge color={baseVersion === 0 ? 'gray' : 'copper'} variant="outline" data-testid="card-version">
          {baseVersion === 0 ? 'no card yet' : `v${baseVersion}`}
        </Badge>
        {dirty && (
          <Badge color="yellow" data-testid="unsaved">
            {changedCount} unsaved change{changedCount === 1 ? '' : 's'}
          </Badge>
        )}
        {loaded.updatedAt && (
          <Text fz="xs" c="dimmed">
            saved by {loaded.updatedBy?.name ?? 'the import'}, {formatDateTime(loaded.updatedAt)}
          </Text>
        )}
      </Group>
      <Group gap="xs">
        <Button size="xs" variant="subtle" leftSection={<IconHistory size={14} />} onClick={props.onHistory} disabled={baseVersion === 0}>
          History
        </Button>
        {!readOnly && (
          <Button size="xs" leftSection={<IconDeviceFloppy size={14} />} onClick={props.onSave} loading={saving} disabled={!dirty} title="Save (Ctrl+S)">
            Save card
          </Button>
        )}
      </Group>
    </Group>
  );
}

/** The engineering core's reading in one line, dimmed while the draft cannot be computed. */
export function CardLiveSummary({ result, dimmed }: { result: NormalizeResponse; dimmed: boolean }) {
  return (
    <Group gap="md" fz="xs" c="dimmed" data-testid="live-summary" style={{ opacity: dimmed ? 0.55 : 1 }}>
      <Text fz="xs">
        BV <Quantity value={result.model.bv} kind="voltage" digits={4} />
      </Text>
      <Text fz="xs">
        RS <Quantity value={result.model.rs} kind="resistance" />
      </Text>
      <Text fz="xs">NBV {formatNumber(result.model.nbv)}</Text>
      <Text fz="xs">{MECHANISM_LABEL[result.mechanism]}</Text>
      {result.warnings.length > 0 && (
        <Badge size="xs" color="yellow">
          {result.warnings.length} warning{result.warnings.length === 1 ? '' : 's'}
        </Badge>
      )}
    </Group>
  );
}

/** What the datasheet beside the card offers: the variant, accept-all, the package. */
export function CardSuggestionBar(props: {
  fileName: string;
  variants: ExtractedVariant[];
  variant: ExtractedVariant | undefined;
  suggestions: Partial<Record<CardField, Suggestion>>;
  pendingCount: number;
  readOnly: boolean;
  /** The package the datasheet prints, when it differs from the part's. */
  packageSuggestion: { value: string; page: number } | null;
  packageSaving: boolean;
  onVariant: (mpn: string) => void;
  onAcceptAll: () => void;
  onPackage: (value: string) => void;
}) {
  const { fileName, variants, variant, suggestions, pendingCount, readOnly, packageSuggestion } = props;
  return (
    <Group gap="xs" wrap="wrap" p={6} bg="var(--mantine-color-default-hover)" style={{ borderRadius: 'var(--mantine-radius-sm)' }} data-testid="suggestion-bar">
      <Text fz="xs">
        Suggestions from <b>{fileName}</b>
      </Text>
      {variants.length === 0 ? (
        <Text fz="xs" c="dimmed">
          The datasheet offers no values for a part.
        </Text>
      ) : (
        <Select
          size="xs"
          w={170}
          aria-label="Variant on the datasheet"
          placeholder="Choose the variant"
          data={variants.map((v) => v.mpn)}
          value={variant?.mpn ?? null}
          searchable
          allowDeselect={false}
          onChange={(mpn) => mpn && props.onVariant(mpn)}
        />
      )}
      {!readOnly && variant && (
        <Button size="compact-xs" leftSection={<IconListCheck size={14} />} disabled={pendingCount === 0} onClick={props.onAcceptAll}>
          Accept all suggestions ({pendingCount})
        </Button>
      )}
      <CheckFirstNote suggestions={Object.values(suggestions)} />
      {packageSuggestion && !readOnly && (
        <Button size="compact-xs" variant="light" loading={props.packageSaving} onClick={() => props.onPackage(packageSuggestion.value)}>
          Package: {packageSuggestion.value} (p. {packageSuggestion.page})
        </Button>
      )}
    </Group>
  );
}

/** Every card field in its group, with its suggestion, change mark and error. */
export function CardFieldsTable(props: {
  draft: CardDraft;
  suggestions: Partial<Record<CardField, Suggestion>>;
  changed: ReadonlySet<CardField>;
  errorOf: (field: CardField) => string | undefined;
  readOnly: boolean;
  onEnter: (field: CardField, value: number | null, printed: string | null, unit?: TempCoUnit) => void;
  onAccept: (suggestion: Suggestion) => void;
  onShowSource: (location: SourceLocation) => void;
}) {
  const { draft, suggestions, changed, errorOf, readOnly } = props;
  return (
    <Table aria-label="Rating card fields" verticalSpacing={3}>
      {CARD_FIELD_GROUPS.map((group) => (
        <Table.Tbody key={group.title}>
          <Table.Tr>
            <Table.Th colSpan={4} fz={11} tt="uppercase" c="dimmed" py={2} style={{ letterSpacing: '0.06em' }}>
              {group.title}
            </Table.Th>
          </Table.Tr>
          {group.fields.map((field) => (
            <CardFieldRow
              key={field}
              field={field}
              value={draft[field]}
              suggestion={suggestions[field]}
              changed={changed.has(field)}
              error={errorOf(field)}
              readOnly={readOnly}
              onEnter={props.onEnter}
              onAccept={props.onAccept}
              onShowSource={props.onShowSource}
            />
          ))}
        </Table.Tbody>
      ))}
    </Table>
  );
}

export function CardNoteBar(props: { note: string; saving: boolean; dirty: boolean; onNote: (note: string) => void; onSave: () => void }) {
  return (
    <Group align="flex-end" gap="xs">
      <TextInput
        size="xs"
        style={{ flex: 1 }}
        label="Note for this version"
        placeholder="e.g. ZZT corrected from the revision B table"
        value={props.note}
        maxLength={500}
        onChange={(e) => props.onNote(e.currentTarget.value)}
      />
      <Button size="xs" onClick={props.onSave} loading={props.saving} disabled={!props.dirty}>
        Save card
      </Button>
    </Group>
  );
}
