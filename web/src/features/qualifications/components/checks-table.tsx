import { Fragment, useState } from 'react';
import { ActionIcon, Button, Group, List, Stack, Table, Text, Tooltip } from '@mantine/core';
import { IconAlertTriangle, IconChevronDown, IconChevronRight } from '@tabler/icons-react';
import type { CheckId, QualificationCheck, SkippedCheck } from '@shuntwise/contracts';
import { CheckLimit, CheckValue, MarginText } from '@/components/check-cells';
import { VerdictBadge } from '@/components/verdict-badge';

function CheckDetail({ check }: { check: QualificationCheck }) {
  return (
    <Stack gap={4} py={4}>
      <Text fz="sm">{check.detail}</Text>
      {check.warnings.length > 0 && (
        <List size="sm" spacing={2} icon={<IconAlertTriangle size={14} color="var(--mantine-color-orange-7)" />}>
          {check.warnings.map((w) => (
            <List.Item key={w}>
              <Text fz="sm" c="orange.8">
                {w}
              </Text>
            </List.Item>
          ))}
        </List>
      )}
      {check.assumptions.length > 0 && (
        <>
          <Text fz="xs" c="dimmed" fw={500}>
            Assumed
          </Text>
          <List size="xs" spacing={2} withPadding>
            {check.assumptions.map((a) => (
              <List.Item key={a}>{a}</List.Item>
            ))}
          </List>
        </>
      )}
    </Stack>
  );
}

/**
 * Every check of an evaluation: the part's normalised value, the spec's limit, the margin
 * in percent of the limit coloured by the verdict, and the verdict. Each row opens to the
 * sentence the server wrote, its warnings and what it assumed (the detail is also the
 * row's hover text).
 */
export function ChecksTable({
  checks,
  notApplicable = [],
  caption,
}: {
  checks: readonly QualificationCheck[];
  notApplicable?: readonly SkippedCheck[];
  caption?: string;
}) {
  const [open, setOpen] = useState<ReadonlySet<CheckId>>(new Set());
  const allOpen = checks.length > 0 && checks.every((c) => open.has(c.id));
  const toggle = (id: CheckId) =>
    setOpen((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <Stack gap={6}>
      <Group justify="space-between">
        <Text fz="sm" fw={500}>
          {caption ?? 'Checks'}
        </Text>
        <Button size="compact-xs" variant="subtle" onClick={() => setOpen(allOpen ? new Set() : new Set(checks.map((c) => c.id)))}>
          {allOpen ? 'Hide the assumptions' : 'Show every assumption'}
        </Button>
      </Group>
      <Table.ScrollContainer minWidth={620} type="native">
        <Table aria-label={caption ?? 'Checks'}>
          <Table.Thead>
            <Table.Tr>
              <Table.Th w={28} />
              <Table.Th>Check</Table.Th>
              <Table.Th>Part (normalised)</Table.Th>
              <Table.Th>Limit</Table.Th>
              <Table.Th ta="right">Margin</Table.Th>
              <Table.Th>Verdict</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {checks.map((check) => {
              const expanded = open.has(check.id);
              return (
                <Fragment key={check.id}>
                  <Table.Tr data-check={check.id} data-verdict={check.verdict} title={check.detail}>
                    <Table.Td>
                      <ActionIcon
                        size="sm"
                        variant="subtle"
                        color="gray"
                        aria-expanded={expanded}
                        aria-label={`${expanded ? 'Hide' : 'Show'} the assumptions of ${check.label}`}
                        onClick={() => toggle(check.id)}
                      >
                        {expanded ? <IconChevronDown size={14} /> : <IconChevronRight size={14} />}
                      </ActionIcon>
                    </Table.Td>
                    <Table.Td>
                      <Group gap={4} wrap="nowrap">
                        <Text fz="sm">{check.label}</Text>
                        {check.warnings.length > 0 && (
                          <Tooltip label={check.warnings.join(' · ')} multiline w={320}>
                            <IconAlertTriangle size={14} color="var(--mantine-color-orange-7)" aria-label={`${check.warnings.length} warning(s)`} />
                          </Tooltip>
                        )}
                      </Group>
                    </Table.Td>
                    <Table.Td>
                      <CheckValue check={check} />
                    </Table.Td>
                    <Table.Td>
                      <CheckLimit check={check} />
                    </Table.Td>
                    <Table.Td ta="right" data-testid={`margin-${check.id}`}>
                      <MarginText margin={check.margin} verdict={check.verdict} />
                    </Table.Td>
                    <Table.Td>
                      <VerdictBadge verdict={check.verdict} />
                    </Table.Td>
                  </Table.Tr>
                  {expanded && (
                    <Table.Tr>
                      <Table.Td />
                      <Table.Td colSpan={5} bg="var(--mantine-color-default-hover)">
                        <CheckDetail check={check} />
                      </Table.Td>
                    </Table.Tr>
                  )}
                </Fragment>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
      {notApplicable.length > 0 && (
        <Text fz="xs" c="dimmed">
          Not checked (the spec sets no limit): {notApplicable.map((n) => `${n.label} — ${n.reason}`).join('; ')}.
        </Text>
      )}
    </Stack>
  );
}
