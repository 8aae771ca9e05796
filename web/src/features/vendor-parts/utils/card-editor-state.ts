import type { CardField, RatingCardView, TempCoUnit } from '@shuntwise/contracts';
import { acceptSuggestion, draftFromCard, enterValue, type CardDraft, type Suggestion } from './card-draft';

/** What the rating-card editor holds between renders: the card it stands on and the edits on top. */
export interface CardEditorState {
  /** The card as last read or saved. */
  loaded: RatingCardView;
  /** The version a save is based on (the server refuses a save on an older one). */
  baseVersion: number;
  /** The fields of that version; the draft's changes are counted against it. */
  base: CardDraft;
  draft: CardDraft;
  /** Fields typed by hand: a suggestion no longer counts as pending for them. */
  typed: ReadonlySet<CardField>;
  note: string;
  serverErrors: Partial<Record<CardField, string>>;
  saveError: unknown;
  /** After a save attempt, empty required fields are marked too. */
  showRequired: boolean;
  /** The card someone else saved meanwhile (a 409), until merged. */
  conflict: RatingCardView | null;
}

export type CardEditorAction =
  /**
   * A card read or saved: the editor stands on it, edits cleared — except, after a save,
   * what was typed while it was on its way (`submitted` is the draft that was sent).
   */
  | { type: 'load'; view: RatingCardView; submitted?: CardDraft }
  /** A merge after a conflict: stands on their version with the merged fields; note and marks stay. */
  | { type: 'merge'; merged: CardDraft }
  | { type: 'enter'; field: CardField; value: number | null; printed: string | null; unit?: TempCoUnit }
  | { type: 'accept'; suggestions: Suggestion[] }
  | { type: 'note'; note: string }
  | { type: 'save-attempt'; valid: boolean }
  | { type: 'save-failed'; error: unknown; serverErrors: Partial<Record<CardField, string>> }
  | { type: 'conflict'; current: RatingCardView };

export function initialCardEditorState(card: RatingCardView): CardEditorState {
  const base = draftFromCard(card);
  return {
    loaded: card,
    baseVersion: card.version,
    base,
    draft: base,
    typed: new Set(),
    note: '',
    serverErrors: {},
    saveError: null,
    showRequired: false,
    conflict: null,
  };
}

function withoutError(errors: CardEditorState['serverErrors'], fields: CardField[]): CardEditorState['serverErrors'] {
  if (!fields.some((f) => errors[f])) return errors;
  const next = { ...errors };
  for (const f of fields) delete next[f];
  return next;
}

/** The one place the editor's state changes; pure, so each step is testable without rendering. */
export function cardEditorReducer(state: CardEditorState, action: CardEditorAction): CardEditorState {
  switch (action.type) {
    case 'load': {
      const fresh = initialCardEditorState(action.view);
      const typedSince = action.submitted !== undefined && state.draft !== action.submitted;
      return { ...fresh, draft: typedSince ? state.draft : fresh.draft, conflict: state.conflict };
    }
    case 'merge': {
      if (!state.conflict) return state;
      const theirs = state.conflict;
      return { ...state, loaded: theirs, baseVersion: theirs.version, base: draftFromCard(theirs), draft: action.merged, conflict: null };
    }
    case 'enter':
      return {
        ...state,
        draft: enterValue(state.draft, action.field, action.value, action.printed, action.unit),
        typed: state.typed.has(action.field) ? state.typed : new Set(state.typed).add(action.field),
        serverErrors: withoutError(state.serverErrors, [action.field]),
      };
    case 'accept': {
      let draft = state.draft;
      let typed = state.typed;
      for (const s of action.suggestions) {
        draft = acceptSuggestion(draft, s);
        if (typed.has(s.field)) {
          typed = new Set(typed);
          (typed as Set<CardField>).delete(s.field);
        }
      }
      return {
        ...state,
        draft,
        typed,
        serverErrors: withoutError(
          state.serverErrors,
          action.suggestions.map((s) => s.field),
        ),
      };
    }
    case 'note':
      return { ...state, note: action.note };
    case 'save-attempt':
      return { ...state, showRequired: true, saveError: action.valid ? null : state.saveError };
    case 'save-failed':
      return { ...state, serverErrors: action.serverErrors, saveError: action.error };
    case 'conflict':
      return { ...state, conflict: action.current };
  }
}
