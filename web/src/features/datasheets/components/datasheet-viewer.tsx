import { useEffect, useRef, useState, type KeyboardEvent } from 'react';
import { ActionIcon, Alert, Box, Center, Group, Loader, NumberInput, Text, Tooltip } from '@mantine/core';
import { useElementSize } from '@mantine/hooks';
import { IconChevronLeft, IconChevronRight, IconZoomIn, IconZoomOut } from '@tabler/icons-react';
import type { ExtractionBox } from '@shuntwise/contracts';
import type { PDFDocumentProxy, PageViewport, TextLayer } from 'pdfjs-dist';
import { describeError } from '@/lib/api-client';
import { useDatasheetFile } from '../api/get-datasheet-file';
import { findTextRuns, unionRect, type Rect } from '../utils/find-text';
import classes from './datasheet-viewer.module.css';

/** Where the viewer should go: a page, and the text (or box) of a value to frame there. */
export interface ViewerTarget {
  page: number;
  text?: string | null;
  box?: ExtractionBox;
  /** Changes on every request, so asking for the same place twice jumps again. */
  nonce: number;
}

type PdfJs = typeof import('pdfjs-dist');
let pdfjsPromise: Promise<PdfJs> | null = null;

/**
 * pdf.js and its worker, loaded the first time a datasheet is opened. The worker is a
 * file Vite bundles and serves with the app (no CDN); `?url` gives its address.
 */
function loadPdfjs(): Promise<PdfJs> {
  pdfjsPromise ??= Promise.all([import('pdfjs-dist'), import('pdfjs-dist/build/pdf.worker.min.mjs?url')]).then(([pdfjs, worker]) => {
    pdfjs.GlobalWorkerOptions.workerSrc = worker.default;
    return pdfjs;
  });
  return pdfjsPromise;
}

const ZOOMS = [0.75, 1, 1.25, 1.5, 2, 2.5];
const FRAME_PADDING = 10;

interface Rendered {
  pageNumber: number;
  viewport: PageViewport;
  textLayer: TextLayer;
}

export interface DatasheetViewerProps {
  datasheetId: number;
  fileName: string;
  target: ViewerTarget | null;
  /** Height of the scrolling frame (CSS), default 70vh. */
  height?: string;
}

