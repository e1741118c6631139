/**
 * npm run bench:outlook — the block outlook on ten generated seasons (about 50 000 onset tracks,
 * 293 000 scans, 500 blocks, 9 regimes): the full outlook's time cold (load, count, serialise) and
 * cached, then GET /api/outlook under 50 concurrent clients with autocannon on 127.0.0.1.
 * Last lines: `outlook-cold-first-in-process-ms`, `outlook-cold-ms: X` (cold after new data) and
 * `outlook-cached-p99-ms: Y` (goals: X < 500 and Y < 20).
 */
import { createServer } from 'node:http';
import { createRequire } from 'node:module';
import type { AddressInfo } from 'node:net';
import { app, base, call, ms, percentile, pg, seasonStart, siteId, token } from './generated-seasons.js';

const dist = (path: string) => new URL(`../dist/${path}`, import.meta.url).href;
const { OutlookService } = (await import(
  dist('outlook/outlook.service.js')
)) as typeof import('../src/outlook/outlook.service.js');
const { OutlookRepository } = (await import(
  dist('outlook/outlook.repository.js')
)) as typeof import('../src/outlook/outlook.repository.js');
const { RegimesService } = (await import(
  dist('regimes/regimes.service.js')
)) as typeof import('../src/regimes/regimes.service.js');

/** The part of autocannon (a load generator for HTTP servers) used here; it ships no types. */
interface LoadResult {
  requests: { average: number };
  latency: { p50: number; p99: number };
  non2xx: number;
  errors: number;
}
const autocannon = createRequire(import.meta.url)('autocannon') as (opts: {
  url: string;
  connections: number;
  duration: number;
  headers: Record<string, string>;
  /** Load generated on this many worker threads, so the generator does not share the server's event loop. */
  workers: number;
}) => Promise<LoadResult>;

const CONNECTIONS = 50;
const DURATION_S = 10;

const regimes = (
  await call<{ counts: { regime: string; days: number }[] }>(
    'GET',
    `/api/regimes?siteId=${siteId}`,
    undefined,
    token,
  )
).counts;
console.log(`regimes: ${regimes.length} (${regimes.map((r) => `${r.regime} ${r.days} d`).join(', ')})`);

// Where a cold outlook's time goes, each part timed on its own (median of 3).
async function timed(what: string, work: () => Promise<unknown>) {
  const runs: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    await work();
    runs.push(performance.now() - t0);
  }
  console.log(`  ${what}: ${ms(percentile(runs, 50))}`);
}
const repo = app.get(OutlookRepository);
const all = { from: null, to: null };
console.log('parts of a cold outlook:');
await timed('data fingerprint (one query)', () => repo.dataVersion(siteId));
await timed('onset times and blocks, every source (one read)', () => repo.onsetsBySource(siteId, all));
await timed('scans per local hour, 10 seasons (scan_hours)', () =>
  repo.scanHours(siteId, 'cell-table', { from: null, to: null }),
);
await timed('onset columns with start places (a neighbourhood needs them)', () =>
  repo.onsets(siteId, 'cell-table', all),
);
await timed('regimes of 1 220 days', () => app.get(RegimesService).regimes(siteId));

