import type { ComponentType } from 'react';
import { Badge, ThemeIcon, type BadgeProps } from '@mantine/core';
import { IconAlertTriangle, IconCheck, IconQuestionMark, IconX, type IconProps } from '@tabler/icons-react';
import { QUALIFICATION_VERDICT_LABELS, type QualificationVerdict } from '@shuntwise/contracts';

/** Verdict colours: the same scale colours every margin in the checks tables. */
export const VERDICT_COLOR: Record<QualificationVerdict, string> = {
  pass: 'verdigris',
  marginal: 'yellow',
  fail: 'red',
  'no-data': 'gray',
};

/** Text shade of a verdict, dark enough to read on white and on the dark scheme's graphite. */
export const VERDICT_TEXT_COLOR: Record<QualificationVerdict, string> = {
  pass: 'verdigris.7',
  marginal: 'yellow.8',
  fail: 'red.9',
  'no-data': 'dimmed',
};

const ICON: Record<QualificationVerdict, ComponentType<IconProps>> = {
  pass: IconCheck,
  marginal: IconAlertTriangle,
  fail: IconX,
  'no-data': IconQuestionMark,
};

/** A verdict with its mark, so it reads without colour too. */
export function VerdictBadge({ verdict, size = 'sm', ...rest }: { verdict: QualificationVerdict } & Omit<BadgeProps, 'color' | 'children'>) {
  const Icon = ICON[verdict];
  return (
    <Badge size={size} color={VERDICT_COLOR[verdict]} leftSection={<Icon size={11} stroke={2.5} />} miw="max-content" data-verdict={verdict} {...rest}>
      {QUALIFICATION_VERDICT_LABELS[verdict]}
    </Badge>
  );
}

/** The verdict as a small mark only (dense matrices); the label is its accessible name and hover text. */
export function VerdictMark({ verdict }: { verdict: QualificationVerdict }) {
  const Icon = ICON[verdict];
  const label = QUALIFICATION_VERDICT_LABELS[verdict];
  return (
    <ThemeIcon size={16} radius="xl" variant="light" color={VERDICT_COLOR[verdict]} role="img" aria-label={label} title={label} data-verdict={verdict}>
      <Icon size={11} stroke={2.5} />
    </ThemeIcon>
  );
}
