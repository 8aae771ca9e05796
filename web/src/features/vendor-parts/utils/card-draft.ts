import {
  CARD_FIELDS,
  cardDraftFromExtraction,
  cardFieldProblems,
  toEngineeringCard,
  type Actor,
  type CardField,
  type EngineeringCardInput,
  type ExtractedValue,
  type ExtractedVariant,
  type ExtractionBox,
  type ProvenanceSource,
  type RatingCard,
  type RatingCardFieldsInput,
  type TempCoUnit,
} from '@shuntwise/contracts';
import { sameNumber } from '@/lib/card-fields';

/**
 * One field of the card being edited. `value` is SI, except tc, which keeps the unit the
 * datasheet used (`unit`). NaN while the typed text does not read: the field then blocks
 * the save and the live computation, and the text stays in the input.
 */
export interface DraftField {
  value: number;
  unit?: TempCoUnit;
  printed: string | null;
  source: ProvenanceSource;
  datasheetId: number | null;
  page: number | null;
  text: string | null;
  /** Who confirmed the stored value and when; null once it is changed here. */
  confirmedBy: Actor | null;
  confirmedAt: string | null;
}

/** The card being edited: a field that is absent is empty. */
export type CardDraft = Partial<Record<CardField, DraftField>>;

/** A datasheet's reading of one field, ready to be accepted with one click. */
export interface Suggestion {
  field: CardField;
  value: number;
  unit?: TempCoUnit;
  printed: string;
  datasheetId: number;
  page: number;
  text: string;
  box?: ExtractionBox;
  note?: string;
  /** Where on the page it was read, whether by OCR, and whether it was worked out rather than printed. */
  method?: ExtractedValue['method'];
  ocr?: boolean;
  derived?: ExtractedValue['derived'];
}

export function draftFromCard(card: Pick<RatingCard, 'fields'>): CardDraft {
  const draft: CardDraft = {};
  for (const field of CARD_FIELDS) {
    const stored = card.fields[field];
    if (!stored) continue;
    draft[field] = {
      value: stored.value,
      unit: field === 'tc' ? card.fields.tc?.unit : undefined,
      printed: stored.printed,
      source: stored.provenance.source,
      datasheetId: stored.provenance.datasheetId,
      page: stored.provenance.page,
      text: stored.provenance.text,
      confirmedBy: stored.provenance.confirmedBy,
      confirmedAt: stored.provenance.confirmedAt,
    };
  }
  return draft;
}

/** Every field the variant offers, as the card keeps it (SI; tc in its printed unit). */
export function suggestionsFrom(variant: ExtractedVariant | null | undefined, datasheetId: number | null): Partial<Record<CardField, Suggestion>> {
  if (!variant || datasheetId === null) return {};
  const values = cardDraftFromExtraction(variant, datasheetId);
  const out: Partial<Record<CardField, Suggestion>> = {};
  for (const field of CARD_FIELDS) {
    const value = values[field];
    const found = (variant.fields as Partial<Record<CardField, ExtractedValue>>)[field];
    if (!value || !found) continue;
    out[field] = {
      field,
      value: value.value,
      unit: field === 'tc' ? (value as { unit: TempCoUnit }).unit : undefined,
      printed: value.printed ?? `${found.value} ${found.unit}`.trim(),
      datasheetId,
      page: found.page,
      text: found.text,
      box: found.box,
      note: found.note,
      method: found.method,
      ocr: found.ocr,
      derived: found.derived,
    };
  }
  return out;
}

/** The variant of a datasheet that belongs to a part number (spaces, dashes and case aside). */
export function matchVariant(variants: readonly ExtractedVariant[], mpn: string): ExtractedVariant | undefined {
  const key = (s: string) => s.toUpperCase().replace(/[\s\-_./]/g, '');
  return variants.find((v) => key(v.mpn) === key(mpn));
}

export function sameFieldValue(a: { value: number; unit?: TempCoUnit } | undefined, b: { value: number; unit?: TempCoUnit } | undefined): boolean {
  if (!a || !b) return !a && !b;
  return sameNumber(a.value, b.value) && (a.unit ?? null) === (b.unit ?? null);
}

export function acceptSuggestion(draft: CardDraft, suggestion: Suggestion): CardDraft {
  return {
    ...draft,
    [suggestion.field]: {
      value: suggestion.value,
      unit: suggestion.unit,
      printed: suggestion.printed,
      source: 'extracted',
      datasheetId: suggestion.datasheetId,
      page: suggestion.page,
      text: suggestion.text.slice(0, 500),
      confirmedBy: null,
      confirmedAt: null,
    },
  };
}

/**
 * What "Accept all" takes: empty fields and values extracted elsewhere that differ. A
 * value someone typed (now or saved as entered) or imported is never overwritten in
 * bulk; its suggestion stays one click away on its own row.
 */
export function pendingSuggestions(draft: CardDraft, suggestions: Partial<Record<CardField, Suggestion>>, typed: ReadonlySet<CardField>): Suggestion[] {
  return CARD_FIELDS.flatMap((field) => {
    const s = suggestions[field];
    if (!s || typed.has(field)) return [];
    const current = draft[field];
    if (current && current.source !== 'extracted') return [];
    if (current && sameFieldValue(current, s) && current.datasheetId === s.datasheetId && current.page === s.page) return [];
    return [s];
  });
}

/** A typed value: marked entered, its printed text what was typed. */
export function enterValue(draft: CardDraft, field: CardField, value: number | null, printed: string | null, unit?: TempCoUnit): CardDraft {
  const next = { ...draft };
  if (value === null) {
    delete next[field];
    return next;
  }
  next[field] = {
    value,
    unit,
    printed,
    source: 'entered',
    datasheetId: null,
    page: null,
    text: null,
    confirmedBy: null,
    confirmedAt: null,
  };
  return next;
}

