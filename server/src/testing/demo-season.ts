import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { JobsService } from '../jobs/jobs.service.js';
import type { TestApp } from './test-app.js';

/** The committed demo scenario (sample-data/vessary), read by API specs through the same routes users call. */
export const DEMO_DIR = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
export const DEMO_SITE = JSON.parse(readFileSync(join(DEMO_DIR, 'site.json'), 'utf8'));
export const DEMO_FILES = {
  blocks: 'blocks.geojson',
  grids: ['q', 'u', 'v'].map((v) => `anomalies-2025-${v}850.tif`),
  scans: 'scans-2025.csv',
  cells: 'cells-2025.csv',
};

export type Auth = { Authorization: string };

/** Uploads demo files through intake, waits for the job and returns it as `GET /api/jobs/:id` shows it. */
export async function uploadDemo(
  t: TestApp,
  auth: Auth,
  siteId: number,
  kind: string,
  names: string[],
  fields: Record<string, string> = {},
) {
  const req = t.http.post('/api/intake').set(auth).field('siteId', String(siteId)).field('kind', kind);
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  for (const n of names) req.attach('files[]', readFileSync(join(DEMO_DIR, n)), n);
  const res = await req.expect(202);
  await t.app.get(JobsService).idle();
  return (await t.http.get(`/api/jobs/${res.body.id}`).set(auth).expect(200)).body;
}

/**
 * The whole demo season as a scientist loads it: blocks (as admin), the radar site, the anomaly grids,
 * the scan inventory and the season's cell table. Slow (the cell table is tracked): call it in beforeAll
 * with a few minutes' timeout.
 */
export async function loadDemoSeason(t: TestApp): Promise<{ siteId: number; scientist: Auth }> {
  const admin = { Authorization: `Bearer ${await t.signedIn('admin')}` };
  await t.http
    .post('/api/blocks/import')
    .set(admin)
    .attach('file', readFileSync(join(DEMO_DIR, DEMO_FILES.blocks)), DEMO_FILES.blocks)
    .expect(201);
  const scientist = { Authorization: `Bearer ${await t.signedIn('scientist')}` };
  const siteId: number = (
    await t.http.post('/api/radar-sites').set(scientist).send(DEMO_SITE.createSiteRequest).expect(201)
  ).body.id;
  for (const [kind, names] of [
    ['anomaly-grid', DEMO_FILES.grids],
    ['scan-inventory', [DEMO_FILES.scans]],
    ['cell-table', [DEMO_FILES.cells]],
  ] as const) {
    expect((await uploadDemo(t, scientist, siteId, kind, [...names])).state, kind).toBe('done');
  }
  return { siteId, scientist };
}
