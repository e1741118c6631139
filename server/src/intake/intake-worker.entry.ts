/**
 * Worker-thread entry of the intake job's CPU-bound steps: parsing one file (parseRadarFile) or
 * tracking a site's cells (tracksByEngine), one request per message, answered with the result, the
 * file's problems, or the unexpected error. See intake-worker.ts.
 */
import { parentPort } from 'node:worker_threads';
import type { SiteSettings, SiteView } from '@stormhour/shared';
import { FileProblem } from './file-problem.js';
import { type PreparedCell, type PreparedTrack, tracksByEngine } from './prepare-cells.js';
import { type Parsed, type ParseRequest, parseRadarFile, siteContext } from './radar-parse.js';

export interface TrackRequest {
  cells: PreparedCell[];
  site: SiteView;
  settings: SiteSettings;
}

export type WorkerRequest = { op: 'parse'; req: ParseRequest } | { op: 'track'; req: TrackRequest };

export type WorkerReply =
  | { ok: true; value: Parsed | PreparedTrack[] }
  | { ok: false; problem: { where: string | null; problem: string; all: FileProblem['all'] } }
  | { ok: false; error: { message: string; stack?: string } };

async function handle(message: WorkerRequest): Promise<Parsed | PreparedTrack[]> {
  if (message.op === 'parse') return parseRadarFile(message.req);
  const { cells, site, settings } = message.req;
  return tracksByEngine(cells, siteContext(site, settings));
}

parentPort?.on('message', async (message: WorkerRequest) => {
  let reply: WorkerReply;
  try {
    reply = { ok: true, value: await handle(message) };
  } catch (e) {
    reply =
      e instanceof FileProblem
        ? { ok: false, problem: { where: e.where, problem: e.message, all: e.all } }
        : { ok: false, error: { message: (e as Error)?.message ?? String(e), stack: (e as Error)?.stack } };
  }
  parentPort?.postMessage(reply);
});

parentPort?.postMessage('ready');
