import { useCallback, useEffect, useMemo, useReducer, useState } from 'react';
import { Alert, Button, Paper, Stack } from '@mantine/core';
import { getHotkeyHandler, useDebouncedValue, useDisclosure } from '@mantine/hooks';
import { notifications } from '@mantine/notifications';
import type { CardField, ExtractedVariant, RatingCardView, TempCoUnit, VendorPartDetail } from '@shuntwise/contracts';
import { ApiError, describeError } from '@/lib/api-client';
import { useLeaveGuard } from '@/lib/leave-guard';
import { CARD_FIELD_META } from '@/lib/card-fields';
import { useSpecBasis } from '../api/get-spec-basis';
import { useNormalizedCard } from '../api/normalize-card';
import { conflictingCard, usePutRatingCard } from '../api/put-rating-card';
import { useUpdateVendorPart } from '../api/update-vendor-part';
import {
  changedFields,
  draftFromCard,
  draftProblems,
  engineeringCardOf,
  hasUnreadable,
  matchVariant,
  pendingSuggestions,
  suggestionsFrom,
  toFieldsInput,
  variantOfCard,
  type CardDraft,
  type Suggestion,
} from '../utils/card-draft';
import { cardEditorReducer, initialCardEditorState } from '../utils/card-editor-state';
import { basisFromSpec, normalizeRequestFor, standardBasis } from '../utils/normalize-request';
import { CardConflictModal } from './card-conflict-modal';
import { CardEngineeringPanel } from './card-engineering-panel';
import type { SourceLocation } from './card-field-row';
import { CardVersionsModal } from './card-versions-modal';
import { CardEditorHeader, CardFieldsTable, CardLiveSummary, CardNoteBar, CardSuggestionBar } from './rating-card-parts';

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
  const [state, dispatch] = useReducer(cardEditorReducer, card, initialCardEditorState);
  const { loaded, baseVersion, base, draft, typed, note, serverErrors, saveError, showRequired, conflict } = state;
  const [conflictOpen, conflictModal] = useDisclosure(false);
  const [historyOpen, historyModal] = useDisclosure(false);
  const put = usePutRatingCard();
  const updatePart = useUpdateVendorPart();

  const changed = useMemo(() => new Set(changedFields(base, draft)), [base, draft]);
  const dirty = changed.size > 0 || note.trim() !== '';

  // A newer card from the server (another tab, a series import) replaces an untouched
  // editor; with unsaved changes it waits, and the save's 409 brings the merge.
  const newerCard = card !== loaded && card.version > loaded.version && !dirty && !conflict;
  useEffect(() => {
    if (newerCard) dispatch({ type: 'load', view: card });
  }, [newerCard, card]);

  // Unsaved edits are not dropped silently: leaving asks first (links and closing the tab).
  useLeaveGuard(dirty, 'The rating card has unsaved changes. Leave this page and lose them?');

  // Suggestions: the variant of the shown datasheet that carries this part number.
  const [variantChoice, setVariantChoice] = useState<{ datasheetId: number; mpn: string } | null>(null);
  const variants = useMemo(() => extraction?.variants ?? [], [extraction]);
  const variant = useMemo(
    () =>
      (variantChoice && extraction && variantChoice.datasheetId === extraction.datasheetId ? variants.find((v) => v.mpn === variantChoice.mpn) : undefined) ??
      matchVariant(variants, vendorPart.mpn) ??
      (variants.length === 1 ? variants[0] : undefined) ??
      // A part number the datasheet does not print (an ordering code): the variant the saved card came from.
      (extraction ? variantOfCard(variants, base, extraction.datasheetId) : undefined),
    [variantChoice, extraction, variants, vendorPart.mpn, base],
  );
  const suggestions = useMemo(() => suggestionsFrom(variant, extraction?.datasheetId ?? null), [variant, extraction?.datasheetId]);
  const pending = useMemo(() => pendingSuggestions(draft, suggestions, typed), [draft, suggestions, typed]);

  const onEnter = useCallback(
    (field: CardField, value: number | null, printed: string | null, unit?: TempCoUnit) => dispatch({ type: 'enter', field, value, printed, unit }),
    [],
  );
  const onAccept = useCallback((suggestion: Suggestion) => dispatch({ type: 'accept', suggestions: [suggestion] }), []);
  const acceptAll = () => dispatch({ type: 'accept', suggestions: pending });

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
  const basisLabel = basis?.label ?? (basisHousePart && spec.data === null ? `(${basisHousePart.partNumber} has no spec yet)` : '');

  const save = (fields: CardDraft = draft, version: number = baseVersion) => {
    if (readOnly || put.isPending) return;
    const valid = !hasUnreadable(fields) && Object.keys(draftProblems(fields)).length === 0;
    dispatch({ type: 'save-attempt', valid });
    if (!valid) {
      notifications.show({ color: 'red', title: 'Card not saved', message: 'Fix the fields marked in red first; what you typed is kept.' });
      return;
    }
    put.mutate(
      { vendorPartId: vendorPart.id, request: { version, fields: toFieldsInput(fields), note: note.trim() || null } },
      {
        onSuccess: (saved) => {
          // Anything typed while the save was on its way stays in the editor, on top of the saved card.
          dispatch({ type: 'load', view: saved, submitted: fields });
          notifications.show({ color: 'verdigris', title: 'Card saved', message: `${vendorPart.mpn}: version ${saved.version}.` });
        },
        onError: (error) => {
          const current = conflictingCard(error);
          if (current) {
            dispatch({ type: 'conflict', current });
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
          dispatch({ type: 'save-failed', error, serverErrors: byField });
        },
      },
    );
  };

  const onMerge = (merged: CardDraft, andSave: boolean) => {
    if (!conflict) return;
    dispatch({ type: 'merge', merged });
    conflictModal.close();
    if (andSave) save(merged, conflict.version);
  };

  const result = normalized.data;
  const packageSuggestion = variant?.package;

  return (
    <Stack gap="md">
      <Paper component="section" aria-labelledby="card-title" onKeyDown={getHotkeyHandler([['mod+S', () => save()]])}>
        <Stack gap="sm">
          <CardEditorHeader
            baseVersion={baseVersion}
            changedCount={changed.size}
            dirty={dirty}
            loaded={loaded}
            readOnly={readOnly}
            saving={put.isPending}
            onHistory={historyModal.open}
            onSave={() => save()}
          />

          {result && <CardLiveSummary result={result} dimmed={waitingFor !== null} />}

          {extraction && (
            <CardSuggestionBar
              fileName={extraction.fileName}
              variants={variants}
              variant={variant}
              suggestions={suggestions}
              pendingCount={pending.length}
              readOnly={readOnly}
              packageSuggestion={packageSuggestion && packageSuggestion.value !== vendorPart.package ? packageSuggestion : null}
              packageSaving={updatePart.isPending}
              onVariant={(mpn) => setVariantChoice({ datasheetId: extraction.datasheetId, mpn })}
              onAcceptAll={acceptAll}
              onPackage={(value) =>
                updatePart.mutate(
                  { id: vendorPart.id, changes: { package: value } },
                  { onError: (e) => notifications.show({ color: 'red', title: 'Package not changed', message: describeError(e) }) },
                )
              }
            />
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

          <CardFieldsTable
            draft={draft}
            suggestions={suggestions}
            changed={changed}
            errorOf={(field) => serverErrors[field] ?? (showRequired || draft[field] ? problems[field] : undefined)}
            readOnly={readOnly}
            onEnter={onEnter}
            onAccept={onAccept}
            onShowSource={onShowSource}
          />
          {!readOnly && (
            <CardNoteBar note={note} saving={put.isPending} dirty={dirty} onNote={(text) => dispatch({ type: 'note', note: text })} onSave={() => save()} />
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
