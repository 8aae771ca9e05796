import { fork, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { ExtractionResult } from '@shuntwise/contracts';
import { PdfReadError, type PdfReadErrorCode } from '../extraction';
import type { ChildMessage, ExtractRequest, OcrSettings } from './extraction-protocol';

/**
 * Reads uploaded files in child processes, so that one hostile PDF (a content stream that
 * inflates to gigabytes, a page that takes minutes) cannot stall or exhaust the API: each
 * file has a time limit and a memory limit, past which its child is killed and the file
 * refused; the next file gets a fresh child. Children stay up between files so pdfjs stays
 * loaded (a cold start costs about 0.3 s). Memory is watched from outside, as the child's
 * resident set (Linux /proc), because pdfjs keeps inflated streams in ArrayBuffers that a
 * V8 heap limit does not count.
 */

export interface ExtractionLimits {
  timeLimitMs: number;
  memoryLimitBytes: number;
  /** Extra time for each page read by OCR. */
  ocrMsPerPage: number;
  workers: number;
  ocr: OcrSettings;
}

export type ExtractionLimit = 'time' | 'memory' | 'crash';

/** The file broke a limit; the message is for the uploader (it becomes a 422). */
export class ExtractionLimitError extends Error {
  constructor(
    readonly limit: ExtractionLimit,
    message: string,
  ) {
    super(message);
    this.name = 'ExtractionLimitError';
  }
}

interface Job {
  bytes: Uint8Array;
  resolve: (result: ExtractionResult) => void;
  reject: (error: Error) => void;
}

interface Slot {
  child?: ChildProcess;
  ready?: Promise<ChildProcess>;
  busy: boolean;
}

const POLL_MS = 50;
const START_TIMEOUT_MS = 60_000;

/**
 * The child's entry beside this file: compiled JavaScript in the built app; under jest and
 * tsx (TypeScript sources) the child loads tsx to run the .ts entry.
 */
function childEntry(): { file: string; execArgv: string[] } {
  if (__filename.endsWith('.ts')) {
    return { file: join(__dirname, 'extraction-child.ts'), execArgv: ['--import', pathToFileURL(require.resolve('tsx')).href] };
  }
  return { file: join(__dirname, 'extraction-child.js'), execArgv: [] };
}

/** Resident set of a process in bytes, or undefined where /proc is not available. */
export function residentBytes(pid: number): number | undefined {
  try {
    const m = /VmRSS:\s+(\d+)\s+kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) * 1024 : undefined;
  } catch {
    return undefined;
  }
}

export class ExtractionPool {
  private readonly slots: Slot[];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;
  /** How many children were killed for breaking a limit (for tests and logs). */
  kills = 0;

  constructor(
    readonly limits: ExtractionLimits,
    private readonly log: (line: string) => void = () => undefined,
  ) {
    this.slots = Array.from({ length: Math.max(1, limits.workers) }, () => ({ busy: false }));
  }

  extract(bytes: Uint8Array): Promise<ExtractionResult> {
    if (this.closed) return Promise.reject(new Error('the extraction pool is closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ bytes, resolve, reject });
      this.pump();
    });
  }

