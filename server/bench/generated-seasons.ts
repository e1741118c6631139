/**
 * Ten generated seasons on a benchmark radar (about 50 000 onset tracks, 293 000 scans, 500 blocks in
 * 10 districts, daily anomaly fields giving 9 regimes), in an in-memory database behind the built app
 * listening on 127.0.0.1. Shared by bench:outlook and bench:scorecard, so both measure the same data.
 */
import 'reflect-metadata';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { Test } from '@nestjs/testing';
import { sitePlane } from '../src/radar/engine/site-plane.js';
import { mulberry32 } from '../src/testing/seeded-random.js';
import { testConfig } from '../src/testing/test-app.js';

// The app runs from the compiled server (tsc emits the decorator metadata Nest's injection needs;
// tsx's transform does not), typed by the sources it was built from.
const dist = (path: string) => new URL(`../dist/${path}`, import.meta.url).href;
const { AppModule } = (await import(dist('app.module.js'))) as typeof import('../src/app.module.js');
const { setUpApp } = (await import(dist('app.setup.js'))) as typeof import('../src/app.setup.js');
const { DATABASE, migrateDatabase, wrap } = (await import(
  dist('database/database.js')
)) as typeof import('../src/database/database.js');
const { UsersRepository } = (await import(
  dist('users/users.repository.js')
)) as typeof import('../src/users/users.repository.js');
const { hashPassword } = (await import(
  dist('users/passwords.js')
)) as typeof import('../src/users/passwords.js');

const SITE = { lat: 14.18, lon: 87.95 };
export const SEASONS = 10;
export const FIRST_YEAR = 2015;
const TRACKS_PER_SEASON = 5000;
const GRID_X = 25;
const GRID_Y = 20;
const SIDE_KM = 12;

export const rand = mulberry32(2031);
export const gauss = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
export const ms = (t: number) => `${t.toFixed(1)} ms`;
export const percentile = (xs: number[], p: number) =>
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
export const app = moduleRef.createNestApplication({ bodyParser: false, logger: ['error'] });
setUpApp(app);
await app.listen(0, '127.0.0.1');
export const base = `http://127.0.0.1:${(app.getHttpServer().address() as { port: number }).port}`;
export const pg = db.pg;
await app.get(UsersRepository).insert({
  email: 'bench@unit.example',
  name: 'Benchmark scientist',
  role: 'scientist',
  districtId: null,
  passwordHash: await hashPassword('benchmark password'),
});
export async function call<T>(method: string, path: string, body?: unknown, token?: string): Promise<T> {
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
export const token = (
  await call<{ accessToken: string }>('POST', '/api/auth/login', {
    email: 'bench@unit.example',
    password: 'benchmark password',
  })
).accessToken;
const started = Date.now();

export const siteId = (
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
export const districtIds = (await pg.query<{ id: number }>('select id from districts order by id')).rows.map(
  (r) => r.id,
);
export const blockAt: number[] = [];
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
export const DAY = 86_400_000;
export const seasonStart = (s: number) => Date.UTC(FIRST_YEAR + s, 5, 1) - 6 * 3_600_000;
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
