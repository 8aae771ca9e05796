import { Alert, Anchor, Text } from '@mantine/core';
import { Link } from 'react-router';
import { homePathFor } from '@/app/navigation';
import { PageHeader } from '@/components/page-header';
import { useSession } from '@/lib/session';

export function NotFoundRoute() {
  const session = useSession();
  return (
    <>
      <PageHeader title="Page not found" />
      <Alert color="gray" title="Nothing here">
        <Text fz="sm">There is no Shuntwise page at this address.</Text>
        {session && (
          <Text fz="sm" mt="xs">
            <Anchor component={Link} to={homePathFor(session.user.role)}>
              Go to your start page
            </Anchor>
          </Text>
        )}
      </Alert>
    </>
  );
}
