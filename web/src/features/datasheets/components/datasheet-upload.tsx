import '@mantine/dropzone/styles.css';

import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';
import { Alert, Badge, Group, List, Loader, Paper, Progress, Stack, Text } from '@mantine/core';
import { Dropzone, PDF_MIME_TYPE, type FileRejection } from '@mantine/dropzone';
import { IconAlertCircle, IconCircleCheck, IconFileTypePdf, IconUpload, IconX } from '@tabler/icons-react';
import type { UploadDatasheetResponse } from '@shuntwise/contracts';
import { describeError } from '@/lib/api-client';
import { useExtraction } from '../api/get-extraction';
import { uploadDatasheet } from '../api/upload-datasheet';

// Mantine's list items do not wrap (white-space: nowrap); these are sentences.
const WRAPPING_LIST = { item: { whiteSpace: 'normal' as const }, itemWrapper: { display: 'inline' } };

export type UploadStatus = 'waiting' | 'uploading' | 'done' | 'failed';

export interface UploadItem {
  key: string;
  file: File;
  status: UploadStatus;
  progress: number;
  result?: UploadDatasheetResponse;
  error?: string;
}

/** Two at a time: enough to keep the line busy, few enough that every bar moves. */
const PARALLEL = 2;

let nextKey = 0;

function sizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(0)} kB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** What the API found in one uploaded datasheet. */
function ExtractionSummary({
  result,
  children,
}: {
  result: UploadDatasheetResponse;
  children?: (result: UploadDatasheetResponse, variantCount: number) => ReactNode;
}) {
  const extraction = useExtraction(result.id);
  if (extraction.isPending) return <Loader size="xs" aria-label="Reading what was found" />;
  if (extraction.isError) {
    return (
      <Text fz="xs" c="red">
        {describeError(extraction.error)}
      </Text>
    );
  }
  const { variants, warnings, hasText } = extraction.data;
  const fields = variants.reduce((n, v) => n + Object.keys(v.fields).length, 0);
  return (
    <Stack gap={4}>
      <Text fz="xs" data-testid="extraction-summary">
        {result.existing ? 'Already stored (same file): ' : ''}
        {result.pages} page{result.pages === 1 ? '' : 's'} ·{' '}
        {hasText
          ? `${variants.length} part${variants.length === 1 ? '' : 's'} found, ${fields} values`
          : variants.length > 0
            ? `a scan read by OCR: ${variants.length} part${variants.length === 1 ? '' : 's'}, ${fields} value${fields === 1 ? '' : 's'} to check against the page`
            : 'no text layer (a scan): OCR found no ratings'}
        {warnings.length > 0 ? ` · ${warnings.length} warning${warnings.length === 1 ? '' : 's'}` : ''}
      </Text>
      {variants.length > 0 && (
        <Text fz="xs" c="dimmed" lineClamp={2}>
          {variants.map((v) => v.mpn).join(', ')}
        </Text>
      )}
      {warnings.length > 0 && (
        <List size="xs" c="yellow.8" spacing={0} styles={WRAPPING_LIST}>
          {warnings.slice(0, 5).map((w) => (
            <List.Item key={w}>{w}</List.Item>
          ))}
          {warnings.length > 5 && <List.Item>… and {warnings.length - 5} more</List.Item>}
        </List>
      )}
      {children?.(result, variants.length)}
    </Stack>
  );
}

function UploadRow({ item, children }: { item: UploadItem; children?: (result: UploadDatasheetResponse, variantCount: number) => ReactNode }) {
  const icon =
    item.status === 'done' ? (
      <IconCircleCheck size={18} color="var(--mantine-color-verdigris-6)" />
    ) : item.status === 'failed' ? (
      <IconAlertCircle size={18} color="var(--mantine-color-red-6)" />
    ) : (
      <IconFileTypePdf size={18} />
    );
  return (
    <Paper p="xs" data-testid="upload-item" data-status={item.status} aria-label={`Upload of ${item.file.name}`} component="li" style={{ listStyle: 'none' }}>
      <Stack gap={4}>
        <Group justify="space-between" wrap="nowrap" gap="xs">
          <Group gap={6} wrap="nowrap" style={{ minWidth: 0 }}>
            {icon}
            <Text fz="sm" truncate>
              {item.file.name}
            </Text>
            <Text fz="xs" c="dimmed">
              {sizeText(item.file.size)}
            </Text>
          </Group>
          {item.status === 'uploading' && <Text fz="xs">{Math.round(item.progress * 100)} %</Text>}
          {item.status === 'waiting' && (
            <Badge size="xs" color="gray">
              waiting
            </Badge>
          )}
          {item.status === 'done' && item.result && (
            <Badge size="xs" color={item.result.existing ? 'indigo' : 'verdigris'}>
              {item.result.existing ? 'already stored' : 'stored'}
            </Badge>
          )}
          {item.status === 'failed' && (
            <Badge size="xs" color="red">
              refused
            </Badge>
          )}
        </Group>
        {(item.status === 'uploading' || item.status === 'waiting') && (
          <Progress value={item.progress * 100} size="sm" animated={item.status === 'uploading'} aria-label={`Upload progress of ${item.file.name}`} />
        )}
        {item.status === 'failed' && (
          <Text fz="xs" c="red" role="alert">
            {item.error}
          </Text>
        )}
        {item.status === 'done' && item.result && <ExtractionSummary result={item.result}>{children}</ExtractionSummary>}
      </Stack>
    </Paper>
  );
}

