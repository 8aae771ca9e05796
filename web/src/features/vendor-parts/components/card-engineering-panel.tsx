import { ActionIcon, Alert, Badge, Code, CopyButton, Group, List, Loader, Paper, Select, Stack, Table, Text, Title, Tooltip } from '@mantine/core';
import { IconCheck, IconCopy } from '@tabler/icons-react';
import { formatNumber, type Mechanism, type ModelBasis, type NormalizeResponse } from '@shuntwise/contracts';
import { DesignCaution } from '@/components/design-caution';
import { Quantity } from '@/components/quantity';
import { describeError } from '@/lib/api-client';

// Mantine's list items do not wrap (white-space: nowrap); these are sentences.
const WRAPPING_LIST = { item: { whiteSpace: 'normal' as const }, itemWrapper: { display: 'inline' } };

export const MECHANISM_LABEL: Record<Mechanism, string> = {
  tunnelling: 'Tunnelling (below about 5 V)',
  mixed: 'Mixed tunnelling and avalanche (5–6 V)',
  avalanche: 'Avalanche (above about 6 V)',
};

const MECHANISM_COLOR: Record<Mechanism, string> = { tunnelling: 'indigo', mixed: 'grape', avalanche: 'copper' };

const BASIS_LABEL: Record<ModelBasis, string> = {
  'two-point': 'fitted through (IZT, ZZT) and (IZK, ZZK)',
  'izt-only': 'one impedance point (IZT, ZZT): stated assumption for the rest',
  'izk-only': 'one impedance point (IZK, ZZK): stated assumption for the rest',
  clamped: 'fit clamped: the two points gave a non-physical RS',
  none: 'no impedance on the card: voltage only',
  measured: 'fitted by least squares to measured samples',
};

export interface BasisOption {
  value: string;
  label: string;
}

export interface CardEngineeringPanelProps {
  result: NormalizeResponse | undefined;
  /** Why nothing can be computed yet (missing or unreadable fields). */
  waitingFor: string | null;
  loading: boolean;
  error: unknown;
  basisLabel: string;
  basisOptions: BasisOption[];
  basisValue: string;
  onBasisChange: (value: string) => void;
}

/** The .model line with a copy button. */
export function SpiceModelLine({ line }: { line: string }) {
  return (
    <Group gap={6} wrap="nowrap" align="flex-start">
      <Code block style={{ flex: 1, whiteSpace: 'pre-wrap', wordBreak: 'break-all' }} fz="xs" data-testid="spice-model">
        {line}
      </Code>
      <CopyButton value={line} timeout={1500}>
        {({ copied, copy }) => (
          <Tooltip label={copied ? 'Copied' : 'Copy the .model line'} withArrow>
            <ActionIcon variant="subtle" color={copied ? 'verdigris' : 'gray'} onClick={copy} aria-label="Copy the .model line">
              {copied ? <IconCheck size={16} /> : <IconCopy size={16} />}
            </ActionIcon>
          </Tooltip>
        )}
      </CopyButton>
    </Group>
  );
}

/**
 * What the engineering core makes of the card as it stands in the editor: the fitted
 * breakdown model, the mechanism, values at the chosen currents and ambients, warnings,
 * and the SPICE line. Recomputed as the engineer types.
 */
