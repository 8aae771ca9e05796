import { mayUse, screenByKey } from '@/app/navigation';
import { FindPartsScreen } from '@/features/find-parts/components/find-parts-screen';
import { AskQualificationButton } from '@/features/qualification-requests/components/ask-qualification-button';
import { MyRequestsPanel } from '@/features/qualification-requests/components/my-requests-panel';
import { useSession } from '@/lib/session';

export function FindPartsRoute() {
  const session = useSession();
  // Links into the catalogue only for roles that may open those screens (designers may not).
  const linkCatalogue = session !== null && mayUse(session.user.role, screenByKey('vendor-parts'));
  // Designers ask for a qualification; engineers may too (a colleague takes it up).
  const mayAsk = session?.user.role === 'designer' || session?.user.role === 'engineer';
  return (
    <FindPartsScreen
      linkCatalogue={linkCatalogue}
      requestsPanel={mayAsk ? <MyRequestsPanel linkCases={linkCatalogue} /> : null}
      renderPartAction={
        mayAsk
          ? (item) => (
              <AskQualificationButton
                target={{ vendorPart: item.vendorPart, clearedFor: item.clearances.map((c) => c.housePart), underWay: item.qualificationOpen }}
              />
            )
          : undefined
      }
    />
  );
}
