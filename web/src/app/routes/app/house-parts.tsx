import { ScreenNotBuilt } from '@/components/screen-not-built';

// TODO: replaced by the House parts screen when its issue is built.
export function HousePartsRoute() {
  return <ScreenNotBuilt title="House parts" purpose="Internal part numbers, their specs, sources and decisions." />;
}
