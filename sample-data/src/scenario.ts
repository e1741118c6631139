import { type AnomalyGrids, generateAnomalies } from './anomalies.js';
import { type BlocksCollection, generateBlocks } from './blocks.js';
import { DEFAULT_SEED, RUN_DEFAULTS, SEASON_DAYS, SEASON_START_LOCAL, SITE } from './config.js';
import { RadarProjection } from './geo.js';
import { provinceOutline, type Ring } from './province.js';
import { buildModelGrid, type CellState, type ModelCell, type ModelGrid, simulateStorms } from './storms.js';
import { Terrain } from './terrain.js';
import {
  generateAvailability,
  localMidnightUtcMs,
  type Outage,
  SCAN_MS,
  type SeasonClock,
  seasonClock,
} from './times.js';
import { exportTracks, type TableCell, type Track } from './tracks.js';

export interface ScenarioOptions {
  seed?: number;
  /** season length in days from 1 June (default 122, to 30 September) */
  days?: number;
  /** local date of the rendered radar run (default: the stormiest fully observed afternoon) */
  runDate?: string;
  /** first local hour and length of the radar run */
  runStartLocalHour?: number;
  runHours?: number;
}

export interface RadarRun {
  localDate: string;
  /** nominal scan indices of the run, all present in the inventory */
  steps: number[];
}

export interface Scenario {
  seed: number;
  days: number;
  clock: SeasonClock;
  projection: RadarProjection;
  terrain: Terrain;
  outline: Ring;
  blocks: BlocksCollection;
  anomalies: AnomalyGrids;
  present: Uint8Array;
  outages: Outage[];
  grid: ModelGrid;
  cells: ModelCell[];
  dayFactors: number[];
  tracks: Track[];
  /** all table rows, sorted by scan then track id */
  rows: TableCell[];
  run: RadarRun;
  /** model-cell states by nominal scan index (for rendering) */
  statesAt(step: number): CellState[];
}

/** Builds the whole scenario in memory; the same options always give the same scenario. */
export function generateScenario(options: ScenarioOptions = {}): Scenario {
  const seed = options.seed ?? DEFAULT_SEED;
  const days = options.days ?? SEASON_DAYS;
  if (!Number.isInteger(days) || days < 1 || days > 366)
    throw new Error('days must be an integer from 1 to 366');
  const clock = seasonClock(days, SEASON_START_LOCAL);
  const projection = new RadarProjection(SITE.lat, SITE.lon);
  const terrain = new Terrain(seed);
  const outline = provinceOutline(seed);
  const blocks = generateBlocks(seed, outline);
  const anomalies = generateAnomalies(seed, clock.dates);
  const { present, outages } = generateAvailability(seed, clock);
  const grid = buildModelGrid(terrain, projection);
  const sim = simulateStorms(seed, clock, anomalies.coverageMeans, grid);
  const tracks = exportTracks(sim.cells, present, projection);
  const rows = tracks.flatMap((t) => t.rows).sort((a, b) => a.step - b.step || a.trackId - b.trackId);

  const byStep = new Map<number, CellState[]>();
  for (const c of sim.cells) {
    for (const s of c.states) {
      const list = byStep.get(s.step);
      if (list) list.push(s);
      else byStep.set(s.step, [s]);
    }
  }

  const run = chooseRun(
    clock,
    present,
    rows,
    options.runDate,
    options.runStartLocalHour ?? RUN_DEFAULTS.startLocalHour,
    options.runHours ?? RUN_DEFAULTS.hours,
  );
  return {
    seed,
    days,
    clock,
    projection,
    terrain,
    outline,
    blocks,
    anomalies,
    present,
    outages,
    grid,
    cells: sim.cells,
    dayFactors: sim.dayFactors,
    tracks,
    rows,
    run,
    statesAt: (step) => byStep.get(step) ?? [],
  };
}

function chooseRun(
  clock: SeasonClock,
  present: Uint8Array,
  rows: TableCell[],
  runDate: string | undefined,
  startHour: number,
  hours: number,
): RadarRun {
  const nSteps = Math.round((hours * 60) / SITE.scanIntervalMin);
  const stepsFor = (date: string) => {
    const k0 = Math.round((localMidnightUtcMs(date) + startHour * 3_600_000 - clock.startMs) / SCAN_MS);
    return Array.from({ length: nSteps }, (_, i) => k0 + i);
  };
  if (runDate) {
    if (!clock.dates.includes(runDate)) throw new Error(`run date ${runDate} is outside the season`);
    const steps = stepsFor(runDate).filter((k) => present[k]);
    return { localDate: runDate, steps };
  }
  const perStep = new Map<number, number>();
  for (const r of rows) perStep.set(r.step, (perStep.get(r.step) ?? 0) + 1);
  let best: RadarRun | null = null;
  let bestScore = -1;
  for (const date of clock.dates) {
    const steps = stepsFor(date);
    if (steps[steps.length - 1] >= clock.nScans || steps.some((k) => !present[k])) continue;
    const score = steps.reduce((s, k) => s + (perStep.get(k) ?? 0), 0);
    if (score > bestScore) {
      bestScore = score;
      best = { localDate: date, steps };
    }
  }
  if (!best) {
    const date = clock.dates[0];
    return { localDate: date, steps: stepsFor(date).filter((k) => present[k]) };
  }
  return best;
}
