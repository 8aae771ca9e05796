import { ScreenNotBuilt } from '@/components/screen-not-built';

// TODO: replaced by the Find parts screen when its issue is built.
export function FindPartsRoute() {
  return <ScreenNotBuilt title="Find parts" purpose="Search cleared parts and check one against your circuit." />;
}
