import { useMemo, useState } from 'react';
import { Alert, Badge, Button, Group, Modal, Radio, Stack, Table, Text } from '@mantine/core';
import type { CardField, RatingCardView } from '@shuntwise/contracts';
import { CARD_FIELD_META, formatCardValue } from '@/lib/card-fields';
import { formatDateTime } from '@/lib/format-date';
import { applyMerge, mergeRows, type CardDraft, type DraftField, type MergeChoice } from '../utils/card-draft';
import { SOURCE_LABEL } from './card-field-row';

export interface CardConflictModalProps {
  opened: boolean;
  baseVersion: number;
  base: CardDraft;
  mine: CardDraft;
  theirs: CardDraft;
  current: RatingCardView;
  onKeepEditing: () => void;
  /** The merged fields, and whether to save them at once. */
  onMerge: (merged: CardDraft, save: boolean) => void;
}

function Cell({ field, value, highlight }: { field: CardField; value: DraftField | undefined; highlight: boolean }) {
  if (!value) {
    return (
      <Text fz="sm" c="dimmed">
        empty
      </Text>
    );
  }
  return (
    <Stack gap={0}>
      <Text fz="sm" fw={highlight ? 600 : 400} style={{ fontVariantNumeric: 'tabular-nums' }}>
        {Number.isNaN(value.value) ? 'unreadable' : formatCardValue(field, value.value, value.unit, 4)}
      </Text>
      <Text fz={11} c="dimmed">
        {SOURCE_LABEL[value.source]}
        {value.page ? `, p. ${value.page}` : ''}
      </Text>
    </Stack>
  );
}

/**
 * A stale save, shown as both cards side by side: the engineer's and the one saved
 * meanwhile. Per field one choice; where only one side changed a field, that side is
 * preselected; where both did, the engineer's own value is.
 */
export function CardConflictModal({ opened, baseVersion, base, mine, theirs, current, onKeepEditing, onMerge }: CardConflictModalProps) {
  const rows = useMemo(() => mergeRows(base, mine, theirs), [base, mine, theirs]);
  const [choices, setChoices] = useState<Partial<Record<CardField, MergeChoice>>>({});
  const conflicts = rows.filter((r) => r.conflict).length;
  const who = current.updatedBy ? `${current.updatedBy.name}, ${formatDateTime(current.updatedAt)}` : formatDateTime(current.updatedAt);

  return (
    <Modal opened={opened} onClose={onKeepEditing} title="The card was saved by someone else meanwhile" size="xl" centered>
      <Stack gap="sm">
        <Alert color="yellow" p="xs">
          You edited version {baseVersion}; version {current.version} was saved by {who}. Nothing has been overwritten and nothing you typed is lost. Choose per
          field which value to keep.
          {conflicts > 0 && ` ${conflicts} field${conflicts === 1 ? '' : 's'} changed on both sides.`}
        </Alert>
        <Table aria-label="Both versions of the card">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Field</Table.Th>
              <Table.Th>Version {baseVersion} (you started from)</Table.Th>
              <Table.Th>Yours</Table.Th>
              <Table.Th>Version {current.version} (saved meanwhile)</Table.Th>
              <Table.Th>Keep</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {rows.map((row) => {
              const choice = choices[row.field] ?? row.choice;
              const symbol = CARD_FIELD_META[row.field].symbol;
              return (
                <Table.Tr key={row.field} bg={row.conflict ? 'var(--mantine-color-yellow-light)' : undefined} data-conflict={row.conflict || undefined}>
                  <Table.Td>
                    <Group gap={4}>
                      <Text fz="sm" fw={500}>
                        {symbol}
                      </Text>
                      {row.conflict && (
                        <Badge size="xs" color="yellow">
                          both changed
                        </Badge>
                      )}
                    </Group>
                  </Table.Td>
                  <Table.Td>
                    <Cell field={row.field} value={row.base} highlight={false} />
                  </Table.Td>
                  <Table.Td>
                    <Cell field={row.field} value={row.mine} highlight={row.mineChanged} />
                  </Table.Td>
                  <Table.Td>
                    <Cell field={row.field} value={row.theirs} highlight={row.theirsChanged} />
                  </Table.Td>
                  <Table.Td>
                    <Radio.Group
                      value={choice}
                      onChange={(v) => setChoices((c) => ({ ...c, [row.field]: v as MergeChoice }))}
                      aria-label={`Keep which ${symbol}`}
                    >
                      <Group gap="xs" wrap="nowrap">
                        <Radio size="xs" value="mine" label="yours" />
                        <Radio size="xs" value="theirs" label={`v${current.version}`} />
                      </Group>
                    </Radio.Group>
                  </Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
        <Group justify="flex-end">
          <Button variant="default" onClick={onKeepEditing}>
            Keep editing
          </Button>
          <Button variant="light" onClick={() => onMerge(applyMerge(rows, choices), false)}>
            Put the chosen values in the editor
          </Button>
          <Button onClick={() => onMerge(applyMerge(rows, choices), true)}>Save the chosen values as v{current.version + 1}</Button>
        </Group>
      </Stack>
    </Modal>
  );
}
