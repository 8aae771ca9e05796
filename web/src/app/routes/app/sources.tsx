import { ScreenNotBuilt } from '@/components/screen-not-built';

// TODO: replaced by the Sources screen when its issue is built.
export function SourcesRoute() {
  return <ScreenNotBuilt title="Sources" purpose="Cleared sources per house part, with their conditions, for procurement." />;
}
