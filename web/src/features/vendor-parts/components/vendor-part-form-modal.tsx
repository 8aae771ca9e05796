import { Alert, Autocomplete, Button, Group, Modal, Stack, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { notifications } from '@mantine/notifications';
import { createVendorPartRequestSchema, type VendorPart, type VendorPartDetail } from '@shuntwise/contracts';
import { ApiError, describeError } from '@/lib/api-client';
import { schemaResolver } from '@/lib/form';
import { useCreateVendorPart } from '../api/create-vendor-part';
import { useManufacturers } from '../api/get-manufacturers';
import { useUpdateVendorPart } from '../api/update-vendor-part';

interface Values {
  manufacturer: string;
  mpn: string;
  package: string;
  lifecycleNote: string;
}

export interface VendorPartFormModalProps {
  opened: boolean;
  onClose: () => void;
  /** Edit this part; without it the form creates one. */
  part?: VendorPartDetail;
  onSaved?: (part: VendorPart) => void;
}

/** Create or edit a vendor part: manufacturer, part number (unique per manufacturer), package, lifecycle note. */
export function VendorPartFormModal({ opened, onClose, part, onSaved }: VendorPartFormModalProps) {
  const manufacturers = useManufacturers();
  const create = useCreateVendorPart();
  const update = useUpdateVendorPart();
  const mutation = part ? update : create;
  const form = useForm<Values>({
    mode: 'uncontrolled',
    initialValues: { manufacturer: part?.manufacturer ?? '', mpn: part?.mpn ?? '', package: part?.package ?? '', lifecycleNote: part?.lifecycleNote ?? '' },
    validate: (values) =>
      schemaResolver<Values>(createVendorPartRequestSchema)({
        ...values,
        package: values.package || null,
        lifecycleNote: values.lifecycleNote || null,
      } as Values),
    validateInputOnBlur: true,
  });

  const close = () => {
    if (!part) form.reset();
    create.reset();
    update.reset();
    onClose();
  };

  const onError = (error: unknown) => {
    if (error instanceof ApiError) {
      for (const e of error.errors ?? [])
        form.setFieldError(e.path, e.message === 'must be unique' ? 'This manufacturer already has a part with this number' : e.message);
    }
  };

  const submit = form.onSubmit((values) => {
    const body = {
      manufacturer: values.manufacturer.trim(),
      mpn: values.mpn.trim(),
      package: values.package.trim() || null,
      lifecycleNote: values.lifecycleNote.trim() || null,
    };
    const done = (saved: VendorPart) => {
      notifications.show({ color: 'verdigris', title: part ? 'Vendor part saved' : 'Vendor part created', message: `${saved.manufacturer} ${saved.mpn}` });
      onSaved?.(saved);
      close();
    };
    if (part) update.mutate({ id: part.id, changes: body }, { onSuccess: done, onError });
    else create.mutate(body, { onSuccess: done, onError });
  });

  return (
    <Modal opened={opened} onClose={close} title={part ? `Edit ${part.mpn}` : 'New vendor part'} centered>
      <form onSubmit={submit} noValidate aria-label={part ? 'Edit vendor part' : 'New vendor part'}>
        <Stack gap="sm">
          {mutation.isError && (
            <Alert color="red" role="alert">
              {describeError(mutation.error)}
            </Alert>
          )}
          <Autocomplete
            label="Manufacturer"
            data={(manufacturers.data ?? []).map((m) => m.name)}
            data-autofocus
            withAsterisk
            key={form.key('manufacturer')}
            {...form.getInputProps('manufacturer')}
          />
          <TextInput
            label="Manufacturer part number"
            withAsterisk
            description="As printed on the datasheet"
            key={form.key('mpn')}
            {...form.getInputProps('mpn')}
          />
          <TextInput label="Package" placeholder="e.g. SOD-123" key={form.key('package')} {...form.getInputProps('package')} />
          <TextInput
            label="Lifecycle note"
            placeholder="e.g. active, last-time buy announced"
            key={form.key('lifecycleNote')}
            {...form.getInputProps('lifecycleNote')}
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