/** A stored datasheet rendered with pdf.js: one page at a time, with its text layer and the value's frame. */
export function DatasheetViewer({ datasheetId, fileName, target, height = '70vh' }: DatasheetViewerProps) {
  const file = useDatasheetFile(datasheetId);
  const [doc, setDoc] = useState<PDFDocumentProxy | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [pageNumber, setPageNumber] = useState(target?.page ?? 1);
  const [zoomIndex, setZoomIndex] = useState(1);
  const [rendered, setRendered] = useState<Rendered | null>(null);
  const [highlight, setHighlight] = useState<Rect | null>(null);
  const [notFound, setNotFound] = useState(false);
  const { ref: frameRef, width: frameWidth } = useElementSize<HTMLDivElement>();
  const pageRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const textRef = useRef<HTMLDivElement>(null);

  // Open the document once its bytes are here; pdf.js takes a copy (it moves the buffer to its worker).
  useEffect(() => {
    if (!file.data) return;
    let cancelled = false;
    let destroy: (() => void) | undefined;
    setError(null);
    loadPdfjs()
      .then((pdfjs) => {
        if (cancelled) return undefined;
        const task = pdfjs.getDocument({ data: file.data.slice(), isEvalSupported: false });
        destroy = () => void task.destroy();
        return task.promise;
      })
      .then((opened) => {
        if (cancelled || !opened) return;
        setDoc(opened);
        setPageNumber((p) => Math.min(Math.max(1, p), opened.numPages));
      })
      .catch((e: unknown) => !cancelled && setError(e));
    return () => {
      cancelled = true;
      destroy?.();
      setDoc(null);
      setRendered(null);
    };
  }, [file.data]);

  // A new target turns to its page.
  useEffect(() => {
    if (target) setPageNumber(target.page);
  }, [target]);

  // Render the page to fit the frame's width, then its text layer.
  useEffect(() => {
    if (!doc || frameWidth === 0 || pageNumber < 1 || pageNumber > doc.numPages) return;
    let cancelled = false;
    let renderTask: { cancel(): void } | undefined;
    let textLayer: TextLayer | undefined;
    (async () => {
      const pdfjs = await loadPdfjs();
      const page = await doc.getPage(pageNumber);
      if (cancelled) return;
      const natural = page.getViewport({ scale: 1 });
      const scale = ((frameWidth - 2 * FRAME_PADDING) / natural.width) * ZOOMS[zoomIndex];
      const viewport = page.getViewport({ scale });
      const canvas = canvasRef.current!;
      const pageDiv = pageRef.current!;
      const ratio = window.devicePixelRatio || 1;
      canvas.width = Math.floor(viewport.width * ratio);
      canvas.height = Math.floor(viewport.height * ratio);
      canvas.style.width = `${Math.floor(viewport.width)}px`;
      canvas.style.height = `${Math.floor(viewport.height)}px`;
      pageDiv.style.width = `${Math.floor(viewport.width)}px`;
      pageDiv.style.height = `${Math.floor(viewport.height)}px`;
      pageDiv.style.setProperty('--total-scale-factor', String(scale));
      const task = page.render({ canvas, viewport, transform: ratio === 1 ? undefined : [ratio, 0, 0, ratio, 0, 0] });
      renderTask = task;
      const textDiv = textRef.current!;
      textDiv.replaceChildren();
      textLayer = new pdfjs.TextLayer({ textContentSource: page.streamTextContent(), container: textDiv, viewport });
      await Promise.all([task.promise, textLayer.render()]);
      if (!cancelled) setRendered({ pageNumber, viewport, textLayer });
    })().catch((e: unknown) => {
      // A cancelled render is us turning the page, not a failure.
      if (!cancelled && !(e instanceof Error && /cancel/i.test(e.name + e.message))) setError(e);
    });
    return () => {
      cancelled = true;
      renderTask?.cancel();
      textLayer?.cancel();
    };
  }, [doc, pageNumber, frameWidth, zoomIndex]);

  // Frame the target's text on its page: the extraction's box when it has one, else the text layer searched.
  useEffect(() => {
    if (!rendered || !target || target.page !== rendered.pageNumber) {
      setHighlight(null);
      setNotFound(false);
      return;
    }
    let rect: Rect | null = null;
    if (target.box) {
      const { x, y, width, height: h } = target.box;
      const [x1, y1, x2, y2] = rendered.viewport.convertToViewportRectangle([x, y, x + width, y + h]);
      rect = { left: Math.min(x1, x2), top: Math.min(y1, y2), width: Math.abs(x2 - x1), height: Math.abs(y2 - y1) };
    } else if (target.text && pageRef.current) {
      const origin = pageRef.current.getBoundingClientRect();
      const runs = rendered.textLayer.textDivs.map((div) => {
        const r = div.getBoundingClientRect();
        return { text: div.textContent ?? '', left: r.left - origin.left, top: r.top - origin.top, width: r.width, height: r.height };
      });
      const found = findTextRuns(runs, target.text);
      if (found) rect = unionRect(found);
    }
    const padded = rect && { left: rect.left - 3, top: rect.top - 3, width: rect.width + 6, height: rect.height + 6 };
    setHighlight(padded);
    setNotFound(!padded && Boolean(target.text || target.box));
    if (padded && frameRef.current) {
      const frame = frameRef.current;
      frame.scrollTo({
        top: Math.max(0, padded.top - frame.clientHeight / 3),
        left: Math.max(0, padded.left + padded.width / 2 - frame.clientWidth / 2),
        behavior: 'smooth',
      });
    }
  }, [rendered, target, frameRef]);

  const pages = doc?.numPages ?? 0;
  const turn = (delta: number) => setPageNumber((p) => Math.min(Math.max(1, p + delta), Math.max(1, pages)));
  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (event.key === 'PageDown' || (event.key === 'ArrowRight' && event.altKey)) {
      event.preventDefault();
      turn(1);
    } else if (event.key === 'PageUp' || (event.key === 'ArrowLeft' && event.altKey)) {
      event.preventDefault();
      turn(-1);
    }
  };

  const failure = file.error ?? error;
  return (
    <Box data-testid="datasheet-viewer" data-page={rendered?.pageNumber ?? 0}>
      <Group justify="space-between" mb={6} gap="xs" wrap="nowrap">
        <Text fz="sm" fw={500} truncate title={fileName}>
          {fileName}
        </Text>
        <Group gap={4} wrap="nowrap">
          <ActionIcon variant="subtle" color="gray" onClick={() => turn(-1)} disabled={pageNumber <= 1} aria-label="Previous page">
            <IconChevronLeft size={16} />
          </ActionIcon>
          <NumberInput
            size="xs"
            w={56}
            min={1}
            max={Math.max(1, pages)}
            value={pageNumber}
            onChange={(v) => typeof v === 'number' && v >= 1 && v <= pages && setPageNumber(v)}
            hideControls
            aria-label="Page"
          />
          <Text fz="xs" c="dimmed" w={36}>
            of {pages || '…'}
          </Text>
          <ActionIcon variant="subtle" color="gray" onClick={() => turn(1)} disabled={pageNumber >= pages} aria-label="Next page">
            <IconChevronRight size={16} />
          </ActionIcon>
          <Tooltip label="Smaller">
            <ActionIcon variant="subtle" color="gray" onClick={() => setZoomIndex((z) => Math.max(0, z - 1))} disabled={zoomIndex === 0} aria-label="Zoom out">
              <IconZoomOut size={16} />
            </ActionIcon>
          </Tooltip>
          <Text fz="xs" w={38} ta="center">
            {Math.round(ZOOMS[zoomIndex] * 100)} %
          </Text>
          <Tooltip label="Larger">
            <ActionIcon
              variant="subtle"
              color="gray"
              onClick={() => setZoomIndex((z) => Math.min(ZOOMS.length - 1, z + 1))}
              disabled={zoomIndex === ZOOMS.length - 1}
              aria-label="Zoom in"
            >
              <IconZoomIn size={16} />
            </ActionIcon>
          </Tooltip>
        </Group>
      </Group>
      {notFound && (
        <Text fz="xs" c="dimmed" mb={4}>
          Page {target?.page}: the printed text was not found in the page&apos;s text layer; look for “{target?.text}”.
        </Text>
      )}
      <div
        ref={frameRef}
        className={classes.frame}
        style={{ height }}
        tabIndex={0}
        onKeyDown={onKeyDown}
        aria-label={`Datasheet ${fileName}, page ${pageNumber} of ${pages}`}
        role="region"
      >
        {failure != null ? (
          <Alert color="red" role="alert" title="The datasheet cannot be shown">
            {describeError(failure)}
          </Alert>
        ) : (
          <>
            {!rendered && (
              <Center h={200}>
                <Loader size="sm" aria-label="Loading the datasheet" />
              </Center>
            )}
            <div ref={pageRef} className={classes.page} style={{ display: doc ? undefined : 'none' }}>
              <canvas ref={canvasRef} className={classes.canvas} />
              <div ref={textRef} className={classes.textLayer} />
              {highlight && (
                <div
                  className={classes.highlight}
                  data-testid="viewer-highlight"
                  style={{ left: highlight.left, top: highlight.top, width: highlight.width, height: highlight.height }}
                  key={target?.nonce}
                />
              )}
            </div>
          </>
        )}
      </div>
    </Box>
  );
}