export interface DatasheetUploadProps {
  /** Link every uploaded datasheet to this vendor part. */
  vendorPartId?: number;
  multiple?: boolean;
  /** Called once per stored datasheet. */
  onUploaded?: (result: UploadDatasheetResponse, file: File) => void;
  /** Extra content under a stored file's summary (e.g. a "Review the parts" button). */
  renderResult?: (result: UploadDatasheetResponse, variantCount: number) => ReactNode;
  compact?: boolean;
}

/**
 * A dropzone for one or many PDFs. Every file gets its own row: a progress bar while it
 * goes up, then what the API found in it, or the API's reason for refusing it.
 */
export function DatasheetUpload({ vendorPartId, multiple = true, onUploaded, renderResult, compact = false }: DatasheetUploadProps) {
  const [items, setItems] = useState<UploadItem[]>([]);
  const running = useRef(0);
  const onUploadedRef = useRef(onUploaded);
  onUploadedRef.current = onUploaded;
  const itemsRef = useRef(items);
  itemsRef.current = items;

  const patch = useCallback((key: string, change: Partial<UploadItem>) => {
    setItems((list) => list.map((i) => (i.key === key ? { ...i, ...change } : i)));
  }, []);

  const pump = useCallback(() => {
    const waiting = itemsRef.current.filter((i) => i.status === 'waiting');
    for (const item of waiting) {
      if (running.current >= PARALLEL) return;
      running.current += 1;
      // Mark it at once so the next pump does not start it again.
      itemsRef.current = itemsRef.current.map((i) => (i.key === item.key ? { ...i, status: 'uploading' } : i));
      patch(item.key, { status: 'uploading' });
      uploadDatasheet(item.file, { vendorPartId, onProgress: (progress) => patch(item.key, { progress }) })
        .then((result) => {
          patch(item.key, { status: 'done', progress: 1, result });
          onUploadedRef.current?.(result, item.file);
        })
        .catch((error: unknown) => patch(item.key, { status: 'failed', error: describeError(error) }))
        .finally(() => {
          running.current -= 1;
          setTimeout(pump, 0);
        });
    }
  }, [patch, vendorPartId]);

  useEffect(() => {
    if (items.some((i) => i.status === 'waiting')) pump();
  }, [items, pump]);

  const add = (files: File[]) => {
    const added = files.map((file) => ({ key: `u${++nextKey}`, file, status: 'waiting' as const, progress: 0 }));
    setItems((list) => [...added, ...list]);
  };

  const reject = (rejections: FileRejection[]) => {
    const refused = rejections.map((r) => ({
      key: `u${++nextKey}`,
      file: r.file,
      status: 'failed' as const,
      progress: 0,
      error: r.errors.some((e) => e.code === 'file-invalid-type')
        ? `${r.file.name} is not a PDF: upload datasheets as PDF files.`
        : r.errors.map((e) => e.message).join('; '),
    }));
    setItems((list) => [...refused, ...list]);
  };

  const failed = items.filter((i) => i.status === 'failed').length;
  return (
    <Stack gap="xs">
      <Dropzone
        onDrop={add}
        onReject={reject}
        accept={PDF_MIME_TYPE}
        multiple={multiple}
        p={compact ? 'sm' : 'lg'}
        aria-label={multiple ? 'Drop datasheet PDFs here or choose files' : 'Drop a datasheet PDF here or choose a file'}
        data-testid="datasheet-dropzone"
        // The plain file input on Enter, Space or click in every browser (the File System Access picker is Chromium-only).
        useFsAccessApi={false}
        inputProps={{ 'aria-label': multiple ? 'Datasheet PDF files' : 'Datasheet PDF file' }}
      >
        <Group justify="center" gap="md" mih={compact ? 40 : 90} style={{ pointerEvents: 'none' }}>
          <Dropzone.Accept>
            <IconUpload size={compact ? 24 : 36} color="var(--mantine-primary-color-filled)" />
          </Dropzone.Accept>
          <Dropzone.Reject>
            <IconX size={compact ? 24 : 36} color="var(--mantine-color-red-6)" />
          </Dropzone.Reject>
          <Dropzone.Idle>
            <IconFileTypePdf size={compact ? 24 : 36} color="var(--mantine-color-dimmed)" />
          </Dropzone.Idle>
          <Stack gap={2}>
            <Text fz={compact ? 'sm' : 'md'}>
              {multiple ? 'Drop datasheet PDFs here, or click (or press Enter) to choose' : 'Drop the datasheet PDF here, or click (or press Enter) to choose'}
            </Text>
            <Text fz="xs" c="dimmed">
              Text PDFs are read for ratings on upload; a file already stored is not stored twice.
            </Text>
          </Stack>
        </Group>
      </Dropzone>
      {failed > 0 && items.length > 1 && (
        <Alert color="red" p="xs" icon={<IconAlertCircle size={16} />}>
          {failed} of {items.length} files refused; the others are not affected.
        </Alert>
      )}
      {items.length > 0 && (
        <Stack gap={6} component="ul" p={0} m={0} aria-label="Uploads">
          {items.map((item) => (
            <UploadRow key={item.key} item={item}>
              {renderResult}
            </UploadRow>
          ))}
        </Stack>
      )}
    </Stack>
  );
}
