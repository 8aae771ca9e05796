import { Badge } from '@mantine/core';
import type { HousePartStatus } from '@shuntwise/contracts';

export const STATUS_LABEL: Record<HousePartStatus, string> = {
  draft: 'Draft',
  active: 'Active',
  'not-for-new-designs': 'Not for new designs',
  'end-of-life': 'End of life',
};

const STATUS_COLOR: Record<HousePartStatus, string> = { draft: 'gray', active: 'verdigris', 'not-for-new-designs': 'yellow', 'end-of-life': 'red' };

export function HousePartStatusBadge({ status }: { status: HousePartStatus }) {
  return (
    <Badge size="sm" color={STATUS_COLOR[status]}>
      {STATUS_LABEL[status]}
    </Badge>
  );
}
