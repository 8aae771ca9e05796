import { useCallback, useMemo, useState } from 'react';
import { Alert, Badge, Button, Group, Paper, Select, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import { getHotkeyHandler, useDebouncedValue, useDisclosure } from '@mantine/hooks';
import { notifications } from '@mantine/notifications';
import { IconDeviceFloppy, IconHistory, IconListCheck } from '@tabler/icons-react';
import { formatNumber, type CardField, type ExtractedVariant, type RatingCardView, type TempCoUnit, type VendorPartDetail } from '@shuntwise/contracts';
import { Quantity } from '@/components/quantity';
import { ApiError, describeError } from '@/lib/api-client';
import { useLeaveGuard } from '@/lib/leave-guard';
import { CARD_FIELD_GROUPS, CARD_FIELD_META } from '@/lib/card-fields';
import { formatDateTime } from '@/lib/format-date';
import { useSpecBasis } from '../api/get-spec-basis';
import { useNormalizedCard } from '../api/normalize-card';
import { conflictingCard, usePutRatingCard } from '../api/put-rating-card';
import { useUpdateVendorPart } from '../api/update-vendor-part';
import {
  acceptSuggestion,
  changedFields,
  draftFromCard,
  draftProblems,
  engineeringCardOf,
  enterValue,
  hasUnreadable,
  matchVariant,
  pendingSuggestions,
  suggestionsFrom,
  toFieldsInput,
  variantOfCard,
  type CardDraft,
  type Suggestion,
} from '../utils/card-draft';
import { basisFromSpec, normalizeRequestFor, standardBasis } from '../utils/normalize-request';
import { CardConflictModal } from './card-conflict-modal';
import { CardEngineeringPanel, MECHANISM_LABEL } from './card-engineering-panel';
import { CardFieldRow, type SourceLocation } from './card-field-row';
import { CheckFirstNote } from './suggestion-origin';
import { CardVersionsModal } from './card-versions-modal';

export interface CardExtraction {
  datasheetId: number;
  fileName: string;
  variants: ExtractedVariant[];
}

export interface RatingCardEditorProps {
  vendorPart: VendorPartDetail;
  card: RatingCardView;
  /** What the datasheet shown beside the card offers; null while none is loaded. */
  extraction: CardExtraction | null;
  onShowSource: (location: SourceLocation) => void;
  readOnly?: boolean;
}

const STANDARD = 'standard';

/** `fields.zzt.value` → zzt: the API names the card field in the path's second place. */
function fieldOfPath(path: string): CardField | null {
  const [first, second] = path.split('.');
  const name = first === 'fields' ? second : first;
  return name && name in CARD_FIELD_META ? (name as CardField) : null;
}

/**
 * The rating card beside its datasheet: every value typed with units or taken from the
 * datasheet with one click, its provenance shown, the engineering core's reading live,
 * saved against the version it was loaded at.
 */
export function RatingCardEditor({ vendorPart, card, extraction, onShowSource, readOnly = false }: RatingCardEditorProps) {
  const [loaded, setLoaded] = useState(card);
  const [baseVersion, setBaseVersion] = useState(card.version);
  const [base, setBase] = useState<CardDraft>(() => draftFromCard(card));
  const [draft, setDraft] = useState<CardDraft>(base);
  const [typed, setTyped] = useState<ReadonlySet<CardField>>(new Set());
  const [note, setNote] = useState('');
  const [serverErrors, setServerErrors] = useState<Partial<Record<CardField, string>>>({});
  const [saveError, setSaveError] = useState<unknown>(null);
  const [showRequired, setShowRequired] = useState(false);
  const [conflict, setConflict] = useState<RatingCardView | null>(null);
  const [conflictOpen, conflictModal] = useDisclosure(false);
  const [historyOpen, historyModal] = useDisclosure(false);
  const put = usePutRatingCard();
  const updatePart = useUpdateVendorPart();

  const changed = useMemo(() => new Set(changedFields(base, draft)), [base, draft]);
  const dirty = changed.size > 0 || note.trim() !== '';

  const resetTo = (view: RatingCardView) => {
    const next = draftFromCard(view);
    setLoaded(view);
    setBaseVersion(view.version);
    setBase(next);
    setDraft(next);
    setTyped(new Set());
    setNote('');
    setServerErrors({});
    setSaveError(null);
    setShowRequired(false);
  };

  // A newer card from the server (another tab, a series import) replaces an untouched
  // editor; with unsaved changes it waits, and the save's 409 brings the merge.
  if (card !== loaded && card.version > loaded.version && !dirty && !conflict) resetTo(card);

  // Unsaved edits are not dropped silently: leaving asks first (links and closing the tab).
  useLeaveGuard(dirty, 'The rating card has unsaved changes. Leave this page and lose them?');

  // Suggestions: the variant of the shown datasheet that carries this part number.
  const [variantChoice, setVariantChoice] = useState<{ datasheetId: number; mpn: string } | null>(null);
  const variants = useMemo(() => extraction?.variants ?? [], [extraction]);
  const variant = useMemo(
    () =>
      (variantChoice && extraction && variantChoice.datasheetId === extraction.datasheetId
        ? variants.find((v) => v.mpn === variantChoice.mpn)
        : undefined) ??
      matchVariant(variants, vendorPart.mpn) ??
      (variants.length === 1 ? variants[0] : undefined) ??
      // A part number the datasheet does not print (an ordering code): the variant the saved card came from.
      (extraction ? variantOfCard(variants, base, extraction.datasheetId) : undefined),
    [variantChoice, extraction, variants, vendorPart.mpn, base],
  );
  const suggestions = useMemo(() => suggestionsFrom(variant, extraction?.datasheetId ?? null), [variant, extraction?.datasheetId]);
  const pending = useMemo(() => pendingSuggestions(draft, suggestions, typed), [draft, suggestions, typed]);

  const clearServerError = (field: CardField) =>
    setServerErrors((errors) => {
      if (!errors[field]) return errors;
      const next = { ...errors };
      delete next[field];
      return next;
    });

  const onEnter = useCallback((field: CardField, value: number | null, printed: string | null, unit?: TempCoUnit) => {
    setDraft((d) => enterValue(d, field, value, printed, unit));
    setTyped((t) => (t.has(field) ? t : new Set(t).add(field)));
    clearServerError(field);
  }, []);

  const onAccept = useCallback((suggestion: Suggestion) => {
    setDraft((d) => acceptSuggestion(d, suggestion));
    setTyped((t) => {
      if (!t.has(suggestion.field)) return t;
      const next = new Set(t);
      next.delete(suggestion.field);
      return next;
    });
    clearServerError(suggestion.field);
  }, []);

  const acceptAll = () => {
    let next = draft;
    for (const s of pending) next = acceptSuggestion(next, s);
    setDraft(next);
    for (const s of pending) clearServerError(s.field);
  };

  // The engineering core, live: only a card that reads and has no contradictions goes to it.
  const problems = useMemo(() => draftProblems(draft), [draft]);
  const unreadable = hasUnreadable(draft);
  const engineeringCard = useMemo(() => (Object.keys(problems).length === 0 ? engineeringCardOf(draft) : null), [draft, problems]);
  const [debouncedCard] = useDebouncedValue(engineeringCard, 250);

  const [basisChoice, setBasisChoice] = useState<string>(vendorPart.sourceOf[0] ? String(vendorPart.sourceOf[0].housePartId) : STANDARD);
  const basisHousePart = vendorPart.sourceOf.find((s) => String(s.housePartId) === basisChoice) ?? null;
  const spec = useSpecBasis(basisHousePart?.housePartId ?? null);
  const basis = useMemo(() => {
    if (!debouncedCard) return null;
    if (basisHousePart) {
      if (spec.isPending) return null;
      if (spec.data) return basisFromSpec(spec.data.spec, basisHousePart.partNumber, spec.data.version);
    }
    return standardBasis(debouncedCard);
  }, [debouncedCard, basisHousePart, spec.isPending, spec.data]);
  const request = useMemo(() => (debouncedCard && basis ? normalizeRequestFor(debouncedCard, basis) : null), [debouncedCard, basis]);
  const normalized = useNormalizedCard(request);

  const firstProblem = Object.entries(problems)[0];
  const waitingFor = unreadable
    ? 'A value does not read yet; fix it to see the model.'
    : !draft.vzNom || !draft.izt
      ? 'Enter or accept VZ nom and IZT to see the model.'
      : firstProblem
        ? `Not computed: ${firstProblem[1]}.`
        : null;
  const basisOptions = [
    ...vendorPart.sourceOf.map((s) => ({ value: String(s.housePartId), label: `Spec of ${s.partNumber} (${s.role})` })),
    { value: STANDARD, label: 'Standard currents' },
  ];
  const basisLabel =
    basis?.label ?? (basisHousePart && spec.data === null ? `(${basisHousePart.partNumber} has no spec yet)` : '');

  const save = (fields: CardDraft = draft, version: number = baseVersion) => {
    if (readOnly || put.isPending) return;
    setShowRequired(true);
    if (hasUnreadable(fields) || Object.keys(draftProblems(fields)).length > 0) {
      notifications.show({ color: 'red', title: 'Card not saved', message: 'Fix the fields marked in red first; what you typed is kept.' });
      return;
    }
    setSaveError(null);
    put.mutate(
      { vendorPartId: vendorPart.id, request: { version, fields: toFieldsInput(fields), note: note.trim() || null } },
      {
        onSuccess: (saved) => {
          // Anything typed while the save was on its way stays in the editor, on top of the saved card.
          const savedDraft = draftFromCard(saved);
          setLoaded(saved);
          setBaseVersion(saved.version);
          setBase(savedDraft);
          setDraft((current) => (current === fields ? savedDraft : current));
          setTyped(new Set());
          setNote('');
          setServerErrors({});
          setShowRequired(false);
          notifications.show({ color: 'verdigris', title: 'Card saved', message: `${vendorPart.mpn}: version ${saved.version}.` });
        },
        onError: (error) => {
          const current = conflictingCard(error);
          if (current) {
            setConflict(current);
            conflictModal.open();
            return;
          }
          const byField: Partial<Record<CardField, string>> = {};
          if (error instanceof ApiError) {
            for (const e of error.errors ?? []) {
              const field = fieldOfPath(e.path);
              if (field) byField[field] ??= e.message;
            }
          }
          setServerErrors(byField);
          setSaveError(error);
        },
      },
    );
  };

  const onMerge = (merged: CardDraft, andSave: boolean) => {
    if (!conflict) return;
    const theirs = draftFromCard(conflict);
    setLoaded(conflict);
    setBase(theirs);
    setBaseVersion(conflict.version);
    setDraft(merged);
    setConflict(null);
    conflictModal.close();
    if (andSave) save(merged, conflict.version);
  };

  const result = normalized.data;
  const packageSuggestion = variant?.package;

  return (
    <Stack gap="md">
      <Paper component="section" aria-labelledby="card-title" onKeyDown={getHotkeyHandler([['mod+S', () => save()]])}>
        <Stack gap="sm">
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
                  {changed.size} unsaved change{changed.size === 1 ? '' : 's'}
                </Badge>
              )}
              {loaded.updatedAt && (
                <Text fz="xs" c="dimmed">
                  saved by {loaded.updatedBy?.name ?? 'the import'}, {formatDateTime(loaded.updatedAt)}
                </Text>
              )}
            </Group>
            <Group gap="xs">
              <Button size="xs" variant="subtle" leftSection={<IconHistory size={14} />} onClick={historyModal.open} disabled={baseVersion === 0}>
                History
              </Button>
              {!readOnly && (
                <Button size="xs" leftSection={<IconDeviceFloppy size={14} />} onClick={() => save()} loading={put.isPending} disabled={!dirty} title="Save (Ctrl+S)">
                  Save card
                </Button>
              )}
            </Group>
          </Group>

          {result && (
            <Group gap="md" fz="xs" c="dimmed" data-testid="live-summary" style={{ opacity: waitingFor ? 0.55 : 1 }}>
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
          )}

          {extraction && (
            <Group gap="xs" wrap="wrap" p={6} bg="var(--mantine-color-default-hover)" style={{ borderRadius: 'var(--mantine-radius-sm)' }} data-testid="suggestion-bar">
              <Text fz="xs">
                Suggestions from <b>{extraction.fileName}</b>
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
                  onChange={(mpn) => mpn && setVariantChoice({ datasheetId: extraction.datasheetId, mpn })}
                />
              )}
              {!readOnly && variant && (
                <Button size="compact-xs" leftSection={<IconListCheck size={14} />} disabled={pending.length === 0} onClick={acceptAll}>
                  Accept all suggestions ({pending.length})
                </Button>
              )}
              <CheckFirstNote suggestions={Object.values(suggestions)} />
              {packageSuggestion && packageSuggestion.value !== vendorPart.package && !readOnly && (
                <Button
                  size="compact-xs"
                  variant="light"
                  loading={updatePart.isPending}
                  onClick={() =>
                    updatePart.mutate(
                      { id: vendorPart.id, changes: { package: packageSuggestion.value } },
                      { onError: (e) => notifications.show({ color: 'red', title: 'Package not changed', message: describeError(e) }) },
                    )
                  }
                >
                  Package: {packageSuggestion.value} (p. {packageSuggestion.page})
                </Button>
              )}
            </Group>
          )}

          {saveError != null && (
            <Alert color="red" role="alert" title="Card not saved" p="xs">
              {describeError(saveError)} Your values are still in the form.
            </Alert>
          )}
          {conflict && !conflictOpen && (
            <Alert color="yellow" p="xs" role="alert">
              Version {conflict.version} was saved meanwhile.{' '}
              <Button size="compact-xs" variant="light" onClick={conflictModal.open}>
                Compare and merge
              </Button>
            </Alert>
          )}

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
                    error={serverErrors[field] ?? (showRequired || draft[field] ? problems[field] : undefined)}
                    readOnly={readOnly}
                    onEnter={onEnter}
                    onAccept={onAccept}
                    onShowSource={onShowSource}
                  />
                ))}
              </Table.Tbody>
            ))}
          </Table>
          {!readOnly && (
            <Group align="flex-end" gap="xs">
              <TextInput
                size="xs"
                style={{ flex: 1 }}
                label="Note for this version"
                placeholder="e.g. ZZT corrected from the revision B table"
                value={note}
                maxLength={500}
                onChange={(e) => setNote(e.currentTarget.value)}
              />
              <Button size="xs" onClick={() => save()} loading={put.isPending} disabled={!dirty}>
                Save card
              </Button>
            </Group>
          )}
        </Stack>
      </Paper>

      <CardEngineeringPanel
        result={result}
        waitingFor={waitingFor ?? (basis === null && debouncedCard ? 'Reading the spec…' : null)}
        loading={normalized.isFetching}
        error={normalized.isError ? normalized.error : null}
        basisLabel={basisLabel}
        basisOptions={basisOptions}
        basisValue={basisChoice}
        onBasisChange={setBasisChoice}
      />

      {conflict && (
        <CardConflictModal
          key={conflict.version}
          opened={conflictOpen}
          baseVersion={baseVersion}
          base={base}
          mine={draft}
          theirs={draftFromCard(conflict)}
          current={conflict}
          onKeepEditing={conflictModal.close}
          onMerge={onMerge}
        />
      )}
      <CardVersionsModal vendorPartId={vendorPart.id} opened={historyOpen} onClose={historyModal.close} />
    </Stack>
  );
}
