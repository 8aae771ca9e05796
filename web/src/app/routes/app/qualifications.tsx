import { ScreenNotBuilt } from '@/components/screen-not-built';

// TODO: replaced by the Qualifications screen when its issue is built.
export function QualificationsRoute() {
  return <ScreenNotBuilt title="Qualifications" purpose="Second-source cases: checks, comments and sign-off." />;
}
