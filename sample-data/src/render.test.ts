import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { RADAR_GRID } from './config.js';
import { readTiff, readTruthCells } from './readers.js';
import { columnMax, renderVolume } from './render.js';
import { generateScenario } from './scenario.js';
import { labelComponents } from './test/identify.js';
import { isoUtc } from './times.js';

const dir = new URL('../vessary/', import.meta.url);
const text = (p: string) => readFileSync(fileURLToPath(new URL(p, dir)), 'utf8');
const scenario = JSON.parse(text('scenario.json'));
const runDir = scenario.radarRun.directory as string;
const run = JSON.parse(text(`${runDir}/run.json`));
const truth = readTruthCells(text(`${runDir}/truth-cells.csv`));
const opts = {
  thresholdRaw: Math.round((35 - RADAR_GRID.offset) / RADAR_GRID.scale),
  nodataRaw: RADAR_GRID.nodataRaw,
  scale: RADAR_GRID.scale,
  offset: RADAR_GRID.offset,
  originKm: [-180.5, 180.5] as [number, number],
  dxKm: 1,
};

/** Band-sequential copy of a pixel-interleaved raster. */
function planes(data: ArrayLike<number>, plane: number, bands: number): Uint8Array {
  const out = new Uint8Array(plane * bands);
  for (let q = 0; q < plane; q++) for (let b = 0; b < bands; b++) out[b * plane + q] = data[q * bands + b];
  return out;
}

describe('the rendered radar run shows the storms of the truth table', () => {
  const withVolume: [string, string][] = (run.scans as { scanTimeUtc: string; volumeFile: string | null }[])
    .filter((s) => s.volumeFile)
    .map((s) => [s.scanTimeUtc, s.volumeFile as string]);

  it.each(withVolume)(
    '3-D volume %s: 35 dBZ regions ≥ 15 km³ are the truth cells (centroid, volume, area, top)',
    (scanTime, file) => {
      const t = readTiff(new Uint8Array(readFileSync(fileURLToPath(new URL(`${runDir}/${file}`, dir)))));
      const comps = labelComponents(
        planes(t.data, t.width * t.height, t.bands),
        t.width,
        t.height,
        t.bands,
        opts,
      ).filter((c) => c.volumeKm3 >= 15);
      const all = truth.filter((c) => c.scanTimeUtc === scanTime);
      const cells = all.filter((c) => c.inCellTable);
      expect(cells.length).toBeGreaterThan(5);
      // Every clear truth cell (not at the threshold) is found, at its centroid, with its size.
      for (const c of cells) {
        const near = comps.filter((k) => Math.hypot(k.x - c.xKm, k.y - c.yKm) < 2);
        if (c.volumeKm3 < 20) continue;
        expect(near, `track ${c.trackId}`).toHaveLength(1);
        const k = near[0];
        // pixel counting on the 1 km grid: a few pixels along the outline either way
        expect(Math.abs(k.volumeKm3 - c.volumeKm3), `volume of track ${c.trackId}`).toBeLessThan(
          Math.max(0.2 * c.volumeKm3, 12),
        );
        expect(Math.abs(k.areaKm2 - c.areaKm2), `area of track ${c.trackId}`).toBeLessThan(
          Math.max(0.25 * c.areaKm2, 6),
        );
        expect(Math.abs(k.topLevel + 1 - c.top35Km), `top of track ${c.trackId}`).toBeLessThanOrEqual(1);
        expect(Math.abs(k.maxDbz - c.maxDbz)).toBeLessThan(3);
        if (!c.truncatedByRange) expect(Math.hypot(k.x - c.xKm, k.y - c.yKm)).toBeLessThan(0.8);
      }
      // Every clear region is a truth cell: no extra storms from noise or clutter.
      for (const k of comps) {
        if (k.volumeKm3 < 20) continue;
        expect(
          all.some((c) => Math.hypot(k.x - c.xKm, k.y - c.yKm) < 2),
          `region at ${k.x},${k.y}`,
        ).toBe(true);
      }
      expect(Math.abs(comps.length - cells.length)).toBeLessThanOrEqual(
        Math.max(1, Math.round(cells.length * 0.1)),
      );
    },
  );

  it('2-D column maxima: every table cell has a ≥ 35 dBZ region of ≥ 5 km², and every such region is a model cell', () => {
    for (const s of run.scans) {
      const t = readTiff(
        new Uint8Array(readFileSync(fileURLToPath(new URL(`${runDir}/${s.columnMaxFile}`, dir)))),
      );
      const comps = labelComponents(t.data, t.width, t.height, 1, opts).filter((c) => c.areaKm2 >= 5);
      for (const c of truth.filter((x) => x.scanTimeUtc === s.scanTimeUtc && x.inCellTable)) {
        expect(
          comps.some((k) => Math.hypot(k.x - c.xKm, k.y - c.yKm) < 2.5),
          `${s.scanTimeUtc} track ${c.trackId}`,
        ).toBe(true);
      }
      // clutter and speckle never make a region of 5 km²
      for (const k of comps) {
        expect(
          truth.some((c) => c.scanTimeUtc === s.scanTimeUtc && Math.hypot(k.x - c.xKm, k.y - c.yKm) < 2.5),
          `${s.scanTimeUtc} region at ${k.x.toFixed(1)},${k.y.toFixed(1)}`,
        ).toBe(true);
      }
    }
  });

  it('renderVolume reproduces the committed files from the scenario (so longer runs can be rendered later)', () => {
    const sc = generateScenario({ days: scenario.days, seed: scenario.seed });
    const step = sc.run.steps[0];
    expect(isoUtc(sc.clock.timeOf(step))).toBe(run.scans[0].scanTimeUtc);
    const v = renderVolume(sc, step);
    const committed = readTiff(
      new Uint8Array(readFileSync(fileURLToPath(new URL(`${runDir}/${run.scans[0].columnMaxFile}`, dir)))),
    );
    expect(Buffer.from(columnMax(v)).equals(Buffer.from(committed.data as Uint8Array))).toBe(true);
    // any scan of the season can be rendered, e.g. the night before the run
    const other = renderVolume(sc, step - 100);
    expect(other.raw.length).toBe(361 * 361 * 15);
  }, 60_000);
});
