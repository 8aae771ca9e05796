import { useState } from 'react';
import { Alert, Anchor, Badge, Collapse, Group, Paper, Progress, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import { IconAlertTriangle, IconCircleCheck, IconCircleX, IconHelpCircle } from '@tabler/icons-react';
import { formatNumber, formatPercent, formatQuantity, type RegulatorResponse, type RegulatorVerdict, type SearchCard } from '@shuntwise/contracts';
import type { ReactNode } from 'react';
import { DesignCaution } from '@/components/design-caution';
import { Quantity } from '@/components/quantity';
import { describeRange, simpleFinding, simpleOmissions, VERDICT_TITLE, type CircuitRequest } from '../utils/circuit';
import { Notes } from './notes';

export const VERDICT_TEXT: Record<RegulatorVerdict, { title: string; color: string }> = {
  ok: { title: VERDICT_TITLE.ok, color: 'verdigris' },
  'no-solution': { title: VERDICT_TITLE['no-solution'], color: 'red' },
  'no-data': { title: VERDICT_TITLE['no-data'], color: 'gray' },
};
const VERDICT_ICON: Record<RegulatorVerdict, ReactNode> = {
  ok: <IconCircleCheck size={18} />,
  'no-solution': <IconCircleX size={18} />,
  'no-data': <IconHelpCircle size={18} />,
};

export function VerdictBadge({ verdict }: { verdict: RegulatorVerdict }) {
  return (
    <Badge color={VERDICT_TEXT[verdict].color} variant="filled" size="md" data-testid="verdict">
      {VERDICT_TEXT[verdict].title}
    </Badge>
  );
}

/** Small-signal ΔVout/ΔVs as millivolts per volt. */
export function formatLineRegulation(x: number | null): string {
  return x === null ? '–' : `${formatNumber(x * 1000, 3, { trim: true })} mV/V`;
}

function Figure({ label, children, hint }: { label: string; children: ReactNode; hint?: ReactNode }) {
  return (
    <Paper p="xs" role="group" aria-label={label}>
      <Stack gap={2}>
        <Text fz="xs" c="dimmed" tt="uppercase" fw={600} style={{ letterSpacing: 0.4 }}>
          {label}
        </Text>
        <div>{children}</div>
        {hint && (
          <Text fz="xs" c="dimmed">
            {hint}
          </Text>
        )}
      </Stack>
    </Paper>
  );
}

export interface CircuitResultProps {
  result: RegulatorResponse;
  circuit: CircuitRequest;
  card: SearchCard;
  mpn: string;
}

/**
 * The designed regulator for one part: the verdict with its reasons, the resistor range
 * and the standard value chosen inside it, the powers, regulation and output band, beside
 * the simple formula and what it misses; then every corner, the assumptions and the caution.
 */
export function CircuitResult({ result, circuit, card, mpn }: CircuitResultProps) {
  const [showCorners, setShowCorners] = useState(false);
  const finding = simpleFinding(result);
  const corners = result.outputBand?.corners ?? [];
  const share = result.diodePower !== null && result.diodePowerAllowed ? result.diodePower / result.diodePowerAllowed : null;
  const vsNom = result.simple.supply;

  return (
    <Stack gap="sm" aria-label={`Circuit check of ${mpn}`} role="region">
      <Alert
        color={VERDICT_TEXT[result.verdict].color}
        icon={VERDICT_ICON[result.verdict]}
        title={`${mpn}: ${VERDICT_TEXT[result.verdict].title}`}
        data-testid="verdict-alert"
      >
        {result.verdict === 'ok' && result.selected && (
          <Text fz="sm">
            A {formatQuantity(result.selected.resistance, 'resistance')} {result.selected.series} resistor (±{formatPercent(result.selected.tolerance)}) keeps
            the diode above its knee and within its power at all {corners.length} corners of supply, load, ambient and tolerance.
          </Text>
        )}
        {result.reasons.length > 0 && (
          <Notes size="sm" spacing={2}>
            {result.reasons.map((r) => (
              // The title already says no resistor works; the reason says why.
              <Notes.Item key={r}>{r.replace(/^no resistor works: (.)/, (_, c: string) => c.toUpperCase())}</Notes.Item>
            ))}
          </Notes>
        )}
      </Alert>

      <SimpleGrid cols={{ base: 1, md: 2 }} spacing="sm">
        <Paper p="sm" aria-label="Designed for every corner" role="group">
          <Stack gap={6}>
            <Title order={4} fz="sm">
              Designed for every corner
            </Title>
            <Group gap="xs" align="baseline">
              <Text fz={26} fw={600} data-testid="chosen-resistor">
                {result.selected ? formatQuantity(result.selected.resistance, 'resistance') : 'none'}
              </Text>
              {result.selected && (
                <Text fz="sm" c="dimmed">
                  {result.selected.series}, ±{formatPercent(result.selected.tolerance)} (fitted <Quantity value={result.selected.low} kind="resistance" /> …{' '}
                  <Quantity value={result.selected.high} kind="resistance" />)
                </Text>
              )}
            </Group>
            <Text fz="sm">
              Working range:{' '}
              <Text span fw={500} data-testid="resistor-range">
                {describeRange(result.range)}
              </Text>
            </Text>
            <Notes size="xs" c="dimmed" spacing={2}>
              <Notes.Item>
                <Text span fz="xs" fw={500}>
                  Smallest:
                </Text>{' '}
                {result.range.minReason || '–'}
              </Notes.Item>
              <Notes.Item>
                <Text span fz="xs" fw={500}>
                  Largest:
                </Text>{' '}
                {result.range.maxReason}
              </Notes.Item>
            </Notes>
          </Stack>
        </Paper>

        <Paper p="sm" aria-label="The simple formula" role="group" bg="var(--mantine-color-default-hover)">
          <Stack gap={6}>
            <Title order={4} fz="sm">
              The simple formula
            </Title>
            <Text fz="sm" ff="monospace">
              R = (Vs − Vz) / (Iz + IL,max)
            </Text>
            <Text fz="sm" ff="monospace">
              = ({formatQuantity(vsNom, 'voltage')} − {formatQuantity(result.simple.vz, 'voltage')}) / ({formatQuantity(result.simple.diodeCurrent, 'current')}{' '}
              + {formatQuantity(result.simple.loadMax, 'current')})
            </Text>
            <Text fz={22} fw={600} data-testid="simple-resistor">
              {result.simple.resistance !== null ? formatQuantity(result.simple.resistance, 'resistance') : 'no value'}
            </Text>
            <Text fz="sm" c={finding.verdict === 'inside' ? undefined : 'red.7'} data-testid="simple-finding">
              {finding.message}
            </Text>
            <Text fz="xs" c="dimmed">
              It leaves out:
            </Text>
            <Notes size="xs" spacing={1} c="dimmed">
              {simpleOmissions(circuit, card).map((o) => (
                <Notes.Item key={o}>{o}</Notes.Item>
              ))}
            </Notes>
          </Stack>
        </Paper>
      </SimpleGrid>

      <SimpleGrid cols={{ base: 2, md: 3 }} spacing="sm">
        <Figure label="Output band" hint={`over ${corners.length} corners, ${result.selected ? 'chosen' : 'simple'} resistor`}>
          <Text fz="lg" fw={600} data-testid="output-band">
            {result.outputBand ? (
              <>
                <Quantity value={result.outputBand.vMin} kind="voltage" digits={4} /> … <Quantity value={result.outputBand.vMax} kind="voltage" digits={4} />
              </>
            ) : (
              '–'
            )}
          </Text>
        </Figure>
        <Figure
          label="Diode power, worst corner"
          hint={result.diodePowerAllowed !== null ? 'against the rating derated at that ambient' : 'no power rating to derate'}
        >
          <Text fz="lg" fw={600} data-testid="diode-power">
            <Quantity value={result.diodePower} kind="power" /> of <Quantity value={result.diodePowerAllowed} kind="power" />
          </Text>
          {share !== null && (
            <Progress
              value={Math.min(100, share * 100)}
              color={share > 1 ? 'red' : share > 0.8 ? 'orange' : 'verdigris'}
              size="sm"
              mt={4}
              aria-label={`${formatPercent(share)} of the allowance`}
            />
          )}
        </Figure>
        <Figure label="Resistor power, worst corner" hint="rate the resistor with margin above this (about twice is common practice)">
          <Text fz="lg" fw={600} data-testid="resistor-power">
            <Quantity value={result.resistorPower} kind="power" />
          </Text>
        </Figure>
        <Figure
          label="Line regulation"
          hint={
            result.outputResistance !== null
              ? `ΔVout/ΔVs at the nominal point; output resistance ${formatQuantity(result.outputResistance, 'resistance')}`
              : undefined
          }
        >
          <Text fz="lg" fw={600} data-testid="line-regulation">
            {formatLineRegulation(result.lineRegulation)}
          </Text>
        </Figure>
        <Figure
          label="Load regulation"
          hint={`output change from ${formatQuantity(circuit.load.min, 'current')} to ${formatQuantity(circuit.load.max, 'current')} load`}
        >
          <Text fz="lg" fw={600} data-testid="load-regulation">
            <Quantity value={result.loadRegulation} kind="voltage" />
          </Text>
        </Figure>
        <Figure label="Knee limit" hint="the least diode current the design keeps">
          <Text fz="lg" fw={600}>
            <Quantity value={result.range.kneeCurrent} kind="current" />
          </Text>
        </Figure>
      </SimpleGrid>

      {result.warnings.length > 0 && (
        <Alert color="orange" icon={<IconAlertTriangle size={16} />} title="Warnings" py="xs">
          <Notes size="sm" spacing={2}>
            {result.warnings.map((w) => (
              <Notes.Item key={w}>{w}</Notes.Item>
            ))}
          </Notes>
        </Alert>
      )}

      {corners.length > 0 && (
        <Stack gap={4}>
          <Anchor component="button" type="button" fz="sm" onClick={() => setShowCorners((s) => !s)} aria-expanded={showCorners}>
            {showCorners ? 'Hide' : 'Show'} all {corners.length} corners ({corners.filter((c) => c.belowKnee || c.overPower).length} failing)
          </Anchor>
          <Collapse in={showCorners}>
            <Table.ScrollContainer minWidth={720}>
              <Table aria-label="Corners" fz="xs" verticalSpacing={2}>
                <Table.Thead>
                  <Table.Tr>
                    <Table.Th ta="right">Supply</Table.Th>
                    <Table.Th ta="right">Load</Table.Th>
                    <Table.Th ta="right">Ambient</Table.Th>
                    <Table.Th>Diode</Table.Th>
                    <Table.Th ta="right">R fitted</Table.Th>
                    <Table.Th ta="right">Vout</Table.Th>
                    <Table.Th ta="right">Diode current</Table.Th>
                    <Table.Th ta="right">Tj</Table.Th>
                    <Table.Th ta="right">Diode power</Table.Th>
                    <Table.Th>Verdict</Table.Th>
                  </Table.Tr>
                </Table.Thead>
                <Table.Tbody>
                  {corners.map((c, i) => (
                    <Table.Tr key={i} c={c.belowKnee || c.overPower ? 'red.7' : undefined}>
                      <Table.Td ta="right">
                        <Quantity value={c.supply} kind="voltage" />
                      </Table.Td>
                      <Table.Td ta="right">
                        <Quantity value={c.load} kind="current" />
                      </Table.Td>
                      <Table.Td ta="right">{formatQuantity(c.ambientC, 'temperature', { trim: true })}</Table.Td>
                      <Table.Td>{c.corner} VZ</Table.Td>
                      <Table.Td ta="right">
                        <Quantity value={c.resistance} kind="resistance" />
                      </Table.Td>
                      <Table.Td ta="right">
                        <Quantity value={c.vOut} kind="voltage" digits={4} />
                      </Table.Td>
                      <Table.Td ta="right">
                        <Quantity value={c.diodeCurrent} kind="current" />
                      </Table.Td>
                      <Table.Td ta="right">{c.tjC === null ? 'runaway' : <Quantity value={c.tjC} kind="temperature" />}</Table.Td>
                      <Table.Td ta="right">
                        <Quantity value={c.diodePower} kind="power" />
                      </Table.Td>
                      <Table.Td>{c.belowKnee ? 'below knee' : c.overPower ? 'over power' : 'ok'}</Table.Td>
                    </Table.Tr>
                  ))}
                </Table.Tbody>
              </Table>
            </Table.ScrollContainer>
          </Collapse>
        </Stack>
      )}

      <Stack gap={2}>
        <Text fz="xs" fw={600} c="dimmed">
          Assumed
        </Text>
        <Notes size="xs" c="dimmed" spacing={1} aria-label="Assumptions">
          {result.assumptions.map((a) => (
            <Notes.Item key={a}>{a}</Notes.Item>
          ))}
        </Notes>
      </Stack>
      <DesignCaution />
    </Stack>
  );
}
