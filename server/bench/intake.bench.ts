/**
 * npm run bench:intake — reading DEFLATE GeoTIFF volumes (20 levels × 500 × 500 float32) with
 * Stormhour's reader beside GDAL's (Debian gdal-bin + python3-gdal, used here only), in paired
 * alternating rounds; then whole-intake throughput (file to stored tracks) for volumes and for the
 * demo season's cell table, and peak memory. Last line: `read-vs-gdal: R` (median of paired ratios).
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { aeqdKeys, encodeGeoTiff, gdalMetadataXml } from '../../sample-data/src/tiff.js';
import { readReflectivityTiff } from '../src/intake/geotiff-reader.js';
import { sitePlane } from '../src/radar/engine/site-plane.js';
import { syntheticVolume } from './synthetic-volume.js';

const SITE = { lat: 14.18, lon: 87.95 };
const FILES = 6;
const ROUNDS = 5;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
let peakRss = 0;
const sampler = setInterval(() => {
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
}, 20);

const GDAL_READ = `
import sys, time, json
from osgeo import gdal
gdal.UseExceptions()
print("ready", flush=True)
for line in sys.stdin:
    path = line.strip()
    t = time.perf_counter()
    a = gdal.Open(path).ReadAsArray()
    print(json.dumps({"ms": (time.perf_counter() - t) * 1000, "shape": list(a.shape)}), flush=True)
`;

function writeVolumes(dir: string): string[] {
  const names: string[] = [];
  for (let f = 0; f < FILES; f++) {
    const v = syntheticVolume(500, 500, 20, 50, 100 + f);
    // Band-sequential to pixel-interleaved, as the encoder takes it.
    const plane = v.nx * v.ny;
    const interleaved = new Float32Array(plane * v.nz);
    for (let z = 0; z < v.nz; z++)
      for (let i = 0; i < plane; i++) interleaved[i * v.nz + z] = v.data[z * plane + i];
    const time = new Date(Date.UTC(2025, 7, 1, 8, 6 * f)).toISOString().replace('.000', '');
    const tif = encodeGeoTiff({
      width: v.nx,
      height: v.ny,
      bands: v.nz,
      data: interleaved,
      pixelScale: [1000, 1000],
      origin: [-250_000, 250_000],
      geoKeys: aeqdKeys(SITE.lat, SITE.lon, 'benchmark grid'),
      gdalMetadataXml: gdalMetadataXml([
        { name: 'SCAN_TIME_UTC', value: time },
        { name: 'LEVEL_HEIGHTS_KM', value: v.heightsM.map((m) => m / 1000).join(',') },
      ]),
    });
    const plain = join(dir, `plain-${f}.tif`);
    const packed = join(dir, `bench-${f}.tif`);
    writeFileSync(plain, tif);
    const r = spawnSync('gdal_translate', [
      '-q',
      '-co',
      'COMPRESS=DEFLATE',
      '-co',
      'PREDICTOR=3',
      plain,
      packed,
    ]);
    if (r.status !== 0) throw new Error(`gdal_translate failed: ${r.stderr}`);
    rmSync(plain);
    names.push(packed);
  }
  return names;
}

async function readComparison(files: string[]): Promise<number> {
  const proc = spawn('/usr/bin/python3', ['-c', GDAL_READ], { stdio: ['pipe', 'pipe', 'inherit'] });
  const lines = createInterface({ input: proc.stdout })[Symbol.asyncIterator]();
  const next = async () => (await lines.next()).value as string;
  await next();
  const plane = sitePlane(SITE);
  const read = (f: string) =>
    readReflectivityTiff(readFileSync(f), { fileName: f, kind: 'volume', plane, latestTime: Date.now() });
  await read(files[0]);
  const ratios: number[] = [];
  const ours: number[] = [];
  const theirs: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    for (const f of files) {
      const t = performance.now();
      await read(f);
      const a = performance.now() - t;
      proc.stdin.write(`${f}\n`);
      const b = (JSON.parse(await next()) as { ms: number }).ms;
      ours.push(a);
      theirs.push(b);
      ratios.push(a / b);
    }
  }
  proc.stdin.end();
  console.log(
    `read 20 × 500 × 500 float32 DEFLATE volume: Stormhour ${median(ours).toFixed(1)} ms, GDAL ${median(theirs).toFixed(1)} ms, ratio ${median(ratios).toFixed(2)}`,
  );
  return median(ratios);
}

/** The built server as `npm start` runs it, on a scratch data folder with the demo accounts only. */
async function startServer(dir: string) {
  const port = 3900 + Math.floor(Math.random() * 90);
  const env = {
    ...process.env,
    PORT: String(port),
    DATA_DIR: join(dir, 'data'),
    DEMO: '1',
    DEMO_DATA_DIR: join(dir, 'none'),
    UPLOAD_LIMIT_MB: '200',
  };
  const server = spawn(process.execPath, ['server/dist/main.js'], {
    env,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const base = `http://127.0.0.1:${port}`;
  // Migrating a fresh database takes a few seconds, longer on a busy machine.
  for (let i = 0; i < 900; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return { base, server };
    } catch {
      // starting
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  server.kill('SIGTERM');
  throw new Error('the server did not start within 90 s');
}

function pollFigures(ms: number[]): string {
  return `job polls answered in ${median(ms).toFixed(0)} ms (median), ${Math.max(...ms).toFixed(0)} ms (slowest of ${ms.length})`;
}

async function intakeThroughput(dir: string, files: string[]): Promise<void> {
  const { base, server } = await startServer(dir);
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'scientist@vessary.example', password: 'stormhour-demo' }),
  });
  const auth = { Authorization: `Bearer ${((await login.json()) as { accessToken: string }).accessToken}` };
  const demo = fileURLToPath(new URL('../../sample-data/vessary/', import.meta.url));
  const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
  const created = await fetch(`${base}/api/radar-sites`, {
    method: 'POST',
    headers: { ...auth, 'content-type': 'application/json' },
    body: JSON.stringify(site.createSiteRequest),
  });
  const siteId = ((await created.json()) as { id: number }).id;
  const upload = async (kind: string, paths: string[]) => {
    const started = performance.now();
    // curl sends the multipart body the way a browser does; the job is then followed by polling.
    const args = ['-s', '-X', 'POST', `${base}/api/intake`, '-H', `Authorization: ${auth.Authorization}`];
    args.push('-F', `siteId=${siteId}`, '-F', `kind=${kind}`);
    for (const p of paths) args.push('-F', `files[]=@${p}`);
    const job = JSON.parse(spawnSync('curl', args, { encoding: 'utf8', maxBuffer: 1 << 26 }).stdout) as {
      id: number;
    };
    // How long each poll waits for its answer: the files are read in a worker thread, so only the
    // storing and re-tracking steps of the job still hold the server's event loop.
    const pollMs: number[] = [];
    for (;;) {
      const asked = performance.now();
      const res = await fetch(`${base}/api/jobs/${job.id}`, { headers: auth }).catch(() => null);
      if (!res) continue;
      const view = (await res.json()) as { state: string; report: { cellsFound: number; tracks: number } };
      pollMs.push(performance.now() - asked);
      if (view.state === 'done' || view.state === 'failed')
        return { seconds: (performance.now() - started) / 1000, job: view, pollMs };
      await new Promise((r) => setTimeout(r, 50));
    }
  };
  const vol = await upload('volume', files);
  console.log(
    `intake of ${files.length} volumes, file to stored tracks: ${vol.seconds.toFixed(2)} s, ` +
      `${((files.length / vol.seconds) * 60).toFixed(0)} volumes per minute (${vol.job.report.cellsFound} cells, ${vol.job.report.tracks} tracks); ${pollFigures(vol.pollMs)}`,
  );
  const cells = join(demo, readdirSync(demo).find((f) => f.startsWith('cells-')) as string);
  const rows = readFileSync(cells, 'utf8').trim().split('\n').length - 1;
  const table = await upload('cell-table', [cells]);
  console.log(
    `intake of the demo season's cell table: ${rows} rows in ${table.seconds.toFixed(2)} s, ${(rows / table.seconds).toFixed(0)} rows per second; ${pollFigures(table.pollMs)}`,
  );
  const rss = spawnSync('ps', ['-o', 'rss=', '-p', String(server.pid)], { encoding: 'utf8' }).stdout.trim();
  console.log(`server memory after intake (RSS): ${(Number(rss) / 1024).toFixed(0)} MB`);
  server.kill('SIGTERM');
}

async function main() {
  const missing =
    spawnSync('gdal_translate', ['--version']).status !== 0
      ? 'gdal_translate is not installed'
      : spawnSync('/usr/bin/python3', ['-c', 'from osgeo import gdal']).status !== 0
        ? "GDAL's Python bindings are missing (/usr/bin/python3 cannot import osgeo.gdal)"
        : null;
  if (missing) {
    console.error(
      `bench:intake skipped: ${missing}. It needs GDAL to write the test files and to compare with (Debian: apt-get install gdal-bin python3-gdal).`,
    );
    process.exit(1);
  }
  const dir = mkdtempSync(join(tmpdir(), 'stormhour-bench-intake-'));
  const files = writeVolumes(dir);
  const ratio = await readComparison(files);
  await intakeThroughput(dir, files);
  clearInterval(sampler);
  rmSync(dir, { recursive: true, force: true });
  console.log(`benchmark process peak memory (RSS, reading): ${(peakRss / 1024 / 1024).toFixed(0)} MB`);
  console.log(`read-vs-gdal: ${ratio.toFixed(2)}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
