import { describe, expect, it } from 'vitest';
import { boardQuerySchema } from './board.schema';
import { QUALIFICATION_ACTION_REQUEST_SCHEMAS, qualificationClearWithConditionsRequestSchema, qualificationListQuerySchema } from './qualification.schema';
import { DECIDED_STATES, OPEN_STATES, QUALIFICATION_ACTIONS, QUALIFICATION_STATES, QUALIFICATION_TRANSITIONS } from './qualification-state.schema';

describe('qualification contracts', () => {
  it('moves only from states the list knows, and every action has a body schema', () => {
    for (const action of QUALIFICATION_ACTIONS) {
      const t = QUALIFICATION_TRANSITIONS[action];
      expect(t.from.length).toBeGreaterThan(0);
      for (const s of t.from) expect(QUALIFICATION_STATES).toContain(s);
      if (t.to !== null) expect(QUALIFICATION_STATES).toContain(t.to);
      expect(QUALIFICATION_ACTION_REQUEST_SCHEMAS[action]).toBeDefined();
    }
    // decisions start from review only; open and decided states do not overlap
    for (const a of ['clear', 'clear-with-conditions', 'reject'] as const) expect(QUALIFICATION_TRANSITIONS[a].from).toEqual(['in-review']);
    expect(OPEN_STATES.filter((s) => (DECIDED_STATES as readonly string[]).includes(s))).toEqual([]);
  });

  it('reads states as a comma list and names an unknown one', () => {
    expect(qualificationListQuerySchema.parse({ state: 'draft, in-review,draft' }).state).toEqual(['draft', 'in-review']);
    const bad = qualificationListQuerySchema.safeParse({ state: 'draft,granted' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].message).toMatch(/unknown state in "draft,granted"/);
    expect(boardQuerySchema.parse({ state: 'none,cleared', minAgeDays: '7' })).toMatchObject({ state: ['none', 'cleared'], minAgeDays: 7 });
  });

  it('needs written conditions for a clearance with conditions', () => {
    const empty = qualificationClearWithConditionsRequestSchema.safeParse({ version: 0, conditions: '   ' });
    expect(empty.success).toBe(false);
    expect(empty.error?.issues[0]).toMatchObject({ path: ['conditions'], message: 'Write the conditions' });
    expect(qualificationClearWithConditionsRequestSchema.parse({ version: 0, conditions: ' 100 % leakage test at 2 V ' }).conditions).toBe(
      '100 % leakage test at 2 V',
    );
  });
});
