import { useState } from 'react';
import { Button } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconFileTypePdf } from '@tabler/icons-react';
import { isDecidedState, type QualificationState } from '@shuntwise/contracts';
import { describeError, downloadFile } from '@/lib/api-client';

/**
 * Downloads the PDF record written when the case was decided (the server keeps it exactly
 * as made). Shown for decided cases only; the case page and Sources both use it.
 */
export function DecisionRecordButton({ caseId, state }: { caseId: number; state: QualificationState | string }) {
  const [busy, setBusy] = useState(false);
  if (!isDecidedState(state as QualificationState)) return null;
  const download = async () => {
    setBusy(true);
    try {
      const name = await downloadFile(`/qualifications/${caseId}/record`, `decision-record-case-${caseId}.pdf`);
      notifications.show({ color: 'verdigris', title: 'Decision record', message: `${name} was downloaded.` });
    } catch (error) {
      notifications.show({ color: 'red', title: 'Record not downloaded', message: describeError(error) });
    } finally {
      setBusy(false);
    }
  };
  return (
    <Button
      size="compact-xs"
      variant="default"
      leftSection={<IconFileTypePdf size={14} />}
      loading={busy}
      onClick={() => void download()}
      aria-label={`Decision record of case #${caseId} (PDF)`}
    >
      Record
    </Button>
  );
}
