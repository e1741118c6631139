/**
 * npm run bench:anomalies — a season (122 days) of q′, u′ and v′ on a 0.25° grid of 200 × 200 points,
 * as three float32 GeoTIFFs (one band per day), through the built server's real intake (upload, read,
 * check, store in PGlite), then the regimes of every day (GET /api/regimes). Prints seconds, points per
 * second and the server's peak memory (VmHWM, the kernel's high-water mark of its RSS).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { encodeGeoTiff, type GdalItem, gdalMetadataXml, geographicKeys } from '../../sample-data/src/tiff.js';
import { startServer } from './bench-server.js';

const DAYS = 122;
const N = 200;
const STEP = 0.25;
const SITE = { lat: 14.18, lon: 87.95 };

/** Smooth daily fields with a day-to-day signal, written pixel-interleaved as the encoder takes them. */
function writeSeason(dir: string): string[] {
  const west = SITE.lon - (N / 2) * STEP;
  const north = SITE.lat + (N / 2) * STEP;
  const dates = Array.from({ length: DAYS }, (_, d) =>
    new Date(Date.UTC(2025, 5, 1 + d)).toISOString().slice(0, 10),
  );
  return (['q', 'u', 'v'] as const).map((variable, k) => {
    const data = new Float32Array(N * N * DAYS);
    for (let j = 0; j < N; j++)
      for (let i = 0; i < N; i++)
        for (let d = 0; d < DAYS; d++)
          data[(j * N + i) * DAYS + d] =
            Math.sin(d / 5 + k) * 2 + 0.01 * (i - N / 2) - 0.01 * (j - N / 2) + Math.cos(i / 9 + j / 7 + d);
    const items: GdalItem[] = [
      { name: 'VARIABLE', value: variable },
      { name: 'UNITS', value: variable === 'q' ? 'g/kg' : 'm/s' },
      { name: 'LEVEL_HPA', value: 850 },
      { name: 'DATES', value: dates.join(',') },
    ];
    const path = join(dir, `bench-${variable}850.tif`);
    writeFileSync(
      path,
      encodeGeoTiff({
        width: N,
        height: N,
        bands: DAYS,
        data,
        pixelScale: [STEP, STEP],
        origin: [west - STEP / 2, north + STEP / 2],
        geoKeys: geographicKeys(),
        gdalMetadataXml: gdalMetadataXml(items),
      }),
    );
    return path;
  });
}

const peakRssMb = (pid: number) => {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmHWM:\s+(\d+)/.exec(status)?.[1] ?? Number.NaN) / 1024;
};

async function main() {
  const dir = mkdtempSync(join(tmpdir(), 'stormhour-bench-anomalies-'));
  const files = writeSeason(dir);
  const { base, server } = await startServer(dir);
  try {
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'scientist@vessary.example', password: 'stormhour-demo' }),
    });
    const token = ((await login.json()) as { accessToken: string }).accessToken;
    const auth = { Authorization: `Bearer ${token}` };
    const demo = fileURLToPath(new URL('../../sample-data/vessary/', import.meta.url));
    const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
    const created = await fetch(`${base}/api/radar-sites`, {
      method: 'POST',
      headers: { ...auth, 'content-type': 'application/json' },
      body: JSON.stringify(site.createSiteRequest),
    });
    const siteId = ((await created.json()) as { id: number }).id;
    const rssBefore = peakRssMb(server.pid as number);

    const started = performance.now();
    // curl sends the multipart body the way a browser does; the job is then followed by polling.
    const args = ['-s', '-X', 'POST', `${base}/api/intake`, '-H', `Authorization: Bearer ${token}`];
    args.push('-F', `siteId=${siteId}`, '-F', 'kind=anomaly-grid');
    for (const p of files) args.push('-F', `files[]=@${p}`);
    const job = JSON.parse(spawnSync('curl', args, { encoding: 'utf8' }).stdout) as { id: number };
    let view: { state: string; summary: string | null; error: string | null };
    for (;;) {
      // The job's CPU-bound parts hold the event loop for a while; a poll may meet a reset socket.
      const res = await fetch(`${base}/api/jobs/${job.id}`, { headers: auth }).catch(() => null);
      if (res) {
        view = (await res.json()) as typeof view;
        if (view.state === 'done' || view.state === 'failed') break;
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    const intakeSeconds = (performance.now() - started) / 1000;
    if (view.state !== 'done') throw new Error(`the intake job failed: ${view.error}`);

    const t = performance.now();
    const regimes = (await (
      await fetch(`${base}/api/regimes?siteId=${siteId}`, { headers: auth })
    ).json()) as {
      days: unknown[];
    };
    const regimeSeconds = (performance.now() - t) / 1000;
    const points = 3 * DAYS * N * N;
    const total = intakeSeconds + regimeSeconds;
    console.log(`season: 3 variables × ${DAYS} days × ${N} × ${N} points at ${STEP}° = ${points} values`);
    console.log(
      `intake (upload, read, check, store): ${intakeSeconds.toFixed(2)} s, ${(points / intakeSeconds / 1e6).toFixed(2)} M points/s`,
    );
    console.log(
      `regimes of ${regimes.days.length} days (domain means, terciles, classes): ${regimeSeconds.toFixed(2)} s, ${(points / regimeSeconds / 1e6).toFixed(2)} M points/s`,
    );
    console.log(`whole: ${total.toFixed(2)} s, ${(points / total / 1e6).toFixed(2)} M points/s`);
    console.log(
      `server peak memory (RSS high-water mark): ${peakRssMb(server.pid as number).toFixed(0)} MB (${rssBefore.toFixed(0)} MB before the upload)`,
    );
  } finally {
    server.kill('SIGTERM');
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
