import { Button } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconDownload } from '@tabler/icons-react';
import { describeError } from '@/lib/api-client';
import { useExportHouseParts, useExportRatingCards } from '../api/export-csv';

/** Downloads a CSV export with the session's token; a failure is a notification with its reason. */
export function ExportButton({ what, manufacturer }: { what: 'rating-cards' | 'house-parts'; manufacturer?: string }) {
  const cards = useExportRatingCards();
  const houseParts = useExportHouseParts();
  const mutation = what === 'rating-cards' ? cards : houseParts;
  const run = () => {
    const onError = (error: unknown) => notifications.show({ color: 'red', title: 'Export failed', message: describeError(error) });
    if (what === 'rating-cards') cards.mutate(manufacturer, { onError });
    else houseParts.mutate(undefined, { onError });
  };
  return (
    <Button variant="default" leftSection={<IconDownload size={16} />} onClick={run} loading={mutation.isPending}>
      {what === 'rating-cards' ? (manufacturer ? `Export ${manufacturer} cards` : 'Export cards (CSV)') : 'Export with sources (CSV)'}
    </Button>
  );
}
