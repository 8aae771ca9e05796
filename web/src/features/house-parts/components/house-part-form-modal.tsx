import { Alert, Button, Group, Modal, Select, Stack, Textarea, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { notifications } from '@mantine/notifications';
import { createHousePartRequestSchema, HOUSE_PART_STATUSES, type HousePart, type HousePartStatus } from '@shuntwise/contracts';
import { ApiError, describeError } from '@/lib/api-client';
import { schemaResolver } from '@/lib/form';
import { useCreateHousePart, useUpdateHousePart } from '../api/save-house-part';
import { STATUS_LABEL } from './house-part-status';

interface Values {
  partNumber: string;
  description: string;
  status: HousePartStatus;
}

const STATUS_OPTIONS = HOUSE_PART_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }));

/** Create or edit a house part: its internal number (unique), description and status. */
export function HousePartFormModal({
  opened,
  onClose,
  part,
  onSaved,
}: {
  opened: boolean;
  onClose: () => void;
  part?: HousePart;
  onSaved?: (part: HousePart) => void;
}) {
  const create = useCreateHousePart();
  const update = useUpdateHousePart();
  const mutation = part ? update : create;
  const form = useForm<Values>({
    mode: 'uncontrolled',
    initialValues: { partNumber: part?.partNumber ?? '', description: part?.description ?? '', status: part?.status ?? 'draft' },
    validate: schemaResolver<Values>(createHousePartRequestSchema),
    validateInputOnBlur: true,
  });

  const close = () => {
    if (!part) form.reset();
    create.reset();
    update.reset();
    onClose();
  };

  const submit = form.onSubmit((values) => {
    const body = { partNumber: values.partNumber.trim(), description: values.description.trim(), status: values.status };
    const onSuccess = (saved: HousePart) => {
      notifications.show({ color: 'verdigris', title: part ? 'House part saved' : 'House part created', message: saved.partNumber });
      onSaved?.(saved);
      close();
    };
    const onError = (error: unknown) => {
      if (error instanceof ApiError) {
        for (const e of error.errors ?? []) form.setFieldError(e.path, e.message === 'must be unique' ? `${body.partNumber} already exists` : e.message);
      }
    };
    if (part) update.mutate({ id: part.id, changes: body }, { onSuccess, onError });
    else create.mutate(body, { onSuccess, onError });
  });

  return (
    <Modal opened={opened} onClose={close} title={part ? `Edit ${part.partNumber}` : 'New house part'} centered>
      <form onSubmit={submit} noValidate aria-label={part ? 'Edit house part' : 'New house part'}>
        <Stack gap="sm">
          {mutation.isError && (
            <Alert color="red" role="alert">
              {describeError(mutation.error)}
            </Alert>
          )}
          <TextInput label="House part number" withAsterisk data-autofocus key={form.key('partNumber')} {...form.getInputProps('partNumber')} />
          <Textarea label="Description" autosize minRows={2} maxLength={500} key={form.key('description')} {...form.getInputProps('description')} />
          <Select
            label="Status"
            data={STATUS_OPTIONS}
            allowDeselect={false}
            comboboxProps={{ withinPortal: true }}
            key={form.key('status')}
            {...form.getInputProps('status')}
          />
          <Group justify="flex-end" mt="xs">
            <Button variant="default" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" loading={mutation.isPending}>
              {part ? 'Save' : 'Create'}
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
