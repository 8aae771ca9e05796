import { useMemo, useRef, useState } from 'react';
import { Alert, Anchor, Badge, Box, Button, Center, Grid, Group, Loader, Paper, Select, Stack, Text } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { IconArrowLeft, IconPencil } from '@tabler/icons-react';
import { useQueryClient } from '@tanstack/react-query';
import type { RatingCardView, VendorPartDetail } from '@shuntwise/contracts';
import { Link, useParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { useDatasheet } from '@/features/datasheets/api/get-datasheet';
import { useExtraction } from '@/features/datasheets/api/get-extraction';
import { MeasurementsPanel } from '@/features/measurements/components/measurements-panel';
import { DatasheetUpload } from '@/features/datasheets/components/datasheet-upload';
import { OutdatedReading } from '@/features/datasheets/components/outdated-reading';
import { DatasheetViewer, type ViewerTarget } from '@/features/datasheets/components/datasheet-viewer';
import { useRatingCard } from '@/features/vendor-parts/api/get-rating-card';
import { useVendorPart } from '@/features/vendor-parts/api/get-vendor-part';
import { vendorPartKeys } from '@/features/vendor-parts/api/vendor-part-keys';
import type { SourceLocation } from '@/features/vendor-parts/components/card-field-row';
import { RatingCardEditor } from '@/features/vendor-parts/components/rating-card-editor';
import { VendorPartFormModal } from '@/features/vendor-parts/components/vendor-part-form-modal';
import { describeError } from '@/lib/api-client';
import { useSession } from '@/lib/session';

/** The datasheet most of the card's values point at, else the newest one linked. */
function defaultDatasheet(part: VendorPartDetail, card: RatingCardView | undefined): number | null {
  const counts = new Map<number, number>();
  for (const value of Object.values(card?.fields ?? {})) {
    const id = value?.provenance.datasheetId;
    if (id) counts.set(id, (counts.get(id) ?? 0) + 1);
  }
  const best = [...counts.entries()].sort((a, b) => b[1] - a[1])[0];
  if (best && part.datasheets.some((d) => d.id === best[0])) return best[0];
  const newest = [...part.datasheets].sort((a, b) => b.createdAt.localeCompare(a.createdAt))[0];
  return newest?.id ?? best?.[0] ?? null;
}

function DatasheetPane({
  part,
  datasheetId,
  onSelect,
  target,
  onUploaded,
}: {
  part: VendorPartDetail;
  datasheetId: number | null;
  onSelect: (id: number) => void;
  target: ViewerTarget | null;
  onUploaded: (id: number) => void;
}) {
  const [adding, { toggle, open: keepUploadOpen }] = useDisclosure(false);
  const linked = part.datasheets.find((d) => d.id === datasheetId);
  // A value may point at a datasheet this part is not linked to: read its name.
  const other = useDatasheet(datasheetId !== null && !linked ? datasheetId : null);
  const fileName = linked?.fileName ?? other.data?.fileName ?? `Datasheet ${datasheetId}`;
  // Once a file went up, its row stays in view (with what was found) after the part's datasheet list refreshes.
  const upload = (
    <DatasheetUpload
      vendorPartId={part.id}
      multiple={false}
      compact
      onUploaded={(r) => {
        keepUploadOpen();
        onUploaded(r.id);
      }}
    />
  );

  return (
    <Paper style={{ position: 'sticky', top: 64 }} aria-label="Datasheet">
      <Stack gap="xs">
        <Group justify="space-between" gap="xs">
          {part.datasheets.length > 1 ? (
            <Select
              size="xs"
              w={280}
              aria-label="Datasheet shown"
              data={part.datasheets.map((d) => ({ value: String(d.id), label: `${d.fileName}${d.revision ? ` (rev. ${d.revision})` : ''}` }))}
              value={datasheetId === null ? null : String(datasheetId)}
              onChange={(v) => v && onSelect(Number(v))}
              allowDeselect={false}
            />
          ) : (
            <Text fz="sm" fw={500}>
              {part.datasheets.length === 0 ? 'No datasheet yet' : 'Datasheet'}
            </Text>
          )}
          {part.datasheets.length > 0 && (
            <Button size="compact-xs" variant="subtle" onClick={toggle}>
              {adding ? 'Close' : 'Add a datasheet'}
            </Button>
          )}
        </Group>
        {(adding || part.datasheets.length === 0) && upload}
        {datasheetId !== null ? (
          <DatasheetViewer key={datasheetId} datasheetId={datasheetId} fileName={fileName} target={target?.page ? target : null} height="calc(100vh - 220px)" />
        ) : (
          <Text fz="sm" c="dimmed">
            Upload the vendor&apos;s PDF: it is read for ratings, and each value it finds appears beside the card as a suggestion.
          </Text>
        )}
      </Stack>
    </Paper>
  );
}

export function VendorPartRoute() {
  const id = Number(useParams().id);
  const valid = Number.isInteger(id) && id > 0;
  const part = useVendorPart(valid ? id : 0);
  const card = useRatingCard(valid ? id : 0);
  const queryClient = useQueryClient();
  const session = useSession();
  const [editing, editModal] = useDisclosure(false);
  const [chosen, setChosen] = useState<number | null>(null);
  const [target, setTarget] = useState<ViewerTarget | null>(null);
  const nonce = useRef(0);

  const datasheetId = chosen ?? (part.data ? defaultDatasheet(part.data, card.data) : null);
  const extraction = useExtraction(datasheetId);
  const datasheetName = part.data?.datasheets.find((d) => d.id === datasheetId)?.fileName ?? `Datasheet ${datasheetId}`;
  const cardExtraction = useMemo(
    () => (datasheetId !== null && extraction.data ? { datasheetId, fileName: datasheetName, variants: extraction.data.variants } : null),
    [datasheetId, datasheetName, extraction.data],
  );

  const showSource = (location: SourceLocation) => {
    if (location.datasheetId !== datasheetId) setChosen(location.datasheetId);
    nonce.current += 1;
    setTarget({ page: location.page, text: location.text, box: location.box, nonce: nonce.current });
  };

  if (!valid) {
    return (
      <Alert color="red" role="alert" title="Not a vendor part">
        The address does not name a vendor part.{' '}
        <Anchor component={Link} to="/vendor-parts">
          Go to the list
        </Anchor>
      </Alert>
    );
  }
  if (part.isPending || card.isPending) {
    return (
      <Center py="xl">
        <Loader aria-label="Loading the vendor part" />
      </Center>
    );
  }
  if (part.isError || card.isError) {
    return (
      <Alert color="red" role="alert" title="The vendor part could not be loaded">
        {describeError(part.error ?? card.error)}{' '}
        <Anchor component={Link} to="/vendor-parts">
          Back to the list
        </Anchor>
      </Alert>
    );
  }

  const p = part.data;
  return (
    <>
      <PageHeader
        title={p.mpn}
        description={
          <Group gap={6} component="span">
            <span>
              {p.manufacturer} · {p.package ?? 'package not set'}
              {p.lifecycleNote ? ` · ${p.lifecycleNote}` : ''}
            </span>
            {p.sourceOf.map((s) => (
              <Badge
                key={s.housePartId}
                size="sm"
                color={s.role === 'approved' ? 'verdigris' : 'copper'}
                component={Link}
                to={`/house-parts/${s.housePartId}`}
                style={{ cursor: 'pointer' }}
              >
                {s.role} source of {s.partNumber}
              </Badge>
            ))}
          </Group>
        }
        actions={
          <>
            <Button component={Link} to="/vendor-parts" variant="subtle" leftSection={<IconArrowLeft size={16} />}>
              Vendor parts
            </Button>
            <Button variant="default" leftSection={<IconPencil size={16} />} onClick={editModal.open}>
              Edit part
            </Button>
          </>
        }
      />
      <Grid gutter="md">
        <Grid.Col span={{ base: 12, lg: 6 }}>
          <DatasheetPane
            part={p}
            datasheetId={datasheetId}
            onSelect={setChosen}
            target={target}
            onUploaded={(newId) => {
              setChosen(newId);
              void queryClient.invalidateQueries({ queryKey: vendorPartKeys.detail(p.id), exact: true });
            }}
          />
        </Grid.Col>
        <Grid.Col span={{ base: 12, lg: 6 }}>
          <Box>
            {extraction.isError && (
              <Alert color="red" p="xs" mb="xs" role="alert">
                The datasheet&apos;s suggestions could not be loaded: {describeError(extraction.error)}
              </Alert>
            )}
            {datasheetId !== null && extraction.data?.outdated && (
              <OutdatedReading key={datasheetId} datasheetId={datasheetId} canReadAgain={session?.user.role === 'engineer'} />
            )}
            <RatingCardEditor vendorPart={p} card={card.data} extraction={cardExtraction} onShowSource={showSource} />
          </Box>
        </Grid.Col>
      </Grid>
      <MeasurementsPanel vendorPartId={p.id} canUpload={session?.user.role === 'engineer'} />
      <VendorPartFormModal key={p.updatedAt} opened={editing} onClose={editModal.close} part={p} />
    </>
  );
}
