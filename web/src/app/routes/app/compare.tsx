import { Alert, Anchor } from '@mantine/core';
import { Link, useParams } from 'react-router';
import { useCompare } from '@/features/compare/api/get-compare';
import { CompareView } from '@/features/compare/components/compare-view';
import { MeasuredEvidence } from '@/features/measurements/components/measured-evidence';
import { OpenCaseButton } from '@/features/qualifications/components/open-case-button';
import { useSession } from '@/lib/session';

/** Each source's bench measurements against the spec, below the datasheet-based comparison (engineers and admins). */
function CompareMeasurements({ housePartId }: { housePartId: number }) {
  const role = useSession()?.user.role;
  const compare = useCompare(housePartId);
  if (!compare.data || (role !== 'engineer' && role !== 'admin')) return null;
  const sources = compare.data.sources.map((s) => ({ vendorPartId: s.vendorPart.id, label: `${s.vendorPart.manufacturer} ${s.vendorPart.mpn} (${s.role})` }));
  return <MeasuredEvidence housePartId={housePartId} sources={sources} />;
}

export function CompareRoute() {
  const session = useSession();
  const housePartId = Number(useParams().housePartId);
  if (!Number.isInteger(housePartId) || housePartId <= 0) {
    return (
      <Alert color="red" role="alert" title="Not a house part">
        The address does not name a house part to compare.{' '}
        <Anchor component={Link} to="/board">
          Go to the board
        </Anchor>
      </Alert>
    );
  }
  const engineer = session?.user.role === 'engineer';
  return (
    <>
      <CompareView
        key={housePartId}
        housePartId={housePartId}
        renderSourceAction={(payload, source) =>
          engineer && source.role === 'alternate' && (source.latestCase === null || source.latestCase.state === 'withdrawn') && source.evaluation ? (
            <OpenCaseButton target={{ housePart: payload.housePart, vendorPart: source.vendorPart }} />
          ) : null
        }
      />
      <CompareMeasurements key={`m${housePartId}`} housePartId={housePartId} />
    </>
  );
}
