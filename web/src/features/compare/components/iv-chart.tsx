import { useMemo, useState } from 'react';
import { Box, Checkbox, Chip, ColorSwatch, Group, Paper, Stack, Switch, Text, Title, getThemeColor, useMantineTheme } from '@mantine/core';
import { formatQuantity, type ComparePayload } from '@shuntwise/contracts';
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceDot, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis, type TooltipProps } from 'recharts';
import { curveRows, dashFor, logTicks, niceTicks, seriesKey, shortQuantity, SOURCE_COLORS, type Corner } from '../utils/series';

function CurveTooltip({ active, payload, label, names }: TooltipProps<number, string> & { names: Record<string, string> }) {
  if (!active || !payload?.length) return null;
  return (
    <Paper p={6} shadow="sm" fz="xs">
      <Text fz="xs" fw={500}>
        at {formatQuantity(Number(label), 'current')}
      </Text>
      {payload
        .filter((p) => String(p.dataKey).endsWith('vzNom'))
        .map((p) => (
          <Group key={String(p.dataKey)} gap={4} wrap="nowrap">
            <ColorSwatch color={String(p.color)} size={8} />
            <Text fz="xs">
              {names[String(p.dataKey)]}: {formatQuantity(p.value as number, 'voltage', { digits: 4 })}
            </Text>
          </Group>
        ))}
    </Paper>
  );
}

/**
 * The breakdown curves of every source from its fitted model, current on a log axis: the
 * nominal part at 25 °C and at the envelope's ambient ends (with self-heating), optionally
 * the tolerance ends; the spec's window at iRef and the operating current range behind them.
 */
