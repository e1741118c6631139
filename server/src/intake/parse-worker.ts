/**
 * Worker-thread entry of the intake's read phase: parses one file per message with parseRadarFile
 * and answers with the result, the file's problems, or the unexpected error. See parse-in-worker.ts.
 */
import { parentPort } from 'node:worker_threads';
import { FileProblem } from './geotiff-reader.js';
import { type ParseRequest, parseRadarFile } from './radar-parse.js';

export type ParseReply =
  | { ok: true; parsed: Awaited<ReturnType<typeof parseRadarFile>> }
  | { ok: false; problem: { where: string | null; problem: string; all: FileProblem['all'] } }
  | { ok: false; error: { message: string; stack?: string } };

parentPort?.on('message', async (req: ParseRequest) => {
  let reply: ParseReply;
  try {
    reply = { ok: true, parsed: await parseRadarFile(req) };
  } catch (e) {
    reply =
      e instanceof FileProblem
        ? { ok: false, problem: { where: e.where, problem: e.message, all: e.all } }
        : { ok: false, error: { message: (e as Error)?.message ?? String(e), stack: (e as Error)?.stack } };
  }
  parentPort?.postMessage(reply);
});

parentPort?.postMessage('ready');