const service = app.get(OutlookService);
const query = (regime: string) => ({
  siteId,
  regime,
  binHours: 3,
  measure: 'onsets' as const,
  radiusKm: 0,
  interval: 'jeffreys' as const,
  afternoonFrom: 12,
  afternoonTo: 18,
});
const chosen = regimes[0].regime;
let t0 = performance.now();
const first = await service.outlook(query(chosen));
const coldMs = performance.now() - t0;
console.log(
  `full outlook, cold, first in this process (load ${first.body.blocks.length} blocks × ${first.body.bins.length} bins, count, climatology, serialise ${(first.json.length / 1e6).toFixed(2)} MB, gzip ${(first.gzip.length / 1e3).toFixed(0)} kB), regime "${chosen}": ${ms(coldMs)}`,
);
t0 = performance.now();
for (const r of regimes.slice(1)) await service.outlook(query(r.regime));
console.log(
  `the other ${regimes.length - 1} regimes, columns already loaded: ${ms((performance.now() - t0) / (regimes.length - 1))} each`,
);
// What a user meets after each intake: new data, so every cached answer and loaded column is stale,
// but the code has run before. One scan is added (off the 6-minute grid) before each of three runs.
const afterNewData: number[] = [];
for (let k = 1; k <= 3; k++) {
  await pg.query(`insert into scans (site_id, source, time) values ($1, 'scan-inventory', $2)`, [
    siteId,
    new Date(seasonStart(0) + 86_400_000 + k * 60_000).toISOString(),
  ]);
  t0 = performance.now();
  await service.outlook(query(chosen));
  afterNewData.push(performance.now() - t0);
}
const coldAfterNewDataMs = percentile(afterNewData, 50);
console.log(
  `full outlook, cold after new data (a scan added, so nothing cached is valid; code already run), regime "${chosen}": ${afterNewData.map(ms).join(', ')}; median ${ms(coldAfterNewDataMs)}`,
);
const cachedTimes: number[] = [];
for (let i = 0; i < 200; i++) {
  t0 = performance.now();
  await service.outlook(query(chosen));
  cachedTimes.push(performance.now() - t0);
}
console.log(
  `full outlook, cached (fingerprint query + lookup): median ${ms(percentile(cachedTimes, 50))}, p99 ${ms(percentile(cachedTimes, 99))}`,
);

const headers = { Authorization: `Bearer ${token}`, 'Accept-Encoding': 'gzip' };
const url = `${base}/api/outlook?siteId=${siteId}&regime=${encodeURIComponent(chosen)}`;
const result = await autocannon({ url, connections: CONNECTIONS, duration: DURATION_S, workers: 1, headers });
console.log(
  `GET /api/outlook, ${CONNECTIONS} clients, ${DURATION_S} s on 127.0.0.1 (gzip as browsers ask; load generated on a worker thread): ${result.requests.average.toFixed(0)} req/s, latency median ${result.latency.p50} ms, p99 ${result.latency.p99} ms, ${result.non2xx} non-2xx, ${result.errors} errors`,
);

// A browser holding the answer asks again with its ETag (the answer is sent "no-cache") and gets
// 304 with no body: the app's own cost per request, without the bytes the load generator must read.
const revalidated = await autocannon({
  url,
  connections: CONNECTIONS,
  duration: DURATION_S,
  workers: 1,
  headers: { ...headers, 'If-None-Match': first.etag },
});
console.log(
  `the same, revalidating (If-None-Match, answered 304 Not Modified): ${revalidated.requests.average.toFixed(0)} req/s, latency median ${revalidated.latency.p50} ms, p99 ${revalidated.latency.p99} ms, ${revalidated.errors} errors`,
);

// The floor this machine and load generator set: a bare node:http server sending the same cached
// bytes, no routing, no authentication, under the same load. autocannon appends every response body
// to a string, so binary (gzip) bodies cost its worker far more than the server: the floor shows
// where that limit lies. On a busy machine both rise together; their ratio says more than either.
const bytes = first.gzip;
const bare = createServer((_req, res) => {
  res.writeHead(200, { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' });
  res.end(bytes);
});
await new Promise<void>((done) => bare.listen(0, '127.0.0.1', done));
const floor = await autocannon({
  url: `http://127.0.0.1:${(bare.address() as AddressInfo).port}/api/outlook`,
  connections: CONNECTIONS,
  duration: DURATION_S,
  workers: 1,
  headers,
});
bare.close();
console.log(
  `floor: bare node:http sending the same ${bytes.length} bytes: ${floor.requests.average.toFixed(0)} req/s, latency median ${floor.latency.p50} ms, p99 ${floor.latency.p99} ms; the app's p99 is ${(result.latency.p99 / Math.max(1, floor.latency.p99)).toFixed(1)} × the floor's`,
);
await app.close();
console.log(`outlook-cold-first-in-process-ms: ${coldMs.toFixed(0)}`);
console.log(`outlook-cold-ms: ${coldAfterNewDataMs.toFixed(0)}`);
console.log(`outlook-cached-p99-ms: ${result.latency.p99}`);
process.exit(0);
