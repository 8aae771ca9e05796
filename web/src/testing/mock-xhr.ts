import { vi } from 'vitest';

export interface XhrCall {
  method: string;
  url: string;
  headers: Record<string, string>;
  form: FormData | null;
}

export interface XhrReply {
  status: number;
  body?: unknown;
  /** Progress fractions reported before the answer (default 0.5 and 1). */
  progress?: number[];
}

/**
 * Stubs XMLHttpRequest (the uploads use it for progress events): each request is
 * answered by `reply` after its progress events, asynchronously as a browser would.
 */
export function mockXhr(reply: (call: XhrCall) => XhrReply | Promise<XhrReply>) {
  const calls: XhrCall[] = [];

  class FakeXhr {
    status = 0;
    statusText = '';
    responseText = '';
    responseType = '';
    upload: { onprogress: ((e: { lengthComputable: boolean; loaded: number; total: number }) => void) | null } = { onprogress: null };
    onload: (() => void) | null = null;
    onerror: (() => void) | null = null;
    onabort: (() => void) | null = null;
    private call: XhrCall = { method: '', url: '', headers: {}, form: null };

    open(method: string, url: string) {
      this.call = { method, url, headers: {}, form: null };
    }

    setRequestHeader(name: string, value: string) {
      this.call.headers[name] = value;
    }

    abort() {
      this.onabort?.();
    }

    send(body: FormData) {
      this.call.form = body;
      calls.push(this.call);
      void (async () => {
        const answer = await reply(this.call);
        for (const fraction of answer.progress ?? [0.5, 1]) {
          await new Promise((r) => setTimeout(r, 5));
          this.upload.onprogress?.({ lengthComputable: true, loaded: fraction * 100, total: 100 });
        }
        await new Promise((r) => setTimeout(r, 5));
        this.status = answer.status;
        this.responseText = answer.body === undefined ? '' : JSON.stringify(answer.body);
        this.onload?.();
      })();
    }
  }

  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return { calls };
}
