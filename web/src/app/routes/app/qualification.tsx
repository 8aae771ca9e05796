import { Alert, Anchor } from '@mantine/core';
import { Link, useParams } from 'react-router';
import { QualificationCase } from '@/features/qualifications/components/qualification-case';

export function QualificationRoute() {
  const id = Number(useParams().id);
  if (!Number.isInteger(id) || id <= 0) {
    return (
      <Alert color="red" role="alert" title="Not a case">
        The address does not name a qualification case. <Anchor component={Link} to="/qualifications">Go to the list</Anchor>
      </Alert>
    );
  }
  // Keyed by id so dialogs and drafts of one case never carry over to the next.
  return <QualificationCase key={id} id={id} />;
}
