import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { FileProblem } from './geotiff-reader.js';
import type { ParseReply } from './parse-worker.js';
import { type Parsed, type ParseRequest, parseRadarFile } from './radar-parse.js';

/**
 * Runs the intake's read phase (parseRadarFile) in a worker thread, one file at a time, so the event
 * loop stays free to answer `GET /api/jobs/:id` and everything else while a season is parsed and
 * tracked. A file's problems come back as the same FileProblem; an unexpected error or a worker that
 * dies fails the job as any other crash does (nothing of the read phase is stored before it ends).
 *
 * Built (server/dist) the worker is parse-worker.js beside this file. Run from the TypeScript sources
 * (vitest, tsx) it is parse-worker.ts, loaded through tsx's loader. If the worker cannot start at all
 * the files are read in this thread instead, as before, with a warning.
 */
export class FileParser {
  private constructor(
    private readonly worker: Worker | null,
    /** Why the files are read in this thread, when they are. */
    readonly inProcessReason: string | null,
  ) {}

  static async start(warn: (message: string) => void = () => undefined): Promise<FileParser> {
    if (process.env.INTAKE_WORKER === '0') return new FileParser(null, 'INTAKE_WORKER=0');
    let worker: Worker | null = null;
    try {
      worker = spawnWorker();
      await waitUntilReady(worker);
      return new FileParser(worker, null);
    } catch (e) {
      await worker?.terminate();
      const reason = `the intake worker thread did not start (${(e as Error).message}); reading files in the main thread`;
      warn(reason);
      return new FileParser(null, reason);
    }
  }

  /** Parses one file. The request's content is handed over to the worker, not copied, when it can be. */
  parse(req: ParseRequest): Promise<Parsed> {
    const worker = this.worker;
    if (!worker) return parseRadarFile(req);
    // A Buffer may be a slice of a shared pool: hand over only a buffer it owns whole.
    const owned = req.content.byteOffset === 0 && req.content.byteLength === req.content.buffer.byteLength;
    const content = owned ? req.content : new Uint8Array(req.content);
    return new Promise<Parsed>((resolve, reject) => {
      const cleanUp = () => {
        worker.off('message', onMessage);
        worker.off('error', onError);
        worker.off('exit', onExit);
      };
      const onMessage = (reply: ParseReply) => {
        cleanUp();
        if (reply.ok) resolve(reply.parsed);
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
        reject(
          new Error(`the intake worker thread stopped while reading ${req.fileName} (exit code ${code})`),
        );
      };
      worker.on('message', onMessage);
      worker.on('error', onError);
      worker.on('exit', onExit);
      worker.postMessage({ ...req, content }, [content.buffer as ArrayBuffer]);
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
    return new Worker(new URL('./parse-worker.js', import.meta.url), options);
  // Running from the TypeScript sources (vitest, tsx): tsx's loader registers itself in the main
  // thread only, so a small ESM bootstrap registers it in the worker, then imports the worker module.
  const tsxDir = dirname(createRequire(import.meta.url).resolve('tsx/package.json'));
  const tsxApi = pathToFileURL(join(tsxDir, 'dist/esm/api/index.mjs')).href;
  const entry = new URL('./parse-worker.ts', import.meta.url).href;
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
