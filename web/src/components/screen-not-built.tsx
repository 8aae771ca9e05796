import { Alert } from '@mantine/core';
import { IconHammer } from '@tabler/icons-react';
import { PageHeader } from './page-header';

/** Stand-in for a screen whose issue is still open; its route file is replaced when it is built. */
export function ScreenNotBuilt({ title, purpose }: { title: string; purpose: string }) {
  return (
    <>
      <PageHeader title={title} description={purpose} />
      <Alert color="gray" icon={<IconHammer size={18} />} title="Not built yet">
        This screen is not built yet. It comes with a later release of Shuntwise.
      </Alert>
    </>
  );
}