  /** Starts the children now rather than on the first upload (optional). */
  async warm(): Promise<void> {
    await Promise.all(this.slots.map((s) => this.childOf(s)));
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) job.reject(new Error('the API is shutting down'));
    await Promise.all(this.slots.map((s) => this.stop(s)));
  }

  private pump(): void {
    for (const slot of this.slots) {
      if (slot.busy) continue;
      const job = this.queue.shift();
      if (!job) return;
      slot.busy = true;
      this.run(slot, job)
        .then(job.resolve, job.reject)
        .finally(() => {
          slot.busy = false;
          if (!this.closed) this.pump();
        });
    }
  }

  private childOf(slot: Slot): Promise<ChildProcess> {
    if (slot.ready) return slot.ready;
    const { file, execArgv } = childEntry();
    const heapMb = Math.max(64, Math.floor(this.limits.memoryLimitBytes / 1024 / 1024));
    const child = fork(file, [], {
      execArgv: [...execArgv, `--max-old-space-size=${heapMb}`],
      serialization: 'advanced',
      stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
    });
    slot.child = child;
    const ready = new Promise<ChildProcess>((resolve, reject) => {
      const timer = setTimeout(() => {
        child.kill('SIGKILL');
        reject(new Error('the extraction process did not start'));
      }, START_TIMEOUT_MS);
      const onMessage = (m: ChildMessage) => {
        if (m.type !== 'ready') return;
        clearTimeout(timer);
        child.off('message', onMessage);
        // An idle child does not keep the API (or a test run) alive; a job refs it again.
        child.unref();
        child.channel?.unref();
        resolve(child);
      };
      child.on('message', onMessage);
      child.once('exit', (code, signal) => {
        clearTimeout(timer);
        reject(new Error(`the extraction process ended while starting (${signal ?? `exit code ${code}`})`));
      });
    });
    child.once('exit', () => {
      if (slot.child === child) {
        slot.child = undefined;
        slot.ready = undefined;
      }
    });
    slot.ready = ready.catch((err: unknown) => {
      slot.ready = undefined;
      throw err;
    });
    return slot.ready;
  }

  private run(slot: Slot, job: Job): Promise<ExtractionResult> {
    return this.childOf(slot).then(
      (child) =>
        new Promise<ExtractionResult>((resolve, reject) => {
          const id = this.nextId++;
          const limits = this.limits;
          let deadline = Date.now() + limits.timeLimitMs;
          let ocrPages = 0;
          let settled = false;
          child.channel?.ref();
          const finish = (outcome: () => void) => {
            if (settled) return;
            settled = true;
            clearInterval(watch);
            child.off('message', onMessage);
            child.off('exit', onExit);
            child.channel?.unref();
            outcome();
          };
          const kill = (limit: ExtractionLimit, message: string) => {
            this.kills++;
            this.log(`extraction: killed the reader of a file (${limit} limit): ${message}`);
            // Forgotten at once, so the next file starts a fresh child rather than meeting this one dying.
            void this.stop(slot);
            finish(() => reject(new ExtractionLimitError(limit, message)));
          };
          const watch = setInterval(() => {
            const rss = residentBytes(child.pid!);
            if (rss !== undefined && rss > limits.memoryLimitBytes) {
              kill('memory', memoryMessage(limits));
            } else if (Date.now() > deadline) {
              kill('time', timeMessage(limits, ocrPages));
            }
          }, POLL_MS);
          const onMessage = (m: ChildMessage) => {
            if (!('id' in m) || m.id !== id) return;
            if (m.type === 'ocr-page') {
              ocrPages++;
              deadline += limits.ocrMsPerPage;
              return;
            }
            // A child that swelled while reading gives its memory back by being replaced.
            if (m.rssBytes > limits.memoryLimitBytes / 2) void this.stop(slot);
            if (m.type === 'done') finish(() => resolve(m.result));
            else finish(() => reject(m.error.code ? new PdfReadError(m.error.code as PdfReadErrorCode, m.error.message) : new Error(m.error.message)));
          };
          const onExit = (code: number | null, signal: NodeJS.Signals | null) => {
            if (slot.child === child) {
              slot.child = undefined;
              slot.ready = undefined;
            }
            finish(() =>
              reject(
                new ExtractionLimitError(
                  'crash',
                  `The PDF stopped the datasheet reader (it ended with ${signal ?? `exit code ${code}`} while reading this file). Nothing was saved. Upload an undamaged copy or enter the ratings by hand.`,
                ),
              ),
            );
          };
          child.on('message', onMessage);
          child.once('exit', onExit);
          const request: ExtractRequest = { type: 'extract', id, bytes: job.bytes, ocr: limits.ocr };
          child.send(request);
        }),
    );
  }

  private async stop(slot: Slot): Promise<void> {
    const child = slot.child;
    slot.child = undefined;
    slot.ready = undefined;
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    await new Promise<void>((resolve) => {
      child.once('exit', () => resolve());
      // Held until it has gone: an unref'd child would let a short-lived process end mid-wait.
      child.ref();
      child.kill('SIGKILL');
    });
  }
}

function timeMessage(limits: ExtractionLimits, ocrPages: number): string {
  const seconds = Math.round((limits.timeLimitMs + ocrPages * limits.ocrMsPerPage) / 1000);
  const ocr = ocrPages
    ? ` (${Math.round(limits.timeLimitMs / 1000)} s plus ${Math.round(limits.ocrMsPerPage / 1000)} s for each of its ${ocrPages} scanned page${ocrPages === 1 ? '' : 's'})`
    : '';
  return `The PDF took longer than the ${seconds} s allowed for reading one file${ocr}, so reading was stopped. Nothing was saved. Enter the ratings by hand, or upload a smaller copy.`;
}

function memoryMessage(limits: ExtractionLimits): string {
  const mb = Math.round(limits.memoryLimitBytes / 1024 / 1024);
  return `The PDF needed more than the ${mb} MB of memory allowed for reading one file (its content expands far beyond its size on disk), so reading was stopped. Nothing was saved. Upload an ordinary copy of the datasheet.`;
}
