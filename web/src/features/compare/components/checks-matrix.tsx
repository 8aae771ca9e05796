import type { ReactNode } from 'react';
import { Anchor, Group, Paper, Stack, Table, Text, Title, getThemeColor, useMantineTheme, ColorSwatch } from '@mantine/core';
import { CHECK_IDS, CHECK_LABELS, type CheckId, type ComparePayload, type ComparePowerLimit, type QualificationCheck } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { CheckLimit, CheckValue, MarginText } from '@/components/check-cells';
import { Quantity } from '@/components/quantity';
import { QualificationStateBadge } from '@/components/qualification-state-badge';
import { VerdictBadge, VerdictMark } from '@/components/verdict-badge';
import { SOURCE_COLORS } from '../utils/series';

/**
 * Whether every source's check in a row is measured against the same limit (a spec limit),
 * or each has its own (a derated rating). A window check compares its whole window: its
 * `limit` is only the end nearer to that part's value.
 */
export function sharedLimit(checks: ReadonlyArray<QualificationCheck | undefined>): boolean {
  const bounds = checks
    .filter((c): c is QualificationCheck => c !== undefined)
    .map((c) => (c.limitKind === 'window' && c.window ? [c.window.min, c.window.max] : c.limitKind === 'member' ? [] : [c.limit]));
  const same = (a: number | null, b: number | null) => (a === null || b === null ? a === b : Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b)));
  return bounds.every((b) => b.length === bounds[0].length && b.every((x, k) => same(x, bounds[0][k])));
}

/** How a source's own dissipation limit came about: "50 % of 260 mW derated to 85 °C". */
function PowerLimitNote({ limit }: { limit: ComparePowerLimit }) {
  if (limit.derated === null) return <>no derated rating: {limit.reason}</>;
  return (
    <>
      {limit.policyFraction !== null && `${Math.round(limit.policyFraction * 1000) / 10} % of `}
      <Quantity value={limit.derated} kind="power" /> derated to <Quantity value={limit.ambientC} kind="temperature" digits={3} /> (
      {limit.basis === 'rthJA' ? '(TJ max − Ta)/RthJA' : 'PD max, linear to TJ max'})
    </>
  );
}

/**
 * The checks side by side: one row per check, one column per source, each cell the
 * source's normalised value with its margin coloured by the verdict. Every source is
 * evaluated now on the current spec; where a limit is the part's own (the dissipation
 * limit comes from each card's derated rating) it is shown in that part's cell.
 */
export function ChecksMatrix({ payload, renderSourceAction }: { payload: ComparePayload; renderSourceAction?: (index: number) => ReactNode }) {
  const theme = useMantineTheme();
  const byId = payload.sources.map((s) => new Map((s.evaluation?.checks ?? []).map((c) => [c.id, c] as const)));
  const ids = CHECK_IDS.filter((id) => byId.some((m) => m.has(id)));
  const skipped = new Map(
    payload.sources.flatMap((s) => (s.evaluation?.notApplicable ?? []).filter((n) => !ids.includes(n.id)).map((n) => [n.id, n.reason] as const)),
  );
  const limitOf = (id: CheckId): QualificationCheck | undefined => byId.map((m) => m.get(id)).find((c) => c !== undefined);

  return (
    <Paper component="section" aria-label="Checks side by side">
      <Stack gap="xs">
        <Title order={3} fz="h5">
          Checks against spec v{payload.specVersion}
        </Title>
        <Table.ScrollContainer minWidth={260 + 200 * payload.sources.length} type="native">
          <Table aria-label="Checks by source">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Check</Table.Th>
                <Table.Th>Limit</Table.Th>
                {payload.sources.map((s, i) => (
                  <Table.Th key={s.vendorPart.id} style={{ verticalAlign: 'top' }}>
                    <Stack gap={2}>
                      <Group gap={4} wrap="nowrap">
                        <ColorSwatch color={getThemeColor(SOURCE_COLORS[i % SOURCE_COLORS.length], theme)} size={10} />
                        <Anchor component={Link} to={`/vendor-parts/${s.vendorPart.id}`} fz="sm" fw={600}>
                          {s.vendorPart.mpn}
                        </Anchor>
                      </Group>
                      <Text fz="xs" c="dimmed" fw={400}>
                        {s.vendorPart.manufacturer} · {s.role} · card {s.cardVersion ? `v${s.cardVersion}` : 'none'}
                      </Text>
                      <Group gap={4}>
                        {s.evaluation && <VerdictBadge verdict={s.evaluation.overall} size="xs" aria-label={`Overall now: ${s.evaluation.overall}`} />}
                        {s.latestCase ? (
                          <Anchor component={Link} to={`/qualifications/${s.latestCase.id}`} fz="xs">
                            <QualificationStateBadge state={s.latestCase.state} size="xs" style={{ cursor: 'pointer' }} /> #{s.latestCase.id}
                          </Anchor>
                        ) : (
                          <QualificationStateBadge state="none" size="xs" />
                        )}
                      </Group>
                      {renderSourceAction?.(i)}
                    </Stack>
                  </Table.Th>
                ))}
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {ids.map((id) => {
                const first = limitOf(id)!;
                const shared = sharedLimit(byId.map((m) => m.get(id)));
                return (
                  <Table.Tr key={id} data-check={id}>
                    <Table.Td>
                      <Text fz="sm">{CHECK_LABELS[id]}</Text>
                    </Table.Td>
                    <Table.Td>
                      {shared ? (
                        <Text fz="sm" component="div">
                          <CheckLimit check={first} />
                        </Text>
                      ) : (
                        <Text fz="xs" c="dimmed" component="div">
                          each part&apos;s own, in its column
                        </Text>
                      )}
                    </Table.Td>
                    {payload.sources.map((s, i) => {
                      const c = byId[i].get(id);
                      return (
                        <Table.Td key={s.vendorPart.id} title={c?.detail} data-verdict={c?.verdict}>
                          {c ? (
                            <>
                              <Group gap={6} wrap="nowrap" justify="space-between">
                                <Text fz="sm" component="div">
                                  <CheckValue check={c} />
                                </Text>
                                <Group gap={4} wrap="nowrap">
                                  {c.margin !== null && <MarginText margin={c.margin} verdict={c.verdict} fz="xs" />}
                                  <VerdictMark verdict={c.verdict} />
                                </Group>
                              </Group>
                              {!shared && (
                                <Text fz="xs" c="dimmed" component="div" data-testid={`own-limit-${id}`}>
                                  limit <CheckLimit check={c} />
                                  {id === 'power-dissipation' && s.powerLimit && (
                                    <>
                                      {': '}
                                      <PowerLimitNote limit={s.powerLimit} />
                                    </>
                                  )}
                                </Text>
                              )}
                            </>
                          ) : (
                            <Text fz="xs" c="dimmed">
                              {s.evaluation ? 'not checked' : (s.reason ?? 'no evaluation')}
                            </Text>
                          )}
                        </Table.Td>
                      );
                    })}
                  </Table.Tr>
                );
              })}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
        {skipped.size > 0 && (
          <Text fz="xs" c="dimmed">
            Not checked (the spec sets no limit): {[...skipped].map(([id, reason]) => `${CHECK_LABELS[id]} — ${reason}`).join('; ')}.
          </Text>
        )}
        <Text fz="xs" c="dimmed">
          Hover a cell for the sentence behind it; open a source&apos;s case for every assumption.
        </Text>
      </Stack>
    </Paper>
  );
}