export function CardEngineeringPanel({ result, waitingFor, loading, error, basisLabel, basisOptions, basisValue, onBasisChange }: CardEngineeringPanelProps) {
  return (
    <Paper aria-labelledby="engineering-title">
      <Stack gap="sm">
        <Group justify="space-between" wrap="nowrap">
          <Group gap="xs">
            <Title order={3} fz="h5" id="engineering-title">
              Engineering reading
            </Title>
            {loading && <Loader size="xs" aria-label="Computing" />}
          </Group>
          {basisOptions.length > 1 && (
            <Select
              size="xs"
              w={230}
              aria-label="Normalise at"
              data={basisOptions}
              value={basisValue}
              allowDeselect={false}
              onChange={(v) => v && onBasisChange(v)}
            />
          )}
        </Group>
        {waitingFor && !result && (
          <Text fz="sm" c="dimmed">
            {waitingFor}
          </Text>
        )}
        {error != null && (
          <Alert color="red" role="alert" title="The engineering core refused the card">
            {describeError(error)}
          </Alert>
        )}
        {result && (
          <Stack gap="sm" style={{ opacity: waitingFor ? 0.55 : 1 }} aria-live="polite">
            {waitingFor && (
              <Text fz="xs" c="dimmed">
                Showing the last card that could be read. {waitingFor}
              </Text>
            )}
            <Group gap="xs">
              <Badge color={MECHANISM_COLOR[result.mechanism]} size="md" data-testid="mechanism">
                {MECHANISM_LABEL[result.mechanism]}
              </Badge>
              <Text fz="xs" c="dimmed">
                Model {BASIS_LABEL[result.model.basis]}
              </Text>
            </Group>
            <Table aria-label="Breakdown model" withTableBorder={false} fz="sm">
              <Table.Tbody>
                <Table.Tr>
                  <Table.Th w={90}>BV</Table.Th>
                  <Table.Td>
                    <Quantity value={result.model.bv} kind="voltage" digits={4} />
                  </Table.Td>
                  <Table.Th w={90}>IBV</Table.Th>
                  <Table.Td>
                    <Quantity value={result.model.ibv} kind="current" />
                  </Table.Td>
                </Table.Tr>
                <Table.Tr>
                  <Table.Th>NBV</Table.Th>
                  <Table.Td style={{ fontVariantNumeric: 'tabular-nums' }}>{formatNumber(result.model.nbv)}</Table.Td>
                  <Table.Th>RS</Table.Th>
                  <Table.Td>
                    <Quantity value={result.model.rs} kind="resistance" />
                  </Table.Td>
                </Table.Tr>
                <Table.Tr>
                  <Table.Th>NBV·Vt</Table.Th>
                  <Table.Td>
                    <Quantity value={result.model.nbvVt} kind="voltage" />
                  </Table.Td>
                  <Table.Th>αVZ</Table.Th>
                  <Table.Td>
                    <Quantity value={result.model.alphaVz} kind="tempCoVoltage" />
                  </Table.Td>
                </Table.Tr>
              </Table.Tbody>
            </Table>

            <Stack gap={4}>
              <Text fz="sm" fw={500}>
                Normalised values {basisLabel}
              </Text>
              <Table.ScrollContainer minWidth={460}>
                <Table aria-label="Normalised values" data-testid="normalised-values">
                  <Table.Thead>
                    <Table.Tr>
                      <Table.Th>I</Table.Th>
                      <Table.Th>Ta</Table.Th>
                      <Table.Th>Tj</Table.Th>
                      <Table.Th>VZ min</Table.Th>
                      <Table.Th>VZ nom</Table.Th>
                      <Table.Th>VZ max</Table.Th>
                      <Table.Th>Zd</Table.Th>
                    </Table.Tr>
                  </Table.Thead>
                  <Table.Tbody>
                    {result.points.map((p) => (
                      <Table.Tr key={`${p.current}-${p.tempC}`}>
                        <Table.Td>
                          <Quantity value={p.current} kind="current" />
                        </Table.Td>
                        <Table.Td>
                          <Quantity value={p.tempC} kind="temperature" />
                        </Table.Td>
                        <Table.Td>
                          <Quantity value={p.tjC} kind="temperature" />
                        </Table.Td>
                        <Table.Td>
                          <Quantity value={p.vzMin} kind="voltage" digits={4} />
                        </Table.Td>
                        <Table.Td>
                          <Quantity value={p.vzNom} kind="voltage" digits={4} />
                        </Table.Td>
                        <Table.Td>
                          <Quantity value={p.vzMax} kind="voltage" digits={4} />
                        </Table.Td>
                        <Table.Td>
                          <Quantity value={p.zd} kind="resistance" />
                        </Table.Td>
                      </Table.Tr>
                    ))}
                  </Table.Tbody>
                </Table>
              </Table.ScrollContainer>
            </Stack>

            {(result.warnings.length > 0 || result.issues.some((i) => i.severity === 'warning')) && (
              <Alert color="yellow" title="Warnings" p="xs">
                <List size="sm" spacing={2} styles={WRAPPING_LIST}>
                  {result.warnings.map((w) => (
                    <List.Item key={w}>{w}</List.Item>
                  ))}
                  {result.issues
                    .filter((i) => i.severity === 'warning')
                    .map((i) => (
                      <List.Item key={`${i.field}-${i.message}`}>
                        {i.field}: {i.message}
                      </List.Item>
                    ))}
                </List>
              </Alert>
            )}
            {result.assumptions.length + result.model.assumptions.length > 0 && (
              <details>
                <summary>
                  <Text span fz="xs" c="dimmed">
                    Assumptions ({result.assumptions.length + result.model.assumptions.length})
                  </Text>
                </summary>
                <List size="xs" c="dimmed" spacing={2} mt={4} styles={WRAPPING_LIST}>
                  {[...result.model.assumptions, ...result.assumptions].map((a) => (
                    <List.Item key={a}>{a}</List.Item>
                  ))}
                </List>
              </details>
            )}
            <Stack gap={4}>
              <Text fz="sm" fw={500}>
                SPICE model
              </Text>
              <SpiceModelLine line={result.spiceModel} />
            </Stack>
            <DesignCaution p="xs" />
          </Stack>
        )}
      </Stack>
    </Paper>
  );
}
