import { describe, expect, it } from 'vitest';
import type { RatingCardView } from '@shuntwise/contracts';
import { cardEditorReducer, initialCardEditorState } from './card-editor-state';

// Invented cards (demo data): only what the reducer reads is filled.
function card(version: number, vzNom: number | null): RatingCardView {
  const provenance = { source: 'entered', datasheetId: null, page: null, text: null };
  return {
    vendorPartId: 3,
    version,
    fields: vzNom === null ? {} : { vzNom: { value: vzNom, printed: `${vzNom} V`, provenance } },
    updatedAt: null,
    updatedBy: null,
  } as unknown as RatingCardView;
}

describe('cardEditorReducer', () => {
  it('a load after a save clears the edits but keeps what was typed while the save was on its way', () => {
    let state = initialCardEditorState(card(1, 5.1));
    state = cardEditorReducer(state, { type: 'enter', field: 'vzNom', value: 5.2, printed: '5.2 V' });
    state = cardEditorReducer(state, { type: 'note', note: 'corrected' });
    const submitted = state.draft;
    // Saved, nothing typed since: the editor stands on the saved card.
    const clean = cardEditorReducer(state, { type: 'load', view: card(2, 5.2), submitted });
    expect(clean.baseVersion).toBe(2);
    expect(clean.note).toBe('');
    expect(clean.typed.size).toBe(0);
    expect(clean.draft).toBe(clean.base);
    // Typed again while saving: that edit stays on top of version 2.
    const typing = cardEditorReducer(state, { type: 'enter', field: 'vzNom', value: 5.3, printed: '5.3 V' });
    const kept = cardEditorReducer(typing, { type: 'load', view: card(2, 5.2), submitted });
    expect(kept.baseVersion).toBe(2);
    expect(kept.draft.vzNom?.value).toBe(5.3);
  });

  it('a merge stands on their version with the merged fields and keeps the note', () => {
    let state = initialCardEditorState(card(1, 5.1));
    state = cardEditorReducer(state, { type: 'note', note: 'from rev. B' });
    state = cardEditorReducer(state, { type: 'conflict', current: card(3, 5.0) });
    const merged = { ...state.draft };
    const after = cardEditorReducer(state, { type: 'merge', merged });
    expect(after.baseVersion).toBe(3);
    expect(after.conflict).toBeNull();
    expect(after.draft).toBe(merged);
    expect(after.base.vzNom?.value).toBe(5.0);
    expect(after.note).toBe('from rev. B');
  });

  it("typing a field clears only that field's server error; a failed save keeps the draft", () => {
    let state = initialCardEditorState(card(1, 5.1));
    state = cardEditorReducer(state, { type: 'save-failed', error: new Error('x'), serverErrors: { vzNom: 'too high', izt: 'missing' } });
    state = cardEditorReducer(state, { type: 'enter', field: 'vzNom', value: 5.0, printed: '5.0 V' });
    expect(state.serverErrors).toEqual({ izt: 'missing' });
    expect(state.draft.vzNom?.value).toBe(5.0);
    expect(state.saveError).toBeInstanceOf(Error);
  });
});
