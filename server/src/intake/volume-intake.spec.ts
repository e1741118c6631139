import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobsService } from '../jobs/jobs.service.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
const runDir = join(demo, readdirSync(demo).find((f) => f.startsWith('run-')) as string);
const volumes = readdirSync(runDir)
  .filter((f) => f.startsWith('volume-'))
  .sort();

describe('volume intake through the API', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let siteId: number;
  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 10 * 1024 * 1024 });
    auth = { Authorization: `Bearer ${await t.signedIn('scientist')}` };
    siteId = (await t.http.post('/api/radar-sites').set(auth).send(site.createSiteRequest).expect(201)).body
      .id;
  });
  afterAll(() => t.close());

  async function upload(id: number, names: string[]) {
    const req = t.http.post('/api/intake').set(auth).field('siteId', String(id)).field('kind', 'volume');
    for (const n of names) req.attach('files[]', readFileSync(join(runDir, n)), n);
    const res = await req.expect(202);
    await t.app.get(JobsService).idle();
    return (await t.http.get(`/api/jobs/${res.body.id}`).set(auth).expect(200)).body;
  }

  it('re-tracks when a scan arrives after a later one, so its cells join the same tracks', async () => {
    const later = await upload(siteId, [volumes[2], volumes[3]]);
    expect(later.state).toBe('done');
    const earlier = await upload(siteId, [volumes[1]]);
    expect(earlier.report).toMatchObject({ filesRead: 1, scans: 1 });
    const tracks = await t.http
      .get(`/api/tracks?siteId=${siteId}&stormsOnly=true&limit=1000`)
      .set(auth)
      .expect(200);
    // Every storm now spans the three scans where it lived through them; many do.
    const threeScan = tracks.body.items.filter((x: { scanCount: number }) => x.scanCount === 3);
    expect(threeScan.length).toBeGreaterThan(10);
    // A track starting in the first volume scan we hold was not seen starting: not an onset.
    const first = tracks.body.items.filter(
      (x: { firstTime: string }) => x.firstTime === tracks.body.items[0].firstTime,
    );
    expect(
      first.every(
        (x: { notOnsetReason: string | null }) =>
          x.notOnsetReason === 'data-start' || x.notOnsetReason === 'edge-band',
      ),
    ).toBe(true);
    const detail = await t.http.get(`/api/tracks/${threeScan[0].id}`).set(auth).expect(200);
    expect(detail.body.cells[0]).toMatchObject({ cellType: expect.any(String) });
    expect(detail.body.cells[0].vilMaxKgM2).toBeGreaterThan(0);
    const cells = await t.http
      .get(`/api/cells?siteId=${siteId}&scanTime=${detail.body.cells[0].scanTime}`)
      .set(auth)
      .expect(200);
    expect(cells.body.length).toBeGreaterThan(5);
  });

  it('refuses a volume far outside the coverage of the site it is uploaded to', async () => {
    const far = await t.http
      .post('/api/radar-sites')
      .set(auth)
      .send({ ...site.createSiteRequest, code: 'FAR', lat: 25, lon: 95 })
      .expect(201);
    const job = await upload(far.body.id, [volumes[0]]);
    expect(job.problems[0]).toMatchObject({
      file: volumes[0],
      problem: expect.stringMatching(/outside its 180 km coverage: is it another site's file\?/),
    });
    expect(job.files[0].state).toBe('skipped');
  });
});
