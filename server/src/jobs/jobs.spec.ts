import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';
import { JobsService } from './jobs.service.js';

describe('jobs', () => {
  let t: TestApp;
  let jobs: JobsService;
  beforeAll(async () => {
    t = await createTestApp();
    jobs = t.app.get(JobsService);
  });
  afterAll(() => t.close());

  it('marks a job that was running when the server stopped as failed at the next start', async () => {
    await t.db.pg.query("insert into jobs (kind, state, progress) values ('radar-intake', 'running', 0.4)");
    await jobs.onApplicationBootstrap();
    const [job] = await jobs.list(1);
    expect(job).toMatchObject({
      state: 'failed',
      error: expect.stringMatching(/server stopped while this job ran/),
    });
  });

  it('runs jobs one at a time, records progress and the outcome, and survives a crash in one', async () => {
    const seen: number[] = [];
    jobs.register('test-work', async (params, ctx) => {
      await ctx.progress(0.5, 'Halfway');
      if (params.crash) throw new Error('boom');
      seen.push(Number(params.n));
      return { result: { n: params.n }, problems: [] };
    });
    const a = await jobs.enqueue('test-work', { n: 1 }, null);
    const b = await jobs.enqueue('test-work', { n: 2, crash: true }, null);
    const c = await jobs.enqueue('test-work', { n: 3 }, null);
    await jobs.idle();
    expect(seen).toEqual([1, 3]);
    expect(await jobs.get(a.job.id)).toMatchObject({ state: 'done', progress: 1, stage: 'Finished' });
    expect(await jobs.get(b.job.id)).toMatchObject({
      state: 'failed',
      error: expect.stringMatching(/unexpected error.*boom/),
    });
    expect((await jobs.get(c.job.id)).state).toBe('done');
  });

  it('refuses work of a kind nobody handles', async () => {
    await expect(jobs.enqueue('no-such-kind', {}, null)).rejects.toThrow(
      /No handler for jobs of kind no-such-kind/,
    );
  });
});
