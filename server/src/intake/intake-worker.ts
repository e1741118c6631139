import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { FileProblem } from './file-problem.js';
import type { TrackRequest, WorkerReply, WorkerRequest } from './intake-worker.entry.js';
import { type PreparedTrack, tracksByEngine } from './prepare-cells.js';
import { type Parsed, type ParseRequest, parseRadarFile, siteContext } from './radar-parse.js';

/**
 * Runs the intake job's CPU-bound steps in a worker thread, one at a time: reading a file
 * (parseRadarFile) and re-tracking a site's cells (tracksByEngine). The event loop stays free to
 * answer `GET /api/jobs/:id` and everything else while a season is parsed and tracked. A file's problems come back as the same FileProblem; an unexpected error or a worker that
 * dies fails the job as any other crash does (nothing of the read phase is stored before it ends).
 *
 * Built (server/dist) the worker is intake-worker.entry.js beside this file. Run from the TypeScript sources
 * (vitest, tsx) it is intake-worker.entry.ts, loaded through tsx's loader. If the worker cannot start at all
 * the files are read in this thread instead, as before, with a warning.
 */
export class IntakeWorker {
  private constructor(
    private readonly worker: Worker | null,
    /** Why the files are read in this thread, when they are. */
    readonly inProcessReason: string | null,
  ) {}

  static async start(warn: (message: string) => void = () => undefined): Promise<IntakeWorker> {
    if (process.env.INTAKE_WORKER === '0') return new IntakeWorker(null, 'INTAKE_WORKER=0');
    let worker: Worker | null = null;
    try {
      worker = spawnWorker();
      await waitUntilReady(worker);
      return new IntakeWorker(worker, null);
    } catch (e) {
      await worker?.terminate();
      const reason = `the intake worker thread did not start (${(e as Error).message}); reading files in the main thread`;
      warn(reason);
      return new IntakeWorker(null, reason);
    }
  }

  /** Parses one file. The request's content is handed over to the worker, not copied, when it can be. */
  parse(req: ParseRequest): Promise<Parsed> {
    if (!this.worker) return parseRadarFile(req);
    // A Buffer may be a slice of a shared pool: hand over only a buffer it owns whole.
    const owned = req.content.byteOffset === 0 && req.content.byteLength === req.content.buffer.byteLength;
    const content = owned ? req.content : new Uint8Array(req.content);
    return this.ask(this.worker, { op: 'parse', req: { ...req, content } }, req.fileName, [
      content.buffer as ArrayBuffer,
    ]) as Promise<Parsed>;
  }

  /** Tracks cells across scans (tracksByEngine) with the site's settings. */
  track(req: TrackRequest): Promise<PreparedTrack[]> {
    if (!this.worker) return Promise.resolve(tracksByEngine(req.cells, siteContext(req.site, req.settings)));
    return this.ask(this.worker, { op: 'track', req }, 'the tracking step') as Promise<PreparedTrack[]>;
  }

  private ask(
    worker: Worker,
    message: WorkerRequest,
    what: string,
    transfer: ArrayBuffer[] = [],
  ): Promise<Parsed | PreparedTrack[]> {
    return new Promise((resolve, reject) => {
      const cleanUp = () => {
        worker.off('message', onMessage);
        worker.off('error', onError);
        worker.off('exit', onExit);
      };
      const onMessage = (reply: WorkerReply) => {
        cleanUp();
        if (reply.ok) resolve(reply.value);
        else if ('problem' in reply)
          reject(new FileProblem(reply.problem.where, reply.problem.problem, reply.problem.all));
        else reject(Object.assign(new Error(reply.error.message), { stack: reply.error.stack }));
      };
      const onError = (e: Error) => {
        cleanUp();
        reject(e);
      };
      const onExit = (code: number) => {
        cleanUp();
        reject(new Error(`the intake worker thread stopped during ${what} (exit code ${code})`));
      };
      worker.on('message', onMessage);
      worker.on('error', onError);
      worker.on('exit', onExit);
      worker.postMessage(message, transfer);
    });
  }

  async close(): Promise<void> {
    await this.worker?.terminate();
  }
}

function spawnWorker(): Worker {
  // An empty workerData: the geotiff package's web-worker shim reads workerData in every thread
  // and, without an object there, fails to load.
  const options = { workerData: {} };
  if (!import.meta.url.endsWith('.ts'))
    return new Worker(new URL('./intake-worker.entry.js', import.meta.url), options);
  // Running from the TypeScript sources (vitest, tsx): tsx's loader registers itself in the main
  // thread only, so a small ESM bootstrap registers it in the worker, then imports the worker module.
  const tsxDir = dirname(createRequire(import.meta.url).resolve('tsx/package.json'));
  const tsxApi = pathToFileURL(join(tsxDir, 'dist/esm/api/index.mjs')).href;
  const entry = new URL('./intake-worker.entry.ts', import.meta.url).href;
  const bootstrap = `const { register } = await import(${JSON.stringify(tsxApi)}); register(); await import(${JSON.stringify(entry)});`;
  return new Worker(new URL(`data:text/javascript,${encodeURIComponent(bootstrap)}`), options);
}

function waitUntilReady(worker: Worker): Promise<void> {
  return new Promise((resolve, reject) => {
    const settle = (error: Error | null) => {
      clearTimeout(timer);
      worker.off('message', onMessage);
      worker.off('error', settle);
      worker.off('exit', onExit);
      if (error) reject(error);
      else resolve();
    };
    const onMessage = (m: unknown) =>
      settle(m === 'ready' ? null : new Error(`unexpected first message ${JSON.stringify(m)}`));
    const onExit = (code: number) => settle(new Error(`exit code ${code}`));
    const timer = setTimeout(() => settle(new Error('no answer within 60 s')), 60_000);
    worker.on('message', onMessage);
    worker.on('error', settle);
    worker.on('exit', onExit);
  });
}
