import { Badge, type BadgeProps } from '@mantine/core';
import { QUALIFICATION_STATE_LABELS, SOURCE_STANDING_LABELS, type BoardState, type QualificationState, type SourceStanding } from '@shuntwise/contracts';

/**
 * One colour per case state, the same on every screen (Board, Qualifications, Compare,
 * Sources): grey while open, blue waiting for a decision, green cleared, lime cleared on
 * conditions, red rejected, purple revoked; withdrawn and "no case yet" are outlined grey;
 * a house part's approved source (approved by a decision, the reference part) is outlined green.
 */
export const STATE_COLOR: Record<QualificationState, string> = {
  draft: 'gray',
  'in-review': 'blue',
  approved: 'verdigris',
  cleared: 'verdigris',
  'cleared-with-conditions': 'lime',
  rejected: 'red',
  withdrawn: 'gray',
  revoked: 'grape',
};

const OUTLINED = new Set<string>(['withdrawn', 'none', 'not-qualified', 'approved']);

type AnyState = QualificationState | BoardState | SourceStanding;

export function stateLabel(state: AnyState): string {
  if (state === 'none') return 'No case';
  if (state === 'not-qualified') return SOURCE_STANDING_LABELS[state];
  return QUALIFICATION_STATE_LABELS[state];
}

export function stateColor(state: AnyState): string {
  return state === 'none' || state === 'not-qualified' ? 'gray' : STATE_COLOR[state];
}

/** A case state (or a source's standing) as a small coloured badge. */
export function QualificationStateBadge({ state, size = 'sm', ...rest }: { state: AnyState } & Omit<BadgeProps, 'color' | 'children'>) {
  return (
    // max-content: in a narrow table cell the badge keeps its whole label instead of an ellipsis.
    <Badge size={size} color={stateColor(state)} variant={OUTLINED.has(state) ? 'outline' : 'light'} miw="max-content" data-state={state} {...rest}>
      {stateLabel(state)}
    </Badge>
  );
}
