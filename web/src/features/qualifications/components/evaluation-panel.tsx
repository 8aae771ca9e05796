import { Alert, Group, List, Paper, Stack, Text, Title } from '@mantine/core';
import { IconAlertTriangle } from '@tabler/icons-react';
import { formatNumber, type Evaluation, type Mechanism } from '@shuntwise/contracts';
import { DesignCaution } from '@/components/design-caution';
import { Quantity } from '@/components/quantity';
import { VerdictBadge } from '@/components/verdict-badge';
import { formatDateTime } from '@/lib/format-date';
import { ChecksTable } from './checks-table';

const MECHANISM_TEXT: Record<Mechanism, string> = {
  tunnelling: 'tunnelling (below about 5 V): the voltage falls as the junction warms, so the coefficient should be negative',
  mixed: 'mixed (about 5 V to 6 V): tunnelling and avalanche together; the coefficient is small and may have either sign',
  avalanche: 'avalanche (above about 6 V): the voltage rises as the junction warms, so the coefficient should be positive',
};

/** The evaluation of the case: overall verdict, breakdown mechanism, worst-case window, every check, and the caution. */
export function EvaluationPanel({ evaluation, current }: { evaluation: Evaluation; current?: { specVersion: number | null; cardVersion: number | null } }) {
  const signWarnings = evaluation.checks.find((c) => c.id === 'tc')?.warnings ?? [];
  const stale = current && (current.specVersion !== evaluation.specVersion || current.cardVersion !== evaluation.cardVersion);
  return (
    <Paper component="section" aria-label="Evaluation">
      <Stack gap="sm">
        <Group justify="space-between" align="flex-start" wrap="wrap">
          <Stack gap={2}>
            <Group gap="xs">
              <Title order={3} fz="h5">
                Evaluation
              </Title>
              <VerdictBadge verdict={evaluation.overall} size="lg" aria-label={`Overall verdict: ${evaluation.overall}`} />
            </Group>
            <Text fz="sm">{evaluation.summary}</Text>
          </Stack>
          <Text fz="xs" c="dimmed" ta="right">
            on spec v{evaluation.specVersion} and card v{evaluation.cardVersion}, {formatDateTime(evaluation.evaluatedAt)}
            <br />
            marginal band {evaluation.marginalBandPercent} % of a limit
          </Text>
        </Group>
        {stale && (
          <Alert color="orange" p="xs" icon={<IconAlertTriangle size={16} />}>
            The catalogue is now at spec v{current.specVersion ?? '–'} and card v{current.cardVersion ?? '–'}: this evaluation is out of date.
          </Alert>
        )}
        <Group gap="xl" wrap="wrap" align="flex-start">
          {evaluation.mechanism && (
            <Stack gap={0} maw={460}>
              <Text fz="xs" c="dimmed">
                Breakdown mechanism
              </Text>
              <Text fz="sm">{MECHANISM_TEXT[evaluation.mechanism]}</Text>
            </Stack>
          )}
          {evaluation.window && (
            <Stack gap={0}>
              <Text fz="xs" c="dimmed">
                Worst-case voltage over the envelope
              </Text>
              <Text fz="sm">
                <Quantity value={evaluation.window.vMin} kind="voltage" /> … <Quantity value={evaluation.window.vMax} kind="voltage" />
                <Text span fz="xs" c="dimmed">
                  {' '}
                  ({evaluation.window.toleranceIncluded ? 'tolerance included' : 'nominal part only'}
                  {evaluation.window.selfHeating ? ', with self-heating' : ''})
                </Text>
              </Text>
            </Stack>
          )}
          {evaluation.model && (
            <Stack gap={0}>
              <Text fz="xs" c="dimmed">
                Fitted model
              </Text>
              <Text fz="sm">
                BV <Quantity value={evaluation.model.bv} kind="voltage" /> at <Quantity value={evaluation.model.ibv} kind="current" />, NBV{' '}
                {formatNumber(evaluation.model.nbv)}, RS <Quantity value={evaluation.model.rs} kind="resistance" /> ({evaluation.model.basis})
              </Text>
            </Stack>
          )}
        </Group>
        {signWarnings.length > 0 && (
          <Alert color="orange" p="xs" icon={<IconAlertTriangle size={16} />} title="The coefficient's sign disagrees with the mechanism">
            {signWarnings.map((w) => (
              <Text key={w} fz="sm">
                {w}
              </Text>
            ))}
          </Alert>
        )}
        {evaluation.warnings.length > 0 && (
          <Alert color="orange" p="xs" icon={<IconAlertTriangle size={16} />} title="Warnings">
            <List size="sm" spacing={2}>
              {evaluation.warnings.map((w) => (
                <List.Item key={w}>{w}</List.Item>
              ))}
            </List>
          </Alert>
        )}
        <ChecksTable checks={evaluation.checks} notApplicable={evaluation.notApplicable} />
        {evaluation.assumptions.length > 0 && (
          <details>
            <summary style={{ cursor: 'pointer', fontSize: 'var(--mantine-font-size-sm)' }}>
              What the whole evaluation assumed ({evaluation.assumptions.length})
            </summary>
            <List size="xs" spacing={2} withPadding mt={4}>
              {evaluation.assumptions.map((a) => (
                <List.Item key={a}>{a}</List.Item>
              ))}
            </List>
          </details>
        )}
        <DesignCaution p="xs" />
      </Stack>
    </Paper>
  );
}
