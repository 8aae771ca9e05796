import { Badge, type BadgeProps } from '@mantine/core';
import { QUALIFICATION_REQUEST_STATE_LABELS, type QualificationRequestState } from '@shuntwise/contracts';

const COLOR: Record<QualificationRequestState, string> = { open: 'blue', 'taken-up': 'verdigris', declined: 'orange' };

/** Where a request stands: waiting (blue), taken up with a case (green), declined (orange). */
export function RequestStateBadge({ state, ...rest }: { state: QualificationRequestState } & Omit<BadgeProps, 'color' | 'children'>) {
  return (
    <Badge size="sm" color={COLOR[state]} variant="light" miw="max-content" data-request-state={state} {...rest}>
      {QUALIFICATION_REQUEST_STATE_LABELS[state]}
    </Badge>
  );
}
