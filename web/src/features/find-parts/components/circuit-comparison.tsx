import { Table, Text } from '@mantine/core';
import { formatPercent, formatQuantity, type RegulatorResponse, type SearchItem } from '@shuntwise/contracts';
import type { ReactNode } from 'react';
import { Quantity } from '@/components/quantity';
import { describeRange, simpleFinding } from '../utils/circuit';
import { formatLineRegulation, VerdictBadge } from './circuit-result';

export interface ComparedPart {
  item: SearchItem;
  result: RegulatorResponse | undefined;
  error: string | null;
}

const SIMPLE_LABEL = {
  inside: 'inside the range',
  'too-high': 'too high: below the knee',
  'too-low': 'too low: over power',
  'no-range': 'no range',
  none: '–',
} as const;

/** Two or three parts in the same circuit, figure by figure. */
export function CircuitComparison({ parts }: { parts: ComparedPart[] }) {
  const row = (label: string, cell: (p: ComparedPart & { result: RegulatorResponse }) => ReactNode) => (
    <Table.Tr>
      <Table.Th fz="xs" c="dimmed" w={190} scope="row">
        {label}
      </Table.Th>
      {parts.map((p) => (
        <Table.Td key={p.item.vendorPart.id} fz="sm">
          {p.result ? (
            cell(p as ComparedPart & { result: RegulatorResponse })
          ) : (
            <Text fz="xs" c={p.error ? 'red' : 'dimmed'}>
              {p.error ?? 'checking…'}
            </Text>
          )}
        </Table.Td>
      ))}
    </Table.Tr>
  );
  return (
    <Table.ScrollContainer minWidth={560}>
      <Table aria-label="Comparison" withColumnBorders verticalSpacing={4}>
        <Table.Thead>
          <Table.Tr>
            <Table.Th />
            {parts.map((p) => (
              <Table.Th key={p.item.vendorPart.id}>
                <Text fz="sm" fw={600}>
                  {p.item.vendorPart.mpn}
                </Text>
                <Text fz="xs" c="dimmed" fw={400}>
                  {p.item.vendorPart.manufacturer} · {p.item.vendorPart.package ?? 'no package'}
                </Text>
              </Table.Th>
            ))}
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {row('Verdict', (p) => (
            <VerdictBadge verdict={p.result.verdict} />
          ))}
          {row('Chosen resistor', (p) =>
            p.result.selected
              ? `${formatQuantity(p.result.selected.resistance, 'resistance')} ${p.result.selected.series} ±${formatPercent(p.result.selected.tolerance)}`
              : 'none',
          )}
          {row('Working range', (p) => describeRange(p.result.range))}
          {row('Output band', (p) =>
            p.result.outputBand ? (
              <>
                <Quantity value={p.result.outputBand.vMin} kind="voltage" digits={4} /> …{' '}
                <Quantity value={p.result.outputBand.vMax} kind="voltage" digits={4} />
              </>
            ) : (
              '–'
            ),
          )}
          {row('Diode power / allowed', (p) => (
            <>
              <Quantity value={p.result.diodePower} kind="power" /> / <Quantity value={p.result.diodePowerAllowed} kind="power" />
            </>
          ))}
          {row('Resistor power', (p) => (
            <Quantity value={p.result.resistorPower} kind="power" />
          ))}
          {row('Line regulation', (p) => formatLineRegulation(p.result.lineRegulation))}
          {row('Load regulation', (p) => (
            <Quantity value={p.result.loadRegulation} kind="voltage" />
          ))}
          {row(
            'Simple formula',
            (p) =>
              `${p.result.simple.resistance !== null ? formatQuantity(p.result.simple.resistance, 'resistance') : '–'} (${SIMPLE_LABEL[simpleFinding(p.result).verdict]})`,
          )}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
