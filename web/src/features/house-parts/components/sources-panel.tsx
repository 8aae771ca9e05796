import { useState } from 'react';
import { ActionIcon, Alert, Anchor, Badge, Button, Group, Loader, Modal, Paper, Select, Stack, Table, Text, TextInput, Title, Tooltip } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { notifications } from '@mantine/notifications';
import { IconLinkPlus, IconTrash } from '@tabler/icons-react';
import { formatQuantity, type Source, type SourceRole } from '@shuntwise/contracts';
import { Link } from 'react-router';
import { describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useSession } from '@/lib/session';
import { useAddSource, useRemoveSource, useSources, useVendorPartSearch } from '../api/sources';

const ROLE_LABEL: Record<SourceRole, string> = {
  approved: 'Approved source',
  alternate: 'Alternate',
};

/**
 * Links a vendor part, found by part number or manufacturer, as a candidate alternate. Its
 * standing (approved source, cleared) comes only from a second engineer's decision on its
 * qualification case, so there is nothing to choose here.
 */
function AddSource({ housePartId, linked }: { housePartId: number; linked: ReadonlySet<number> }) {
  const [text, setText] = useState('');
  const [query] = useDebouncedValue(text.trim(), 200);
  const search = useVendorPartSearch(query);
  const [picked, setPicked] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const add = useAddSource();

  const options = (search.data?.items ?? []).map((p) => ({
    value: String(p.id),
    label: `${p.mpn} — ${p.manufacturer}${p.package ? `, ${p.package}` : ''}${p.card ? `, ${formatQuantity(p.card.vzNom, 'voltage')} at ${formatQuantity(p.card.izt, 'current')}` : ', no card'}`,
    disabled: linked.has(p.id),
  }));

  const submit = () => {
    if (!picked) return;
    add.mutate(
      {
        housePartId,
        request: { vendorPartId: Number(picked), note: note.trim() || null },
      },
      {
        onSuccess: (source) => {
          notifications.show({
            color: 'verdigris',
            title: 'Source linked',
            message: `${source.mpn} (${source.manufacturer}) as a candidate; open its qualification case to approve or clear it.`,
          });
          setPicked(null);
          setText('');
          setNote('');
        },
      },
    );
  };

  return (
    <Stack gap={6}>
      <Group align="flex-end" gap="xs" wrap="wrap">
        <Select
          size="xs"
          w={340}
          label="Vendor part"
          placeholder="Type a part number or manufacturer"
          searchable
          searchValue={text}
          onSearchChange={setText}
          data={options}
          value={picked}
          onChange={setPicked}
          filter={({ options: o }) => o}
          nothingFoundMessage={query ? (search.isFetching ? 'Searching…' : 'No vendor part starts with this') : 'Type to search'}
          rightSection={search.isFetching ? <Loader size={12} /> : undefined}
          clearable
        />
        <TextInput size="xs" w={220} label="Note" placeholder="optional" value={note} onChange={(e) => setNote(e.currentTarget.value)} maxLength={500} />
        <Button size="xs" leftSection={<IconLinkPlus size={14} />} onClick={submit} disabled={!picked} loading={add.isPending}>
          Link source
        </Button>
      </Group>
      {add.isError && (
        <Alert color="red" p="xs" role="alert">
          {describeError(add.error)}
        </Alert>
      )}
    </Stack>
  );
}

