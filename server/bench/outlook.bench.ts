/**
 * npm run bench:outlook — the block outlook on ten generated seasons (about 50 000 onset tracks,
 * 293 000 scans, 500 blocks, 9 regimes): the full outlook's time cold (load, count, serialise) and
 * cached, then GET /api/outlook under 50 concurrent clients with autocannon on 127.0.0.1.
 * Last lines: `outlook-cold-ms: X` and `outlook-cached-p99-ms: Y` (goals: < 500 and < 20).
 */
import 'reflect-metadata';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { Test } from '@nestjs/testing';
import { sitePlane } from '../src/radar/engine/site-plane.js';
import { testConfig } from '../src/testing/test-app.js';

// The app runs from the compiled server (tsc emits the decorator metadata Nest's injection needs;
// tsx's transform does not), typed by the sources it was built from.
const dist = (path: string) => new URL(`../dist/${path}`, import.meta.url).href;
const { AppModule } = (await import(dist('app.module.js'))) as typeof import('../src/app.module.js');
const { setUpApp } = (await import(dist('app.setup.js'))) as typeof import('../src/app.setup.js');
const { DATABASE, migrateDatabase, wrap } = (await import(
  dist('database/database.js')
)) as typeof import('../src/database/database.js');
const { OutlookService } = (await import(
  dist('outlook/outlook.service.js')
)) as typeof import('../src/outlook/outlook.service.js');
const { OutlookRepository } = (await import(
  dist('outlook/outlook.repository.js')
)) as typeof import('../src/outlook/outlook.repository.js');
const { RegimesService } = (await import(
  dist('regimes/regimes.service.js')
)) as typeof import('../src/regimes/regimes.service.js');
const { UsersRepository } = (await import(
  dist('users/users.repository.js')
)) as typeof import('../src/users/users.repository.js');
const { hashPassword } = (await import(
  dist('users/passwords.js')
)) as typeof import('../src/users/passwords.js');

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
}) => Promise<LoadResult>;

const SITE = { lat: 14.18, lon: 87.95 };
const SEASONS = 10;
const FIRST_YEAR = 2015;
const TRACKS_PER_SEASON = 5000;
const GRID_X = 25;
const GRID_Y = 20;
const SIDE_KM = 12;
const CONNECTIONS = 50;
const DURATION_S = 10;

/** A small seeded generator (mulberry32), so every run benchmarks the same data. */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const rand = random(2031);
const gauss = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
const ms = (t: number) => `${t.toFixed(1)} ms`;
const percentile = (xs: number[], p: number) =>
  [...xs].sort((a, b) => a - b)[Math.ceil((p / 100) * xs.length) - 1];

const db = wrap(await PGlite.create());
await migrateDatabase(db);
const moduleRef = await Test.createTestingModule({
  imports: [
    AppModule.register(
      testConfig({
        jwtSecret: 'benchmark-secret-that-is-long-enough-for-hs256',
        loginAttemptsPerMinute: 100,
        accessTokenMinutes: 60,
        filesDir: join(tmpdir(), `stormhour-bench-outlook-${process.pid}`),
      }),
    ),
  ],
})
  .overrideProvider(DATABASE)
  .useValue(db)
  .compile();
