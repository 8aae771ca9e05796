import { useState } from 'react';
import { Alert, Anchor, Badge, Center, Group, Loader, Modal, Stack, Table, Text } from '@mantine/core';
import { CARD_FIELDS, type CardField, type CardFieldChange } from '@shuntwise/contracts';
import { CARD_FIELD_META, formatCardValue, sameNumber } from '@/lib/card-fields';
import { describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useRatingCardVersion, useRatingCardVersions } from '../api/get-rating-card';
import { SOURCE_COLOR, SOURCE_LABEL } from './card-field-row';

/** "VZ nom 5.100 V → 5.120 V"; "added", "removed", or "source or confirmation" when only the provenance changed. */
export function describeChange(change: CardFieldChange): string {
  const meta = CARD_FIELD_META[change.field as CardField];
  if (!meta) return change.field;
  const text = (side: CardFieldChange['from']) => (side ? formatCardValue(meta.field, side.value, side.unit, 4) : '–');
  if (change.from && change.to && sameNumber(change.from.value, change.to.value) && change.from.unit === change.to.unit) {
    return `${meta.symbol} ${text(change.to)}: source or confirmation`;
  }
  return `${meta.symbol} ${text(change.from)} → ${text(change.to)}`;
}

/** Every saved version of a card, each readable as it was, with what each changed (old → new). */
export function CardVersionsModal({ vendorPartId, opened, onClose }: { vendorPartId: number; opened: boolean; onClose: () => void }) {
  const versions = useRatingCardVersions(vendorPartId);
  const [shown, setShown] = useState<number | null>(null);
  const version = useRatingCardVersion(vendorPartId, shown);

  return (
    <Modal opened={opened} onClose={onClose} title="Card history" size="xl">
      <Stack gap="sm">
        {versions.isPending && (
          <Center py="md">
            <Loader size="sm" aria-label="Loading the history" />
          </Center>
        )}
        {versions.isError && (
          <Alert color="red" role="alert">
            {describeError(versions.error)}
          </Alert>
        )}
        {versions.data?.length === 0 && <Text c="dimmed">No version saved yet.</Text>}
        {versions.data && versions.data.length > 0 && (
          <Table aria-label="Card versions">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Version</Table.Th>
                <Table.Th>Saved</Table.Th>
                <Table.Th>Changed</Table.Th>
                <Table.Th>Note</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {versions.data.map((v) => (
                <Table.Tr key={v.version} bg={shown === v.version ? 'var(--mantine-primary-color-light)' : undefined}>
                  <Table.Td>
                    <Anchor component="button" type="button" onClick={() => setShown(v.version)} fz="sm">
                      v{v.version}
                    </Anchor>
                  </Table.Td>
                  <Table.Td>
                    {v.changedBy?.name ?? '–'}, {formatDateTime(v.createdAt)}
                  </Table.Td>
                  <Table.Td>
                    {v.version === 1 || v.changes.every((c) => c.from === null) ? (
                      <Text fz="xs">first version: {v.changes.map((c) => CARD_FIELD_META[c.field as CardField]?.symbol ?? c.field).join(', ')}</Text>
                    ) : (
                      <Stack gap={0}>
                        {v.changes.map((c) => (
                          <Text key={c.field} fz="xs" style={{ fontVariantNumeric: 'tabular-nums' }}>
                            {describeChange(c)}
                          </Text>
                        ))}
                      </Stack>
                    )}
                  </Table.Td>
                  <Table.Td>{v.note ?? ''}</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        )}
        {shown !== null && version.isPending && <Loader size="sm" aria-label="Loading the version" />}
        {version.isError && (
          <Alert color="red" role="alert">
            {describeError(version.error)}
          </Alert>
        )}
        {version.data && (
          <Stack gap={4}>
            <Text fw={500} fz="sm">
              Version {version.data.version} as saved
            </Text>
            <Table aria-label={`Card version ${version.data.version}`}>
              <Table.Tbody>
                {CARD_FIELDS.filter((f) => version.data.fields[f]).map((f) => {
                  const value = version.data.fields[f]!;
                  return (
                    <Table.Tr key={f}>
                      <Table.Td w={110}>{CARD_FIELD_META[f].symbol}</Table.Td>
                      <Table.Td w={120} style={{ fontVariantNumeric: 'tabular-nums' }}>
                        {formatCardValue(f, value.value, f === 'tc' ? version.data.fields.tc?.unit : undefined, 4)}
                      </Table.Td>
                      <Table.Td>
                        <Group gap={4}>
                          <Badge size="xs" color={SOURCE_COLOR[value.provenance.source]}>
                            {SOURCE_LABEL[value.provenance.source]}
                          </Badge>
                          <Text fz="xs" c="dimmed">
                            {value.provenance.page ? `p. ${value.provenance.page} · ` : ''}
                            {value.provenance.confirmedBy?.name ?? 'not confirmed'}
                          </Text>
                        </Group>
                      </Table.Td>
                    </Table.Tr>
                  );
                })}
              </Table.Tbody>
            </Table>
          </Stack>
        )}
      </Stack>
    </Modal>
  );
}