/** The vendor parts linked to a house part, each with the role its decisions gave it (read only). */
export function SourcesPanel({ housePartId, partNumber }: { housePartId: number; partNumber: string }) {
  const sources = useSources(housePartId);
  const remove = useRemoveSource();
  const [removing, setRemoving] = useState<Source | null>(null);
  const linked = new Set((sources.data ?? []).map((s) => s.vendorPartId));
  // Only engineers link and unlink (the API refuses others); an admin reads.
  const engineer = useSession()?.user.role === 'engineer';

  return (
    <Paper>
      <Stack gap="sm">
        <Title order={3} fz="h5">
          Sources
        </Title>
        {engineer && <AddSource housePartId={housePartId} linked={linked} />}
        {sources.isPending && <Loader size="sm" aria-label="Loading the sources" />}
        {sources.isError && (
          <Alert color="red" role="alert">
            {describeError(sources.error)}
          </Alert>
        )}
        {sources.data?.length === 0 && (
          <Text fz="sm" c="dimmed">
            No vendor part is linked yet. Link the parts to qualify; a second engineer's decision on each one's case makes it the approved source or a cleared
            alternate.
          </Text>
        )}
        {sources.data && sources.data.length > 0 && (
          <Table aria-label={`Sources of ${partNumber}`}>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Part number</Table.Th>
                <Table.Th>Manufacturer</Table.Th>
                <Table.Th>Package</Table.Th>
                <Table.Th>Role</Table.Th>
                <Table.Th>Card</Table.Th>
                <Table.Th>Note</Table.Th>
                <Table.Th>Linked</Table.Th>
                <Table.Th />
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {sources.data.map((s) => (
                <Table.Tr key={s.vendorPartId}>
                  <Table.Td>
                    <Anchor component={Link} to={`/vendor-parts/${s.vendorPartId}`} fz="sm" fw={500}>
                      {s.mpn}
                    </Anchor>
                  </Table.Td>
                  <Table.Td>{s.manufacturer}</Table.Td>
                  <Table.Td>{s.package ?? '–'}</Table.Td>
                  <Table.Td>
                    <Tooltip label="Set by decisions on its qualification case, not here">
                      <Badge size="sm" variant="outline" color={s.role === 'approved' ? 'verdigris' : 'gray'} aria-label={`Role of ${s.mpn}`}>
                        {ROLE_LABEL[s.role]}
                      </Badge>
                    </Tooltip>
                  </Table.Td>
                  <Table.Td>
                    {s.cardVersion ? (
                      <Badge size="xs" variant="outline">
                        v{s.cardVersion}
                      </Badge>
                    ) : (
                      <Badge size="xs" color="gray">
                        none
                      </Badge>
                    )}
                  </Table.Td>
                  <Table.Td>
                    <Text fz="xs">{s.note ?? ''}</Text>
                  </Table.Td>
                  <Table.Td>
                    <Text fz="xs">
                      {s.addedBy?.name ?? '–'}, {formatDateTime(s.createdAt)}
                    </Text>
                  </Table.Td>
                  <Table.Td>
                    {engineer && (
                      <Tooltip label="Remove this source">
                        <ActionIcon variant="subtle" color="red" onClick={() => setRemoving(s)} aria-label={`Remove ${s.mpn}`}>
                          <IconTrash size={16} />
                        </ActionIcon>
                      </Tooltip>
                    )}
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        )}
      </Stack>
      <Modal opened={removing !== null} onClose={() => setRemoving(null)} title="Remove this source?" centered>
        {removing && (
          <Stack gap="sm">
            <Text fz="sm">
              {removing.mpn} ({removing.manufacturer}) stops being {removing.role === 'approved' ? 'an approved' : 'an alternate'} source of {partNumber}. The
              vendor part and its card stay in the catalogue.
            </Text>
            {remove.isError && (
              <Alert color="red" p="xs" role="alert">
                {describeError(remove.error)}
              </Alert>
            )}
            <Group justify="flex-end">
              <Button variant="default" onClick={() => setRemoving(null)}>
                Keep it
              </Button>
              <Button
                color="red"
                loading={remove.isPending}
                onClick={() =>
                  remove.mutate(
                    { housePartId, vendorPartId: removing.vendorPartId },
                    {
                      onSuccess: () => {
                        notifications.show({
                          color: 'verdigris',
                          title: 'Source removed',
                          message: `${removing.mpn} is no longer a source of ${partNumber}.`,
                        });
                        setRemoving(null);
                      },
                    },
                  )
                }
              >
                Remove
              </Button>
            </Group>
          </Stack>
        )}
      </Modal>
    </Paper>
  );
}