const app = moduleRef.createNestApplication({ bodyParser: false, logger: ['error'] });
setUpApp(app);
await app.listen(0, '127.0.0.1');
const base = `http://127.0.0.1:${(app.getHttpServer().address() as { port: number }).port}`;
const pg = db.pg;
await app.get(UsersRepository).insert({
  email: 'bench@unit.example',
  name: 'Benchmark scientist',
  role: 'scientist',
  districtId: null,
  passwordHash: await hashPassword('benchmark password'),
});
async function call<T>(method: string, path: string, body?: unknown, token?: string): Promise<T> {
  const send = () =>
    fetch(`${base}${path}`, {
      method,
      headers: {
        'Content-Type': 'application/json',
        ...(token ? { Authorization: `Bearer ${token}` } : {}),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  // A kept-alive socket idle through the data generation may have been closed by the server: retry once.
  const res = await send().catch(send);
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}
const token = (
  await call<{ accessToken: string }>('POST', '/api/auth/login', {
    email: 'bench@unit.example',
    password: 'benchmark password',
  })
).accessToken;
const started = Date.now();

const siteId = (
  await call<{ id: number }>(
    'POST',
    '/api/radar-sites',
    {
      code: 'BENCH',
      name: 'Benchmark radar',
      ...SITE,
      altitudeM: 240,
      rangeKm: 180,
      intervalMin: 6,
      utcOffsetMinutes: 360,
    },
    token,
  )
).id;
// Three flow sectors and strong anomaly winds: 3 moisture × 3 flow classes = 9 regimes.
await call(
  'PUT',
  `/api/regimes/settings?siteId=${siteId}`,
  {
    sectors: [
      { name: 'onshore', fromDeg: 90, toDeg: 210 },
      { name: 'along-shore', fromDeg: 210, toDeg: 330 },
      { name: 'offshore', fromDeg: 330, toDeg: 90 },
    ],
  },
  token,
);

// 500 square blocks of 12 km on a 25 × 20 grid centred on the radar, in 10 districts.
const plane = sitePlane(SITE);
for (let d = 0; d < 10; d++)
  await pg.query('insert into districts (code, name) values ($1, $2)', [`D${d}`, `District ${d}`]);
const districtIds = (await pg.query<{ id: number }>('select id from districts order by id')).rows.map(
  (r) => r.id,
);
const blockAt: number[] = [];
for (let j = 0; j < GRID_Y; j++)
  for (let i = 0; i < GRID_X; i++) {
    const x0 = (i - GRID_X / 2) * SIDE_KM;
    const y0 = (j - GRID_Y / 2) * SIDE_KM;
    const ring = [
      [x0, y0],
      [x0 + SIDE_KM, y0],
      [x0 + SIDE_KM, y0 + SIDE_KM],
      [x0, y0 + SIDE_KM],
      [x0, y0],
    ].map(([x, y]) => plane.toLonLat(x, y));
    const lons = ring.map((p) => p[0]);
    const lats = ring.map((p) => p[1]);
    const res = await pg.query<{ id: number }>(
      `insert into blocks (code, name, district_id, geometry, min_lon, min_lat, max_lon, max_lat, centroid_lon, centroid_lat, area_km2)
       values ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11) returning id`,
      [
        `B${j * GRID_X + i}`,
        `Block ${j * GRID_X + i}`,
        districtIds[Math.floor(j / 2)],
        JSON.stringify({ type: 'Polygon', coordinates: [ring] }),
        Math.min(...lons),
        Math.min(...lats),
        Math.max(...lons),
        Math.max(...lats),
        plane.toLonLat(x0 + SIDE_KM / 2, y0 + SIDE_KM / 2)[0],
        plane.toLonLat(x0 + SIDE_KM / 2, y0 + SIDE_KM / 2)[1],
        SIDE_KM * SIDE_KM,
      ],
    );
    blockAt.push(res.rows[0].id);
  }

// Scans every 6 minutes through each season, with a few random outages of 1–8 hours.
const DAY = 86_400_000;
const seasonStart = (s: number) => Date.UTC(FIRST_YEAR + s, 5, 1) - 6 * 3_600_000;
for (let s = 0; s < SEASONS; s++) {
  const from = seasonStart(s);
  await pg.query(
    `insert into scans (site_id, source, time)
     select $1, 'scan-inventory', g from generate_series($2::timestamptz, $3::timestamptz, interval '6 minutes') g`,
    [siteId, new Date(from).toISOString(), new Date(from + 122 * DAY - 360_000).toISOString()],
  );
  for (let k = 0; k < 6; k++) {
    const at = from + Math.floor(rand() * 122 * DAY);
    await pg.query('delete from scans where site_id = $1 and time >= $2 and time < $3', [
      siteId,
      new Date(at).toISOString(),
      new Date(at + (1 + rand() * 7) * 3_600_000).toISOString(),
    ]);
  }
}

// Daily anomaly fields (9 × 9 points, 0.5°): moisture and wind spells, so the 9 regimes all occur.
const fieldRows: unknown[][] = [];
for (let s = 0; s < SEASONS; s++) {
  let q = 0;
  let dir = rand() * 360;
  for (let d = 0; d < 122; d++) {
    q = 0.7 * q + 0.7 * gauss();
    if (rand() < 0.25) dir = rand() * 360;
    const u = -3 * Math.sin((dir * Math.PI) / 180);
    const v = -3 * Math.cos((dir * Math.PI) / 180);
    const date = new Date(Date.UTC(FIRST_YEAR + s, 5, 1) + d * DAY).toISOString().slice(0, 10);
    for (const [variable, value] of [
      ['q', q],
      ['u', u],
      ['v', v],
    ] as const)
      fieldRows.push([variable, date, Buffer.from(new Float32Array(81).fill(value).buffer)]);
  }
}
for (let i = 0; i < fieldRows.length; i += 200) {
  const batch = fieldRows.slice(i, i + 200);
  await pg.query(
    `insert into anomaly_fields (variable, level_hpa, date, nx, ny, lon0, lat0, d_lon, d_lat, values, source_file)
     values ${batch.map((_, k) => `($${3 * k + 3}, 850, $${3 * k + 4}, 9, 9, $1, $2, 0.5, 0.5, $${3 * k + 5}, 'bench')`).join(', ')}`,
    [SITE.lon - 2, SITE.lat + 2, ...batch.flat()],
  );
}

// Onset tracks: afternoon-peaked times, more over the southern half (the "hills").
const times: string[] = [];
const lats: number[] = [];
const lons: number[] = [];
const blockIds: number[] = [];
for (let s = 0; s < SEASONS; s++)
  for (let k = 0; k < TRACKS_PER_SEASON; k++) {
    let x: number;
    let y: number;
    do {
      x = (rand() - 0.5) * GRID_X * SIDE_KM;
      y = (rand() ** 1.5 - 0.5) * GRID_Y * SIDE_KM;
    } while (Math.hypot(x, y) > 170);
    const hour = Math.max(0, Math.min(23.9, 14 + 3 * gauss()));
    const day = Math.floor(rand() * 122);
    times.push(new Date(seasonStart(s) + day * DAY + hour * 3_600_000).toISOString());
    const [lon, lat] = plane.toLonLat(x, y);
    lons.push(lon);
    lats.push(lat);
    const i = Math.floor(x / SIDE_KM + GRID_X / 2);
    const j = Math.floor(y / SIDE_KM + GRID_Y / 2);
    blockIds.push(blockAt[j * GRID_X + i]);
  }
await pg.query(
  `insert into tracks (site_id, source, settings_version, first_time, last_time, scan_count, duration_min,
     is_storm, onset, start_lat, start_lon, start_block_id, max_area_km2)
   select $1, 'cell-table', 1, u.t, u.t + interval '30 minutes', 5, 30, true, true, u.lat, u.lon, u.b, 20
   from unnest($2::timestamptz[], $3::float8[], $4::float8[], $5::int[]) as u(t, lat, lon, b)`,
  [siteId, times, lats, lons, blockIds],
);
console.log(
  `generated ${SEASONS} seasons: ${times.length} onset tracks, ${blockAt.length} blocks, ${fieldRows.length} anomaly fields in ${((Date.now() - started) / 1000).toFixed(1)} s`,
);

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
await timed('onsets per source (GROUP BY)', () => repo.onsetsBySource(siteId, all));
await timed('scans per local hour, 10 seasons (scan_hours)', () =>
  repo.scanHours(siteId, 'cell-table', { from: null, to: null }),
);
await timed('onset columns, 50 000 tracks', () => repo.onsets(siteId, 'cell-table', all));
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
  `full outlook, cold (load ${first.body.blocks.length} blocks × ${first.body.bins.length} bins, count, climatology, serialise ${(first.json.length / 1e6).toFixed(2)} MB, gzip ${(first.gzip.length / 1e3).toFixed(0)} kB), regime "${chosen}": ${ms(coldMs)}`,
);
t0 = performance.now();
for (const r of regimes.slice(1)) await service.outlook(query(r.regime));
console.log(
  `the other ${regimes.length - 1} regimes, columns already loaded: ${ms((performance.now() - t0) / (regimes.length - 1))} each`,
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

const url = `${base}/api/outlook?siteId=${siteId}&regime=${encodeURIComponent(chosen)}`;
const result = await autocannon({
  url,
  connections: CONNECTIONS,
  duration: DURATION_S,
  headers: { Authorization: `Bearer ${token}`, 'Accept-Encoding': 'gzip' },
});
console.log(
  `GET /api/outlook, ${CONNECTIONS} clients, ${DURATION_S} s on 127.0.0.1 (gzip as browsers ask): ${result.requests.average.toFixed(0)} req/s, latency median ${result.latency.p50} ms, p99 ${result.latency.p99} ms, ${result.non2xx} non-2xx, ${result.errors} errors`,
);
await app.close();
console.log(`outlook-cold-ms: ${coldMs.toFixed(0)}`);
console.log(`outlook-cached-p99-ms: ${result.latency.p99}`);
process.exit(0);
