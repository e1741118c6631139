import { vi } from 'vitest';

/** A request as a fake handler sees it. */
export interface FakeRequest {
  method: string;
  path: string;
  query: URLSearchParams;
  headers: Record<string, string>;
  /** Parsed JSON, a FormData, or undefined. */
  body: unknown;
}

export interface FakeReply {
  status?: number;
  body?: unknown;
}

type Handler = (req: FakeRequest) => FakeReply | Promise<FakeReply>;

/** "METHOD /api/path" → a fixed reply or a function of the request. */
export type FakeRoutes = Record<string, Handler | FakeReply>;

/**
 * A faked server for whole-route tests: routes are "METHOD /api/path" (query ignored). A call no
 * route answers is recorded in `unhandled` and answered 501, so a test can tell it was not expected.
 */
export function fakeApi(routes: FakeRoutes) {
  const calls: FakeRequest[] = [];
  const unhandled: string[] = [];

  async function answer(req: FakeRequest): Promise<{ status: number; text: string }> {
    calls.push(req);
    const route = routes[`${req.method} ${req.path}`];
    if (!route) {
      unhandled.push(`${req.method} ${req.path}`);
      return { status: 501, text: JSON.stringify({ statusCode: 501, message: `No fake for ${req.path}` }) };
    }
    const reply = typeof route === 'function' ? await route(req) : route;
    const status = reply.status ?? 200;
    return { status, text: reply.body === undefined ? '' : JSON.stringify(reply.body) };
  }

  function toRequest(
    url: string,
    method: string,
    headers: Record<string, string>,
    body: unknown,
  ): FakeRequest {
    const parsed = new URL(url, 'http://stormhour.test');
    return { method, path: parsed.pathname, query: parsed.searchParams, headers, body };
  }

  vi.stubGlobal('fetch', async (input: string, init: RequestInit = {}) => {
    const headers = Object.fromEntries(
      Object.entries((init.headers ?? {}) as Record<string, string>).map(([k, v]) => [k.toLowerCase(), v]),
    );
    const raw = init.body;
    const body = typeof raw === 'string' ? JSON.parse(raw) : (raw ?? undefined);
    const { status, text } = await answer(toRequest(String(input), init.method ?? 'GET', headers, body));
    // A 204 may carry no body at all.
    return new Response(status === 204 ? null : text, { status });
  });

  class FakeXMLHttpRequest {
    status = 0;
    responseText = '';
    upload: { onprogress: ((event: ProgressEvent) => void) | null } = { onprogress: null };
    onload: (() => void) | null = null;
    onerror: (() => void) | null = null;
    private method = 'GET';
    private url = '';
    private headers: Record<string, string> = {};

    open(method: string, url: string) {
      this.method = method;
      this.url = url;
    }
    setRequestHeader(name: string, value: string) {
      this.headers[name.toLowerCase()] = value;
    }
    send(body: unknown) {
      this.upload.onprogress?.({ lengthComputable: true, loaded: 1, total: 2 } as ProgressEvent);
      void answer(toRequest(this.url, this.method, this.headers, body)).then(({ status, text }) => {
        this.status = status;
        this.responseText = text;
        this.onload?.();
      });
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeXMLHttpRequest);

  return { calls, unhandled };
}
