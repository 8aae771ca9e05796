import { Badge } from '@mantine/core';
import type { Role } from '@shuntwise/contracts';

const ROLE_LABEL: Record<Role, string> = {
  admin: 'Admin',
  engineer: 'Engineer',
  designer: 'Designer',
  buyer: 'Buyer',
};

const ROLE_COLOR: Record<Role, string> = {
  admin: 'grape',
  engineer: 'copper',
  designer: 'verdigris',
  buyer: 'indigo',
};

export function roleLabel(role: Role): string {
  return ROLE_LABEL[role];
}

export function RoleBadge({ role }: { role: Role }) {
  return (
    <Badge color={ROLE_COLOR[role]} size="sm" component="span">
      {ROLE_LABEL[role]}
    </Badge>
  );
}
