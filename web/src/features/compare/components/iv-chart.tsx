import { useMemo, useState } from 'react';
import { Box, Checkbox, Chip, ColorSwatch, Group, Paper, SegmentedControl, Stack, Switch, Text, Title, getThemeColor, useMantineTheme } from '@mantine/core';
import { formatQuantity, type ComparePayload } from '@shuntwise/contracts';
import {
  Area,
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceArea,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
  type TooltipProps,
} from 'recharts';
import { bandKey, curveRows, dashFor, logTicks, niceTicks, seriesKey, shortQuantity, SOURCE_COLORS } from '../utils/series';

/** The two ways the curves are drawn: current on a log axis (x), or the diode's I–V as usually drawn, voltage on x and current linear on y. */
export type CurrentScale = 'log' | 'linear';

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
 * The breakdown curves of every source from its fitted model: the nominal part at 25 °C and
 * at the envelope's ambient ends (with self-heating), optionally each tolerance band as a
 * shaded area; the spec's window at iRef and the operating current range behind them. Two
 * views of the same points: current on a log axis, or the I–V as drawn on paper (voltage on
 * x, current linear in mA on y) where the knee shows.
 */
export function IvChart({ payload }: { payload: ComparePayload }) {
  const theme = useMantineTheme();
  const drawable = payload.sources.map((s, i) => ({ source: s, index: i })).filter((x) => x.source.curves.length > 0);
  const [hidden, setHidden] = useState<ReadonlySet<number>>(new Set());
  const [temps, setTemps] = useState<string[]>(payload.temperaturesC.map(String));
  const [tolerance, setTolerance] = useState(false);
  const [scale, setScale] = useState<CurrentScale>('log');
  const rows = useMemo(() => curveRows(payload), [payload]);

  const shown = drawable
    .filter((d) => !hidden.has(d.index))
    .flatMap((d) =>
      payload.temperaturesC
        .map((tempC, t) => ({ tempC, t }))
        .filter(({ tempC }) => temps.includes(String(tempC)))
        .map(({ tempC, t }) => ({ d, tempC, t, color: getThemeColor(SOURCE_COLORS[d.index % SOURCE_COLORS.length], theme) })),
    );
  // One line per source and ambient (the nominal part); the tolerance ends as one shaded band each, not two more lines.
  const lines = shown.map(({ d, tempC, t, color }) => ({
    key: seriesKey(d.index, t, 'vzNom'),
    name: `${d.source.vendorPart.mpn} ${formatQuantity(tempC, 'temperature', { trim: true })}`,
    color,
    dash: dashFor(tempC),
  }));
  const bands = tolerance
    ? shown.map(({ d, tempC, t, color }) => ({
        key: bandKey(d.index, t),
        name: `${d.source.vendorPart.mpn} ${formatQuantity(tempC, 'temperature', { trim: true })} tolerance band`,
        color,
      }))
    : [];
  const names = Object.fromEntries(lines.map((l) => [l.key, l.name]));

  const iLow = payload.currents[0];
  const iHigh = payload.currents[payload.currents.length - 1];
  // The voltage axis spans what is drawn and the spec's windows, a little padded.
  const values = [...lines, ...bands].flatMap((l) => rows.flatMap((r) => r[l.key] ?? []).filter((v): v is number => typeof v === 'number'));
  values.push(payload.specWindow.min, payload.specWindow.max);
  if (payload.outputWindow) values.push(payload.outputWindow.vMin, payload.outputWindow.vMax);
  const voltageAxis = niceTicks(Math.min(...values), Math.max(...values), 7);
  const linearCurrent = niceTicks(0, iHigh, 7);
  const { iMin, iMax } = payload.envelope;
  const iRef = payload.specWindow.current;
  const linear = scale === 'linear';

  const currentAxisProps = {
    dataKey: 'current',
    type: 'number' as const,
    // 'auto', not 'linear': recharts draws no line on a current axis set to 'linear' in the vertical layout.
    scale: linear ? ('auto' as const) : ('log' as const),
    domain: linear ? linearCurrent.domain : [iLow, iHigh],
    ticks: linear ? linearCurrent.ticks : logTicks(iLow, iHigh),
    tickFormatter: (v: number) => (v === 0 ? '0' : shortQuantity(v, 'current')),
    allowDataOverflow: true,
    fontSize: 11,
  };
  const voltageAxisProps = {
    type: 'number' as const,
    domain: voltageAxis.domain,
    ticks: voltageAxis.ticks,
    tickFormatter: (v: number) => shortQuantity(v, 'voltage'),
    allowDataOverflow: true,
    fontSize: 11,
  };
  // In the linear view the current is the vertical axis (reversed: recharts runs a vertical layout's axis top-down): x and y of every marker swap.
  const at = (current: number, voltage: number) => (linear ? { x: voltage, y: current } : { x: current, y: voltage });

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
            <Switch size="xs" label="Tolerance bands" checked={tolerance} onChange={(e) => setTolerance(e.currentTarget.checked)} />
            <SegmentedControl
              size="xs"
              aria-label="Current axis"
              value={scale}
              onChange={(v) => setScale(v as CurrentScale)}
              data={[
                { value: 'log', label: 'Log current' },
                { value: 'linear', label: 'Linear I–V (mA)' },
              ]}
            />
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
            solid 25 °C · dashed colder · dotted hotter · {tolerance ? 'coloured shading: tolerance band · ' : ''}grey shading: operating currents · bar: spec
            window at iRef
          </Text>
        </Group>
        {drawable.length === 0 ? (
          <Text fz="sm" c="dimmed">
            No source has a card that can be drawn yet.
          </Text>
        ) : (
          <Box h={380} data-testid="iv-chart" data-scale={scale}>
            <ResponsiveContainer width="100%" height="100%">
              <ComposedChart key={scale} data={rows} layout={linear ? 'vertical' : 'horizontal'} margin={{ top: 20, right: 16, bottom: 20, left: 8 }}>
                <CartesianGrid strokeDasharray="3 3" stroke="var(--mantine-color-default-border)" />
                <XAxis
                  {...(linear ? voltageAxisProps : currentAxisProps)}
                  label={{ value: linear ? 'diode voltage' : 'diode current (log)', position: 'insideBottom', offset: -12, fontSize: 11 }}
                />
                <YAxis
                  {...(linear ? currentAxisProps : voltageAxisProps)}
                  reversed={linear}
                  width={64}
                  label={linear ? { value: 'current (linear)', angle: -90, position: 'insideLeft', offset: 4, fontSize: 11 } : undefined}
                />
                <ReferenceArea
                  {...(linear ? { y1: iMin, y2: iMax } : { x1: iMin, x2: iMax })}
                  fill="var(--mantine-color-gray-5)"
                  fillOpacity={0.12}
                  ifOverflow="hidden"
                />
                <ReferenceArea
                  {...(linear
                    ? {
                        y1: iRef - linearCurrent.domain[1] * 0.01,
                        y2: iRef + linearCurrent.domain[1] * 0.01,
                        x1: payload.specWindow.min,
                        x2: payload.specWindow.max,
                      }
                    : { x1: iRef / 1.06, x2: iRef * 1.06, y1: payload.specWindow.min, y2: payload.specWindow.max })}
                  fill="var(--mantine-color-red-5)"
                  fillOpacity={0.25}
                  stroke="var(--mantine-color-red-7)"
                />
                <ReferenceLine
                  {...(linear ? { y: iRef } : { x: iRef })}
                  stroke="var(--mantine-color-red-7)"
                  strokeDasharray="2 4"
                  label={{ value: 'iRef', position: linear ? 'insideTopLeft' : 'top', fontSize: 10 }}
                />
                <ReferenceDot {...at(iRef, payload.specWindow.nom)} r={3} fill="var(--mantine-color-red-7)" stroke="none" />
                {/* An array, not a fragment: recharts 2 does not look inside fragments for its children. */}
                {payload.outputWindow &&
                  [payload.outputWindow.vMin, payload.outputWindow.vMax].map((v) => (
                    <ReferenceLine key={v} segment={[at(iMin, v), at(iMax, v)]} stroke="var(--mantine-color-red-7)" strokeDasharray="6 3" />
                  ))}
                <Tooltip content={<CurveTooltip names={names} />} />
                {bands.map((b) => (
                  <Area
                    key={b.key}
                    dataKey={b.key}
                    name={b.name}
                    type="linear"
                    fill={b.color}
                    fillOpacity={0.18}
                    stroke="none"
                    dot={false}
                    activeDot={false}
                    isAnimationActive={false}
                    connectNulls={false}
                  />
                ))}
                {lines.map((l) => (
                  <Line
                    key={l.key}
                    dataKey={l.key}
                    name={l.name}
                    type="linear"
                    stroke={l.color}
                    strokeDasharray={l.dash}
                    strokeWidth={2}
                    dot={false}
                    activeDot={false}
                    isAnimationActive={false}
                    connectNulls={false}
                  />
                ))}
              </ComposedChart>
            </ResponsiveContainer>
          </Box>
        )}
      </Stack>
    </Paper>
  );
}