/** True when some field does not read yet (NaN): the card cannot be saved or computed. */
export function hasUnreadable(draft: CardDraft): boolean {
  return Object.values(draft).some((f) => f !== undefined && Number.isNaN(f.value));
}

type ValuedFields = Parameters<typeof toEngineeringCard>[0];

function valued(draft: CardDraft): ValuedFields {
  const fields: Record<string, unknown> = {};
  for (const [field, value] of Object.entries(draft)) {
    if (!value) continue;
    fields[field] = field === 'tc' ? { value: value.value, unit: value.unit ?? 'mV/K' } : { value: value.value };
  }
  return fields as ValuedFields;
}

/** The card as the engineering core reads it; null without vzNom and izt or while a field does not read. */
export function engineeringCardOf(draft: CardDraft): EngineeringCardInput | null {
  if (hasUnreadable(draft)) return null;
  return toEngineeringCard(valued(draft));
}

/** The core's own rules (ranges, contradictions) per field, checked as the engineer types. */
export function draftProblems(draft: CardDraft): Partial<Record<CardField, string>> {
  if (hasUnreadable(draft)) return {};
  const out: Partial<Record<CardField, string>> = {};
  for (const p of cardFieldProblems(valued(draft))) out[p.path[0] as CardField] ??= p.message;
  if (!draft.vzNom) out.vzNom = 'A card needs the nominal Zener voltage';
  if (!draft.izt) out.izt = 'A card needs the test current';
  return out;
}

/** The card's fields as `PUT …/rating-card` takes them; saving confirms every value. */
export function toFieldsInput(draft: CardDraft): RatingCardFieldsInput {
  const fields: Record<string, unknown> = {};
  for (const field of CARD_FIELDS) {
    const f = draft[field];
    if (!f) continue;
    const provenance =
      f.source === 'entered'
        ? { source: 'entered' as const }
        : { source: f.source, datasheetId: f.datasheetId, page: f.page, text: f.text?.slice(0, 500) ?? null };
    fields[field] = {
      value: f.value,
      printed: f.printed?.slice(0, 80) ?? null,
      provenance,
      confirmed: true,
      ...(field === 'tc' ? { unit: f.unit ?? 'mV/K' } : {}),
    };
  }
  return fields as RatingCardFieldsInput;
}

/** Fields whose value, tc unit or source differs between two drafts (what a save would change). */
export function changedFields(from: CardDraft, to: CardDraft): CardField[] {
  return CARD_FIELDS.filter((field) => {
    const a = from[field];
    const b = to[field];
    if (!sameFieldValue(a, b)) return true;
    if (!a || !b) return false;
    return a.source !== b.source || a.page !== b.page || a.datasheetId !== b.datasheetId;
  });
}

export type MergeChoice = 'mine' | 'theirs';

export interface MergeRow {
  field: CardField;
  base: DraftField | undefined;
  mine: DraftField | undefined;
  theirs: DraftField | undefined;
  mineChanged: boolean;
  theirsChanged: boolean;
  /** Both sides changed the field to different values: the engineer must choose. */
  conflict: boolean;
  choice: MergeChoice;
}

/**
 * A three-way view of a stale save: the version the editor loaded (`base`), what the
 * engineer has now (`mine`) and what was saved meanwhile (`theirs`). A side that did not
 * touch a field gives way to the side that did; both changed it differently → conflict,
 * and the engineer's own value is preselected so nothing typed is lost by default.
 */
export function mergeRows(base: CardDraft, mine: CardDraft, theirs: CardDraft): MergeRow[] {
  return CARD_FIELDS.flatMap((field) => {
    const mineChanged = !sameFieldValue(base[field], mine[field]);
    const theirsChanged = !sameFieldValue(base[field], theirs[field]);
    if (!mineChanged && !theirsChanged && sameFieldValue(mine[field], theirs[field])) {
      if (!mine[field] && !theirs[field]) return [];
    }
    const conflict = mineChanged && theirsChanged && !sameFieldValue(mine[field], theirs[field]);
    const choice: MergeChoice = mineChanged ? 'mine' : 'theirs';
    return [{ field, base: base[field], mine: mine[field], theirs: theirs[field], mineChanged, theirsChanged, conflict, choice }];
  });
}

export function applyMerge(rows: readonly MergeRow[], choices: Partial<Record<CardField, MergeChoice>>): CardDraft {
  const out: CardDraft = {};
  for (const row of rows) {
    const pick = (choices[row.field] ?? row.choice) === 'mine' ? row.mine : row.theirs;
    if (pick) out[row.field] = pick;
  }
  return out;
}

/**
 * The variant a card was filled from, when its part number is not printed (an ordering
 * code): the one whose readings agree with most of the card's extracted values.
 */
export function variantOfCard(variants: readonly ExtractedVariant[], draft: CardDraft, datasheetId: number): ExtractedVariant | undefined {
  let best: { variant: ExtractedVariant; score: number } | undefined;
  for (const variant of variants) {
    const offered = suggestionsFrom(variant, datasheetId);
    let score = 0;
    for (const field of CARD_FIELDS) {
      const mine = draft[field];
      const s = offered[field];
      if (mine && s && mine.source === 'extracted' && mine.datasheetId === datasheetId && mine.page === s.page && sameFieldValue(mine, s)) score += 1;
    }
    if (score > 0 && (!best || score > best.score)) best = { variant, score };
  }
  return best?.variant;
}
