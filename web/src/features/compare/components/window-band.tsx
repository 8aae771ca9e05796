import { Box, Group, Paper, Stack, Text, Title, Tooltip, getThemeColor, useMantineTheme } from '@mantine/core';
import { formatQuantity, type ComparePayload } from '@shuntwise/contracts';
import { Quantity } from '@/components/quantity';
import { VerdictBadge } from '@/components/verdict-badge';
import { shortQuantity, SOURCE_COLORS } from '../utils/series';

/**
 * Each source's worst-case voltage over the envelope (currents × ambients × tolerance,
 * with self-heating) as a band on one voltage scale, against the spec's output window
 * (shaded) and its Zener-voltage window at iRef (dashed lines).
 */
export function WindowBand({ payload }: { payload: ComparePayload }) {
  const theme = useMantineTheme();
  const rows = payload.sources.map((s, i) => ({ s, i, w: s.evaluation?.window ?? null }));
  const ends = rows.flatMap((r) => (r.w ? [r.w.vMin, r.w.vMax] : []));
  ends.push(payload.specWindow.min, payload.specWindow.max);
  if (payload.outputWindow) ends.push(payload.outputWindow.vMin, payload.outputWindow.vMax);
  const span = Math.max(...ends) - Math.min(...ends);
  const low = Math.min(...ends) - span * 0.06;
  const high = Math.max(...ends) + span * 0.06;
  const pct = (v: number) => `${(((v - low) / (high - low)) * 100).toFixed(2)}%`;
  const width = (a: number, b: number) => `${(((b - a) / (high - low)) * 100).toFixed(2)}%`;
  const outputCheck = (r: (typeof rows)[number]) => r.s.evaluation?.checks.find((c) => c.id === 'output-window') ?? null;

  return (
    <Paper component="section" aria-label="Worst-case window">
      <Stack gap="xs">
        <Group justify="space-between" wrap="wrap">
          <Title order={3} fz="h5">
            Worst-case window over the envelope
          </Title>
          <Text fz="xs" c="dimmed">
            {payload.outputWindow ? (
              <>
                shaded: the spec&apos;s output window <Quantity value={payload.outputWindow.vMin} kind="voltage" /> …{' '}
                <Quantity value={payload.outputWindow.vMax} kind="voltage" /> ·{' '}
              </>
            ) : (
              'the spec sets no output window · '
            )}
            dashed: Zener-voltage window at iRef <Quantity value={payload.specWindow.min} kind="voltage" /> …{' '}
            <Quantity value={payload.specWindow.max} kind="voltage" />
          </Text>
        </Group>
        <Stack gap={6}>
          {rows.map((r) => {
            const check = outputCheck(r);
            return (
              <Group key={r.s.vendorPart.id} gap="sm" wrap="nowrap" data-testid={`window-${r.s.vendorPart.mpn}`}>
                <Text fz="xs" w={120} truncate title={`${r.s.vendorPart.manufacturer} ${r.s.vendorPart.mpn}`}>
                  {r.s.vendorPart.mpn}
                </Text>
                <Box pos="relative" h={22} style={{ flex: 1, borderRadius: 4, background: 'var(--mantine-color-default-hover)' }}>
                  {payload.outputWindow && (
                    <Box
                      pos="absolute"
                      top={0}
                      bottom={0}
                      left={pct(payload.outputWindow.vMin)}
                      w={width(payload.outputWindow.vMin, payload.outputWindow.vMax)}
                      bg="verdigris.1"
                      style={{ opacity: 0.9 }}
                    />
                  )}
                  <Box pos="absolute" top={0} bottom={0} left={pct(payload.specWindow.min)} style={{ borderLeft: '1px dashed var(--mantine-color-red-7)' }} />
                  <Box pos="absolute" top={0} bottom={0} left={pct(payload.specWindow.max)} style={{ borderLeft: '1px dashed var(--mantine-color-red-7)' }} />
                  {r.w ? (
                    <Tooltip
                      label={`${shortQuantity(r.w.vMin, 'voltage')} at ${shortQuantity(r.w.atMin.current, 'current')}, ${formatQuantity(r.w.atMin.taC, 'temperature')} ambient, ${r.w.atMin.corner} part · ${shortQuantity(r.w.vMax, 'voltage')} at ${shortQuantity(r.w.atMax.current, 'current')}, ${formatQuantity(r.w.atMax.taC, 'temperature')} ambient, ${r.w.atMax.corner} part`}
                    >
                      <Box
                        pos="absolute"
                        top={5}
                        h={12}
                        left={pct(r.w.vMin)}
                        w={width(r.w.vMin, r.w.vMax)}
                        style={{ borderRadius: 3, background: getThemeColor(SOURCE_COLORS[r.i % SOURCE_COLORS.length], theme) }}
                      />
                    </Tooltip>
                  ) : (
                    <Text fz="xs" c="dimmed" pos="absolute" left={8} top={3}>
                      {r.s.reason ?? 'no window'}
                    </Text>
                  )}
                </Box>
                <Text fz="xs" w={140} ta="right" style={{ whiteSpace: 'nowrap' }}>
                  {r.w ? (
                    <>
                      <Quantity value={r.w.vMin} kind="voltage" /> … <Quantity value={r.w.vMax} kind="voltage" />
                    </>
                  ) : (
                    '–'
                  )}
                </Text>
                <Box w={78}>{check && <VerdictBadge verdict={check.verdict} size="xs" />}</Box>
              </Group>
            );
          })}
        </Stack>
      </Stack>
    </Paper>
  );
}
