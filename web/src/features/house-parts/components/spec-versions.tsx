import { useState, type ReactNode } from 'react';
import { Alert, Anchor, Button, Group, Loader, Modal, Paper, Stack, Table, Text, Title } from '@mantine/core';
import { formatPercent, type Spec } from '@shuntwise/contracts';
import { Quantity } from '@/components/quantity';
import { describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useSpecVersion, useSpecVersions } from '../api/spec';

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <Table.Tr>
      <Table.Th w={200} fw={500}>
        {label}
      </Table.Th>
      <Table.Td>{children}</Table.Td>
    </Table.Tr>
  );
}

const dash = (
  <Text span c="dimmed">
    not required
  </Text>
);

/** A spec version as it was saved, every value through the shared formatter. */
export function SpecView({ spec }: { spec: Spec }) {
  return (
    <Table aria-label="Spec values">
      <Table.Tbody>
        <Row label="Reference current">
          <Quantity value={spec.iRef} kind="current" />
        </Row>
        <Row label="VZ window at iRef">
          <Quantity value={spec.vz.min} kind="voltage" digits={4} /> … <Quantity value={spec.vz.nom} kind="voltage" digits={4} /> …{' '}
          <Quantity value={spec.vz.max} kind="voltage" digits={4} />
        </Row>
        <Row label="Largest Zd at iRef">{spec.zdMax === null ? dash : <Quantity value={spec.zdMax} kind="resistance" />}</Row>
        <Row label="Knee">
          {spec.knee ? (
            <>
              {spec.knee.maxRatio !== null && (
                <>
                  Zd ratio ≤ {spec.knee.maxRatio} at <Quantity value={spec.knee.iKnee} kind="current" />
                </>
              )}
              {spec.knee.maxRatio !== null && spec.knee.maxSpan !== null && '; '}
              {spec.knee.maxSpan !== null && (
                <>
                  span ≤ <Quantity value={spec.knee.maxSpan} kind="voltage" />
                </>
              )}
            </>
          ) : (
            dash
          )}
        </Row>
        <Row label="Leakage">
          {spec.leakage ? (
            <>
              ≤ <Quantity value={spec.leakage.irMax} kind="current" /> at <Quantity value={spec.leakage.vr} kind="voltage" />
            </>
          ) : (
            dash
          )}
        </Row>
        <Row label="αVZ window">
          {spec.tc ? (
            <>
              <Quantity value={spec.tc.min} kind="tempCoVoltage" /> … <Quantity value={spec.tc.max} kind="tempCoVoltage" />
            </>
          ) : (
            dash
          )}
        </Row>
        <Row label="Power">
          {spec.power ? (
            <>
              ≥ <Quantity value={spec.power.pdMin} kind="power" />, at most {formatPercent(spec.power.deratingFraction, { digits: 4 })} of the derated rating
            </>
          ) : (
            dash
          )}
        </Row>
        <Row label="Packages">{spec.packages.length ? spec.packages.join(', ') : 'any'}</Row>
        <Row label="Envelope">
          <Quantity value={spec.envelope.iMin} kind="current" /> … <Quantity value={spec.envelope.iMax} kind="current" />,{' '}
          <Quantity value={spec.envelope.taMin} kind="temperature" /> … <Quantity value={spec.envelope.taMax} kind="temperature" />
        </Row>
        <Row label="Output window">
          {spec.outputWindow ? (
            <>
              <Quantity value={spec.outputWindow.vMin} kind="voltage" digits={4} /> … <Quantity value={spec.outputWindow.vMax} kind="voltage" digits={4} />
            </>
          ) : (
            dash
          )}
        </Row>
        <Row label="Marginal within">{spec.marginalBandPercent} % of a limit</Row>
      </Table.Tbody>
    </Table>
  );
}

/** Every spec version, newest first; one opens read-only and can be taken into the editor. */
export function SpecVersions({ housePartId, onStartFrom }: { housePartId: number; onStartFrom: (version: number, spec: Spec) => void }) {
  const versions = useSpecVersions(housePartId);
  const [shown, setShown] = useState<number | null>(null);
  const version = useSpecVersion(housePartId, shown);
  const list = [...(versions.data ?? [])].sort((a, b) => b.version - a.version);

  return (
    <Paper>
      <Stack gap="xs">
        <Title order={3} fz="h5">
          Versions
        </Title>
        {versions.isPending && <Loader size="xs" aria-label="Loading the versions" />}
        {versions.isError && (
          <Alert color="red" role="alert" p="xs">
            {describeError(versions.error)}
          </Alert>
        )}
        {versions.data?.length === 0 && (
          <Text fz="sm" c="dimmed">
            None yet: the first save makes version 1.
          </Text>
        )}
        {list.length > 0 && (
          <Table aria-label="Spec versions">
            <Table.Tbody>
              {list.map((v) => (
                <Table.Tr key={v.version}>
                  <Table.Td w={40}>
                    <Anchor
                      component="button"
                      type="button"
                      fz="sm"
                      onClick={() => setShown(v.version)}
                      aria-label={`v${v.version}: open spec version ${v.version}`}
                    >
                      v{v.version}
                    </Anchor>
                  </Table.Td>
                  <Table.Td>
                    <Text fz="xs">{formatDateTime(v.createdAt)}</Text>
                    <Text fz="xs" c="dimmed">
                      {v.createdBy?.name ?? '–'}
                      {v.note ? ` — ${v.note}` : ''}
                    </Text>
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        )}
      </Stack>
      <Modal opened={shown !== null} onClose={() => setShown(null)} title={`Spec version ${shown ?? ''}`} size="lg">
        {version.isPending && <Loader size="sm" aria-label="Loading the version" />}
        {version.isError && (
          <Alert color="red" role="alert">
            {describeError(version.error)}
          </Alert>
        )}
        {version.data && (
          <Stack gap="sm">
            <Text fz="sm" c="dimmed">
              Saved by {version.data.createdBy?.name ?? '–'}, {formatDateTime(version.data.createdAt)}
              {version.data.note ? ` — ${version.data.note}` : ''}
            </Text>
            <SpecView spec={version.data.spec} />
            <Group justify="flex-end">
              <Button
                variant="light"
                onClick={() => {
                  onStartFrom(version.data!.version, version.data!.spec);
                  setShown(null);
                }}
              >
                Put these values in the editor
              </Button>
            </Group>
          </Stack>
        )}
      </Modal>
    </Paper>
  );
}
