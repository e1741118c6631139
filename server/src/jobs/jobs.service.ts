import { Injectable, Logger, NotFoundException, type OnApplicationBootstrap } from '@nestjs/common';
import type { JobView, QualityReport } from '@stormhour/shared';
import type { JobFile, JobProblem } from './job-problem.js';
import { type JobRow, JobsRepository } from './jobs.repository.js';

/** What a job's work may tell the runner while it goes. */
export interface JobContext {
  jobId: number;
  /** Progress 0–1 with what is being done, in words; written at most a few times a second. */
  progress(fraction: number, stage?: string): Promise<void>;
  setFiles(files: JobFile[]): Promise<void>;
}

export interface JobOutcome {
  result: Record<string, unknown>;
  problems: JobProblem[];
  /** Set when the job as a whole failed (nothing of it was stored). */
  error?: string;
}

export type JobHandler = (params: Record<string, unknown>, ctx: JobContext) => Promise<JobOutcome>;

export function toJobView(row: JobRow): JobView {
  return {
    id: row.id,
    kind: row.kind,
    state: row.state,
    progress: row.progress,
    stage: row.stage,
    params: row.params,
    files: row.files,
    report:
      row.kind === 'radar-intake' && row.result && 'filesRead' in row.result
        ? (row.result as unknown as QualityReport)
        : null,
    summary: typeof row.result?.summary === 'string' ? row.result.summary : null,
    problems: row.problems,
    error: row.error,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

/**
 * Runs long work one job at a time in this process, with its state and progress in the database so
 * the client can follow it. Jobs left unfinished by a crash or restart are marked failed at start:
 * each file's rows are written in one transaction, so nothing of them is half-stored.
 */
@Injectable()
export class JobsService implements OnApplicationBootstrap {
  private readonly logger = new Logger('Jobs');
  private readonly handlers = new Map<string, JobHandler>();
  private queue: Promise<void> = Promise.resolve();

  constructor(private readonly jobs: JobsRepository) {}

  async onApplicationBootstrap(): Promise<void> {
    for (const job of await this.jobs.unfinished()) {
      await this.jobs.update(job.id, {
        state: 'failed',
        finishedAt: new Date(),
        error:
          'The server stopped while this job ran. Files it had not finished were not stored; upload them again.',
      });
    }
  }

  register(kind: string, handler: JobHandler): void {
    this.handlers.set(kind, handler);
  }

  async enqueue(
    kind: string,
    params: Record<string, unknown>,
    createdBy: number | null,
    files: JobFile[] = [],
  ) {
    if (!this.handlers.has(kind)) throw new Error(`No handler for jobs of kind ${kind}`);
    const job = await this.jobs.insert({ kind, params, createdBy, files });
    const done = this.queue.then(() => this.run(job.id, kind, params));
    this.queue = done.catch(() => undefined);
    return { job: toJobView(job), done };
  }

  async get(id: number): Promise<JobView> {
    const row = await this.jobs.find(id);
    if (!row) throw new NotFoundException(`There is no job with id ${id}.`);
    return toJobView(row);
  }

  async list(limit = 50): Promise<JobView[]> {
    return (await this.jobs.list(limit)).map(toJobView);
  }

  /** Resolves when every job queued so far has finished (tests, demo loading). */
  idle(): Promise<void> {
    return this.queue;
  }

  private async run(id: number, kind: string, params: Record<string, unknown>): Promise<void> {
    const handler = this.handlers.get(kind) as JobHandler;
    await this.jobs.update(id, { state: 'running', startedAt: new Date(), stage: 'Starting' });
    let lastWrite = 0;
    const ctx: JobContext = {
      jobId: id,
      progress: async (fraction, stage) => {
        const now = Date.now();
        if (now - lastWrite < 200 && fraction < 1) return;
        lastWrite = now;
        await this.jobs.update(id, {
          progress: Math.max(0, Math.min(1, fraction)),
          ...(stage ? { stage } : {}),
        });
      },
      setFiles: (files) => this.jobs.update(id, { files }),
    };
    try {
      const outcome = await handler(params, ctx);
      await this.jobs.update(id, {
        state: outcome.error ? 'failed' : 'done',
        progress: 1,
        stage: outcome.error ? 'Failed' : 'Finished',
        result: outcome.result,
        problems: outcome.problems,
        error: outcome.error ?? null,
        finishedAt: new Date(),
      });
    } catch (err) {
      this.logger.error(`Job ${id} (${kind}) crashed: ${err instanceof Error ? err.stack : String(err)}`);
      await this.jobs.update(id, {
        state: 'failed',
        stage: 'Failed',
        error: `The job stopped on an unexpected error; nothing of the file being processed was stored. (${err instanceof Error ? err.message : String(err)})`,
        finishedAt: new Date(),
      });
    }
  }
}
