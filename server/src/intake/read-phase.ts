import type { JobFile, JobProblem } from '../jobs/job-problem.js';
import type { JobContext, JobOutcome } from '../jobs/jobs.service.js';
import { FileProblem } from './geotiff-reader.js';
import type { UploadStore } from './upload-store.js';
import type { UploadsRepository } from './uploads.repository.js';

export interface FileRef {
  uploadId: number;
  fileName: string;
  duplicate: boolean;
}

export interface ReadPhase<T> {
  files: JobFile[];
  /** The files to store, in upload order; duplicates are left out. */
  todo: JobFile[];
  parsed: Map<number, T>;
  problems: JobProblem[];
  /** Set when a bad file stopped the job as the user asked: return it, store nothing. */
  stopped?: JobOutcome;
}

/**
 * The first half of every intake job: read and check each file (progress 0–0.5), storing nothing.
 * A file with problems is skipped, or stops the whole job, as the uploader chose.
 */
export async function readEveryFile<T>(
  refs: FileRef[],
  onError: 'fail' | 'skip',
  ctx: JobContext,
  deps: { uploads: UploadsRepository; store: UploadStore },
  parse: (content: Buffer, fileName: string) => Promise<T>,
): Promise<ReadPhase<T>> {
  const files: JobFile[] = refs.map((f) => ({
    uploadId: f.uploadId,
    fileName: f.fileName,
    sizeBytes: 0,
    duplicate: f.duplicate,
    state: f.duplicate ? 'duplicate' : 'waiting',
  }));
  const problems: JobProblem[] = [];
  const parsed = new Map<number, T>();
  const todo = files.filter((f) => !f.duplicate);
  for (const [n, f] of todo.entries()) {
    await ctx.progress((0.5 * n) / todo.length, `Reading ${f.fileName} (${n + 1} of ${todo.length})`);
    const upload = await deps.uploads.find(f.uploadId);
    if (!upload) throw new Error(`upload ${f.uploadId} vanished`);
    f.sizeBytes = upload.sizeBytes;
    try {
      parsed.set(f.uploadId, await parse(await deps.store.read(upload.sha256), f.fileName));
    } catch (e) {
      if (!(e instanceof FileProblem)) throw e;
      for (const one of e.all) problems.push({ file: f.fileName, ...one });
      f.state = onError === 'fail' ? 'failed' : 'skipped';
      if (onError === 'fail') {
        await ctx.setFiles(files);
        const error = `${f.fileName} has problems, so the job stopped as asked and nothing was stored.`;
        return { files, todo, parsed, problems, stopped: { result: {}, problems, error } };
      }
    }
  }
  await ctx.setFiles(files);
  return { files, todo, parsed, problems };
}