export function IvChart({ payload }: { payload: ComparePayload }) {
  const theme = useMantineTheme();
  const drawable = payload.sources.map((s, i) => ({ source: s, index: i })).filter((x) => x.source.curves.length > 0);
  const [hidden, setHidden] = useState<ReadonlySet<number>>(new Set());
  const [temps, setTemps] = useState<string[]>(payload.temperaturesC.map(String));
  const [tolerance, setTolerance] = useState(false);
  const rows = useMemo(() => curveRows(payload), [payload]);

  const corners: Corner[] = tolerance ? ['vzMin', 'vzNom', 'vzMax'] : ['vzNom'];
  const lines = drawable
    .filter((d) => !hidden.has(d.index))
    .flatMap((d) =>
      payload.temperaturesC
        .map((tempC, t) => ({ tempC, t }))
        .filter(({ tempC }) => temps.includes(String(tempC)))
        .flatMap(({ tempC, t }) =>
          corners.map((corner) => ({
            key: seriesKey(d.index, t, corner),
            name: `${d.source.vendorPart.mpn} ${formatQuantity(tempC, 'temperature', { trim: true })}${corner === 'vzNom' ? '' : corner === 'vzMin' ? ' (low end)' : ' (high end)'}`,
            color: getThemeColor(SOURCE_COLORS[d.index % SOURCE_COLORS.length], theme),
            dash: dashFor(tempC),
            width: corner === 'vzNom' ? 2 : 1,
            opacity: corner === 'vzNom' ? 1 : 0.55,
          })),
        ),
    );
  const names = Object.fromEntries(lines.map((l) => [l.key, l.name]));

  const iLow = payload.currents[0];
  const iHigh = payload.currents[payload.currents.length - 1];
  // The voltage axis spans what is drawn and the spec's windows, a little padded.
  const values = lines.flatMap((l) => rows.map((r) => r[l.key]).filter((v): v is number => typeof v === 'number'));
  values.push(payload.specWindow.min, payload.specWindow.max);
  if (payload.outputWindow) values.push(payload.outputWindow.vMin, payload.outputWindow.vMax);
  const voltageAxis = niceTicks(Math.min(...values), Math.max(...values), 7);
  const { iMin, iMax } = payload.envelope;
  const iRef = payload.specWindow.current;

  return (
    <Paper component="section" aria-label="Breakdown curves">
      <Stack gap="xs">
        <Group justify="space-between" align="flex-end" wrap="wrap">
          <Title order={3} fz="h5">
            Breakdown curves
          </Title>
          <Group gap="md" wrap="wrap">
            <Chip.Group multiple value={temps} onChange={(v) => v.length > 0 && setTemps(v)}>
              <Group gap={4}>
                {payload.temperaturesC.map((t) => (
                  <Chip key={t} value={String(t)} size="xs">
                    {formatQuantity(t, 'temperature', { digits: 3 }).replace(/\.0+ /, ' ')}
                  </Chip>
                ))}
              </Group>
            </Chip.Group>
            <Switch size="xs" label="Tolerance ends" checked={tolerance} onChange={(e) => setTolerance(e.currentTarget.checked)} />
          </Group>
        </Group>
        <Group gap="md" wrap="wrap">
          {drawable.map((d) => (
            <Checkbox
              key={d.index}
              size="xs"
              checked={!hidden.has(d.index)}
              onChange={() =>
                setHidden((prev) => {
                  const next = new Set(prev);
                  if (next.has(d.index)) next.delete(d.index);
                  else next.add(d.index);
                  return next;
                })
              }
              label={
                <Group gap={4} wrap="nowrap">
                  <ColorSwatch color={getThemeColor(SOURCE_COLORS[d.index % SOURCE_COLORS.length], theme)} size={10} />
                  <Text fz="xs">
                    {d.source.vendorPart.mpn} ({d.source.role})
                  </Text>
                </Group>
              }
            />
          ))}
          <Text fz="xs" c="dimmed">
            solid 25 °C · dashed colder · dotted hotter · shaded: operating currents · bar: spec window at iRef
          </Text>
        </Group>
        {drawable.length === 0 ? (
          <Text fz="sm" c="dimmed">
            No source has a card that can be drawn yet.
          </Text>
        ) : (
          <Box h={380} data-testid="iv-chart">
            <ResponsiveContainer width="100%" height="100%">
              <LineChart data={rows} margin={{ top: 20, right: 16, bottom: 20, left: 8 }}>
                <CartesianGrid strokeDasharray="3 3" stroke="var(--mantine-color-default-border)" />
                <XAxis
                  dataKey="current"
                  type="number"
                  scale="log"
                  domain={[iLow, iHigh]}
                  ticks={logTicks(iLow, iHigh)}
                  tickFormatter={(v: number) => shortQuantity(v, 'current')}
                  allowDataOverflow
                  fontSize={11}
                  label={{ value: 'diode current (log)', position: 'insideBottom', offset: -12, fontSize: 11 }}
                />
                <YAxis
                  type="number"
                  domain={voltageAxis.domain}
                  ticks={voltageAxis.ticks}
                  tickFormatter={(v: number) => shortQuantity(v, 'voltage')}
                  allowDataOverflow
                  fontSize={11}
                  width={64}
                />
                <ReferenceArea x1={iMin} x2={iMax} fill="var(--mantine-color-gray-5)" fillOpacity={0.12} ifOverflow="hidden" />
                <ReferenceArea x1={iRef / 1.06} x2={iRef * 1.06} y1={payload.specWindow.min} y2={payload.specWindow.max} fill="var(--mantine-color-red-5)" fillOpacity={0.25} stroke="var(--mantine-color-red-7)" />
                <ReferenceDot x={iRef} y={payload.specWindow.nom} r={3} fill="var(--mantine-color-red-7)" stroke="none" />
                <ReferenceLine x={iRef} stroke="var(--mantine-color-red-7)" strokeDasharray="2 4" label={{ value: 'iRef', position: 'top', fontSize: 10 }} />
                {payload.outputWindow && (
                  <>
                    <ReferenceLine segment={[{ x: iMin, y: payload.outputWindow.vMin }, { x: iMax, y: payload.outputWindow.vMin }]} stroke="var(--mantine-color-red-7)" strokeDasharray="6 3" />
                    <ReferenceLine segment={[{ x: iMin, y: payload.outputWindow.vMax }, { x: iMax, y: payload.outputWindow.vMax }]} stroke="var(--mantine-color-red-7)" strokeDasharray="6 3" />
                  </>
                )}
                <Tooltip content={<CurveTooltip names={names} />} />
                {lines.map((l) => (
                  <Line
                    key={l.key}
                    dataKey={l.key}
                    name={l.name}
                    stroke={l.color}
                    strokeDasharray={l.dash}
                    strokeWidth={l.width}
                    strokeOpacity={l.opacity}
                    dot={false}
                    activeDot={false}
                    isAnimationActive={false}
                    connectNulls={false}
                  />
                ))}
              </LineChart>
            </ResponsiveContainer>
          </Box>
        )}
      </Stack>
    </Paper>
  );
}
