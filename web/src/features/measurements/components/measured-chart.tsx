import { useMemo } from 'react';
import { Group, Paper, Text, getThemeColor, useMantineTheme } from '@mantine/core';
import { formatQuantity, type MeasurementSet } from '@shuntwise/contracts';
import { Area, CartesianGrid, ComposedChart, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis, type TooltipProps } from 'recharts';
import { logTicks, niceTicks, shortQuantity } from '@/lib/chart-axes';

const SAMPLE_COLORS = ['blue.6', 'grape.6', 'cyan.7', 'pink.6', 'lime.7', 'indigo.5', 'orange.6', 'teal.6'] as const;

function PointTooltip({ active, payload }: TooltipProps<number, string>) {
  const point = payload?.find((p) => p.payload && 'sample' in p.payload)?.payload as { sample: string; current: number; voltage: number } | undefined;
  if (!active || !point) return null;
  return (
    <Paper p={6} shadow="sm" fz="xs">
      <Text fz="xs">
        {point.sample}: {formatQuantity(point.voltage, 'voltage', { digits: 4 })} at {formatQuantity(point.current, 'current')}
      </Text>
    </Paper>
  );
}

/**
 * Every measured point at 25 °C (one colour per sample) over the datasheet's band: the card's
 * fitted curve at its low and high tolerance ends, shaded, with the nominal part dashed. Current
 * on a log axis, as the band is drawn on the Compare screen.
 */
export function MeasuredChart({ set }: { set: MeasurementSet }) {
  const theme = useMantineTheme();
  const band = set.analysis.datasheetBand.map((b) => ({ current: b.current, range: [b.low, b.high] as [number, number], nom: b.nom }));
  const samples = useMemo(
    () =>
      set.samples.map((s, i) => ({
        name: s.sampleId + (s.lot ? ` (${s.lot})` : ''),
        color: getThemeColor(SAMPLE_COLORS[i % SAMPLE_COLORS.length], theme),
        points: s.points.filter((p) => Math.abs(p.tempC - 25) <= 2).map((p) => ({ sample: s.sampleId, current: p.current, voltage: p.voltage })),
      })),
    [set.samples, theme],
  );
  const currents = [...samples.flatMap((s) => s.points.map((p) => p.current)), ...band.map((b) => b.current)];
  const voltages = [...samples.flatMap((s) => s.points.map((p) => p.voltage)), ...band.flatMap((b) => b.range)];
  if (currents.length === 0)
    return (
      <Text fz="sm" c="dimmed">
        No points at 25 °C to draw.
      </Text>
    );
  const iLow = Math.min(...currents);
  const iHigh = Math.max(...currents);
  const axis = niceTicks(Math.min(...voltages), Math.max(...voltages), 6);
  const bandColor = getThemeColor('copper.4', theme);

  return (
    <div role="img" aria-label={`Measured points of ${samples.length} sample(s) at 25 °C over the datasheet's tolerance band`}>
      <Group gap="md" mb={4} wrap="wrap">
        <Text fz="xs" c="dimmed">
          shaded: datasheet band (tolerance ends) · dashed: nominal part · dots: measured at 25 °C
        </Text>
      </Group>
      {/* The drawing itself is hidden from assistive technology: the figure's label above names it, and recharts marks each dot as an unnamed image. */}
      <div aria-hidden="true">
        <ResponsiveContainer width="100%" height={280}>
          <ComposedChart margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" />
            <XAxis
              dataKey="current"
              type="number"
              scale="log"
              domain={[iLow, iHigh]}
              ticks={logTicks(iLow, iHigh)}
              tickFormatter={(v: number) => shortQuantity(v, 'current')}
              allowDuplicatedCategory={false}
              label={{ value: 'reverse current', position: 'insideBottom', offset: -8, fontSize: 11 }}
              fontSize={11}
            />
            <YAxis type="number" domain={axis.domain} ticks={axis.ticks} tickFormatter={(v: number) => shortQuantity(v, 'voltage')} width={64} fontSize={11} />
            <Tooltip content={<PointTooltip />} />
            {band.length > 0 && (
              <Area data={band} dataKey="range" stroke={bandColor} fill={bandColor} fillOpacity={0.25} isAnimationActive={false} name="datasheet band" />
            )}
            {band.length > 0 && (
              <Line data={band} dataKey="nom" stroke={bandColor} strokeDasharray="6 4" dot={false} isAnimationActive={false} name="nominal" />
            )}
            {samples.map((s) => (
              <Scatter key={s.name} name={s.name} data={s.points} dataKey="voltage" fill={s.color} isAnimationActive={false} />
            ))}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <Group gap="sm" wrap="wrap">
        {samples.map((s) => (
          <Group key={s.name} gap={4} wrap="nowrap">
            <span style={{ width: 8, height: 8, borderRadius: 4, background: s.color, display: 'inline-block' }} />
            <Text fz="xs">{s.name}</Text>
          </Group>
        ))}
      </Group>
    </div>
  );
}
