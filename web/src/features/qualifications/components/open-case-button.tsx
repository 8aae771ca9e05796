import { useState } from 'react';
import { Button, Group, Modal, Stack, Text, Textarea, type ButtonProps } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconClipboardPlus } from '@tabler/icons-react';
import { useNavigate } from 'react-router';
import { useCreateQualification } from '../api/create-qualification';
import { ChangeRefused } from './conflict-notice';

export interface OpenCaseTarget {
  housePart: { id: number; partNumber: string };
  vendorPart: { id: number; manufacturer: string; mpn: string };
}

/**
 * Opens a qualification case for one source of a house part (engineers). The server
 * evaluates it at once against the current spec and card; the new case opens in draft.
 */
export function OpenCaseButton({
  target,
  label = 'Open a case',
  ...buttonProps
}: { target: OpenCaseTarget; label?: string } & Omit<ButtonProps, 'children' | 'onClick'>) {
  const [opened, setOpened] = useState(false);
  const [summary, setSummary] = useState('');
  const navigate = useNavigate();
  const create = useCreateQualification();
  const what = `${target.vendorPart.manufacturer} ${target.vendorPart.mpn}`;

  const submit = () =>
    create.mutate(
      { housePartId: target.housePart.id, vendorPartId: target.vendorPart.id, summary: summary.trim() || undefined },
      {
        onSuccess: (created) => {
          notifications.show({
            color: 'verdigris',
            title: `Case #${created.id} opened`,
            message: `${what} for ${target.housePart.partNumber}: ${created.evaluation.summary}`,
          });
          setOpened(false);
          navigate(`/qualifications/${created.id}`);
        },
      },
    );

  return (
    <>
      <Button
        size="compact-xs"
        variant="light"
        leftSection={<IconClipboardPlus size={14} />}
        aria-label={`Open a case: ${target.vendorPart.mpn} for ${target.housePart.partNumber}`}
        {...buttonProps}
        onClick={() => {
          create.reset();
          setOpened(true);
        }}
      >
        {label}
      </Button>
      <Modal opened={opened} onClose={() => setOpened(false)} title={`Qualify ${target.vendorPart.mpn} for ${target.housePart.partNumber}`} centered size="lg">
        <Stack gap="sm">
          <Text fz="sm">
            Opens a case for {what} as a source of {target.housePart.partNumber}. Its rating card is checked now against the house part&apos;s current spec; the
            case starts as a draft that you can send for review.
          </Text>
          <Textarea
            label="Notes"
            placeholder="optional: why this source, what to look at"
            autosize
            minRows={2}
            maxLength={4000}
            value={summary}
            onChange={(e) => setSummary(e.currentTarget.value)}
          />
          {create.isError && (
            <ChangeRefused
              error={create.error}
              conflictTitle="This source already has a case"
              conflictHint="Someone may have opened one meanwhile, or an earlier case has to be continued or re-checked instead. Nothing new was opened."
            />
          )}
          <Group justify="flex-end" gap="xs">
            <Button variant="default" onClick={() => setOpened(false)}>
              Cancel
            </Button>
            <Button onClick={submit} loading={create.isPending}>
              Open the case
            </Button>
          </Group>
        </Stack>
      </Modal>
    </>
  );
}
