import { PageHeader } from '@/components/page-header';
import { BoardTable } from '@/features/board/components/board-table';
import { OpenRequestsPanel } from '@/features/qualification-requests/components/open-requests-panel';
import { OpenCaseButton } from '@/features/qualifications/components/open-case-button';
import { useSession } from '@/lib/session';

export function BoardRoute() {
  const session = useSession();
  const engineer = session?.user.role === 'engineer';
  return (
    <>
      <PageHeader title="Board" description="House parts with their sources and where each qualification stands." />
      <OpenRequestsPanel canAct={engineer} linkParts />
      <BoardTable
        renderSourceAction={(row, source) =>
          // The approved source is the reference; cases qualify alternates.
          engineer && source.role === 'alternate' && row.housePart.specVersion !== null && (source.state === 'none' || source.state === 'withdrawn') ? (
            <OpenCaseButton target={{ housePart: row.housePart, vendorPart: source.vendorPart }} />
          ) : null
        }
      />
    </>
  );
}
