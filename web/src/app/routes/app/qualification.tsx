import { Alert, Anchor } from '@mantine/core';
import { Link, useParams } from 'react-router';
import { MeasuredEvidence } from '@/features/measurements/components/measured-evidence';
import { useQualification } from '@/features/qualifications/api/get-qualification';
import { QualificationCase } from '@/features/qualifications/components/qualification-case';
import { useSession } from '@/lib/session';

/** The case's vendor part's bench measurements against the house part's spec (engineers and admins read them). */
function CaseMeasurements({ id }: { id: number }) {
  const role = useSession()?.user.role;
  const q = useQualification(id);
  if (!q.data || (role !== 'engineer' && role !== 'admin')) return null;
  return (
    <MeasuredEvidence
      housePartId={q.data.housePart.id}
      sources={[{ vendorPartId: q.data.vendorPart.id, label: `${q.data.vendorPart.manufacturer} ${q.data.vendorPart.mpn}` }]}
    />
  );
}

export function QualificationRoute() {
  const id = Number(useParams().id);
  if (!Number.isInteger(id) || id <= 0) {
    return (
      <Alert color="red" role="alert" title="Not a case">
        The address does not name a qualification case.{' '}
        <Anchor component={Link} to="/qualifications">
          Go to the list
        </Anchor>
      </Alert>
    );
  }
  // Keyed by id so dialogs and drafts of one case never carry over to the next.
  return (
    <>
      <QualificationCase key={id} id={id} />
      <CaseMeasurements key={`m${id}`} id={id} />
    </>
  );
}
