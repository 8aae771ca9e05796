import { Alert, type AlertProps } from '@mantine/core';
import { IconAlertTriangle } from '@tabler/icons-react';

/**
 * The caution every result that drives a design carries. Reuse it beside normalised
 * ratings, checks, regulator results and exported models.
 */
export function DesignCaution(props: Omit<AlertProps, 'children' | 'title'>) {
  return (
    <Alert color="yellow" icon={<IconAlertTriangle size={18} />} title="Estimates — confirm before you rely on them" {...props}>
      These figures are estimates from datasheet values. Confirm them by measurement and with the manufacturer before a design depends on them. Safety-relevant
      circuits follow their own standards and your organisation&apos;s qualification procedure.
    </Alert>
  );
}
