import { ScreenNotBuilt } from '@/components/screen-not-built';

// TODO: replaced by the Board screen when its issue is built.
export function BoardRoute() {
  return <ScreenNotBuilt title="Board" purpose="House parts with their sources and qualification states at a glance." />;
}
