import { Alert, Anchor, Text } from '@mantine/core';
import { IconLock } from '@tabler/icons-react';
import type { Role } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { homePathFor, type Screen } from '@/app/navigation';
import { PageHeader } from '@/components/page-header';
import { roleLabel } from '@/components/role-badge';

export function NotAvailable({ screen, role }: { screen: Screen; role: Role }) {
  const who = screen.roles.map(roleLabel).join(', ');
  return (
    <>
      <PageHeader title={screen.label} />
      <Alert color="orange" icon={<IconLock size={18} />} title="Not available for your role" role="alert">
        <Text fz="sm">
          {screen.label} is open to: {who}. You are signed in as {roleLabel(role)}. Ask an administrator if your work needs it.
        </Text>
        <Text fz="sm" mt="xs">
          <Anchor component={Link} to={homePathFor(role)}>
            Go to your start page
          </Anchor>
        </Text>
      </Alert>
    </>
  );
}
