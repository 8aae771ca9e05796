import { mayUse, screenByKey } from '@/app/navigation';
import { FindPartsScreen } from '@/features/find-parts/components/find-parts-screen';
import { useSession } from '@/lib/session';

export function FindPartsRoute() {
  const session = useSession();
  // Links into the catalogue only for roles that may open those screens (designers may not).
  const linkCatalogue = session !== null && mayUse(session.user.role, screenByKey('vendor-parts'));
  return <FindPartsScreen linkCatalogue={linkCatalogue} />;
}
