import type { DailyMeans } from './anomalies.js';
import { SITE, STORM_PARAMS } from './config.js';
import type { RadarProjection } from './geo.js';
import { Rng } from './prng.js';
import type { Terrain } from './terrain.js';
import { localHourOf, SCANS_PER_DAY, type SeasonClock } from './times.js';

/** One model cell at one nominal scan time. */
export interface CellState {
  /** model cell id */
  cellId: number;
  step: number;
  /** centre, km east/north of the radar (azimuthal equidistant) */
  x: number;
  y: number;
  /** area of the 35 dBZ ellipse at the height of maximum reflectivity (π a b), km² */
  areaKm2: number;
  /** minor / major semi-axis */
  axisRatio: number;
  /** major axis, degrees clockwise from north, [0, 180) */
  orientationDeg: number;
  /** maximum reflectivity of the core, dBZ (at hmaxKm) */
  peakDbz: number;
  hmaxKm: number;
  /** height where the core profile falls to 35 dBZ and to 0 dBZ (continuous), km */
  top35Km: number;
  echoTopKm: number;
}

export type BirthKind = 'hill' | 'valleyEvening' | 'lakeNight' | 'background' | 'split' | 'mergePair';

export interface ModelCell {
  id: number;
  kind: BirthKind;
  birthStep: number;
  /** split children: the model cell they split from */
  parentId?: number;
  /** cells that ended by merging: the survivor, and the first step they no longer exist */
  mergedIntoId?: number;
  mergeStep?: number;
  states: CellState[];
}

interface Active {
  cell: ModelCell;
  rng: Rng;
  age: number;
  lifeSteps: number;
  tau0: number;
  x: number;
  y: number;
  vx: number;
  vy: number;
  peakAreaKm2: number;
  boost: number;
  axisRatio: number;
  orientationDeg: number;
  rotationDegPerStep: number;
  peakDbz: number;
  hmaxKm: number;
  peakTop35Km: number;
  echoExcessKm: number;
  splitAtTau: number | null;
  alive: boolean;
}

/** Life-cycle envelope on [0, 1], skewed so cells grow faster than they decay (peak at τ ≈ 0.42). */
export function envelope(tau: number): number {
  if (tau <= 0 || tau >= 1) return 0;
  return Math.sin(Math.PI * tau ** 0.8);
}

const STEP_S = SITE.scanIntervalMin * 60;
const msToKmPerStep = (ms: number) => (ms * STEP_S) / 1000;

/** Asymmetric Gaussian diurnal shape, in local hours, optionally wrapping around midnight. */
function diurnalShape(
  h: number,
  s: { peak: number; rise: number; fall: number; start: number; floor?: number },
): number {
  let d = h - s.peak;
  if (s.start < -24) d = ((((d + 12) % 24) + 24) % 24) - 12;
  else if (h < s.start) return s.floor ?? 0;
  const sigma = d < 0 ? s.rise : s.fall;
  return (s.floor ?? 0) + Math.exp(-0.5 * (d / sigma) ** 2);
}

/** A discrete distribution over the cells of the model grid (cumulative weights). */
class GridSampler {
  private readonly cdf: Float64Array;
  constructor(
    weights: Float64Array,
    private readonly grid: ModelGrid,
  ) {
    this.cdf = new Float64Array(weights.length);
    let s = 0;
    for (let i = 0; i < weights.length; i++) {
      s += weights[i];
      this.cdf[i] = s;
    }
  }
  get total(): number {
    return this.cdf[this.cdf.length - 1];
  }
  sample(r: Rng): [number, number] {
    const t = r.uniform() * this.total;
    let lo = 0;
    let hi = this.cdf.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.cdf[mid] < t) lo = mid + 1;
      else hi = mid;
    }
    const i = lo % this.grid.n;
    const j = Math.floor(lo / this.grid.n);
    return [
      this.grid.x0 + (i + r.uniform()) * this.grid.step,
      this.grid.y0 + (j + r.uniform()) * this.grid.step,
    ];
  }
}

/** The model grid (4 km, radar-centred) with terrain, slope and the static birth weights. */
export interface ModelGrid {
  n: number;
  step: number;
  x0: number;
  y0: number;
  inDomain: Uint8Array;
  elevation: Float64Array;
  /** elevation gradient, m per km (east, north) */
  gx: Float64Array;
  gy: Float64Array;
  hillRamp: Float64Array;
  valleyEvening: Float64Array;
  lake: Float64Array;
}

const smooth = (t: number) => (t <= 0 ? 0 : t >= 1 ? 1 : t * t * (3 - 2 * t));

export function buildModelGrid(terrain: Terrain, proj: RadarProjection): ModelGrid {
  const P = STORM_PARAMS;
  const step = 4;
  const half = P.domainKm + 8;
  const n = Math.ceil((2 * half) / step);
  const x0 = -half;
  const y0 = -half;
  const N = n * n;
  const elevation = new Float64Array(N);
  const lakeRho = new Float64Array(N);
  const inDomain = new Uint8Array(N);
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const x = x0 + (i + 0.5) * step;
      const y = y0 + (j + 0.5) * step;
      const [lon, lat] = proj.toLonLat(x, y);
      const k = j * n + i;
      elevation[k] = terrain.elevation(lon, lat);
      lakeRho[k] = terrain.lakeRho(lon, lat);
      inDomain[k] = Math.hypot(x, y) <= P.domainKm ? 1 : 0;
    }
  }
  const gx = new Float64Array(N);
  const gy = new Float64Array(N);
  const hillRamp = new Float64Array(N);
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const k = j * n + i;
      const e = (ii: number, jj: number) =>
        elevation[Math.min(n - 1, Math.max(0, jj)) * n + Math.min(n - 1, Math.max(0, ii))];
      gx[k] = (e(i + 1, j) - e(i - 1, j)) / (2 * step);
      gy[k] = (e(i, j + 1) - e(i, j - 1)) / (2 * step);
      hillRamp[k] = smooth((elevation[k] - P.hillHeightFromM) / (P.hillHeightToM - P.hillHeightFromM));
    }
  }
  // Proximity to the hills: hill ramp blurred with a 30 km Gaussian (separable).
  const blur = (src: Float64Array, sigmaKm: number): Float64Array => {
    const rad = Math.ceil((3 * sigmaKm) / step);
    const w = Array.from({ length: 2 * rad + 1 }, (_, q) =>
      Math.exp(-0.5 * (((q - rad) * step) / sigmaKm) ** 2),
    );
    const tmp = new Float64Array(N);
    const out = new Float64Array(N);
    for (let j = 0; j < n; j++)
      for (let i = 0; i < n; i++) {
        let s = 0;
        let ws = 0;
        for (let q = -rad; q <= rad; q++) {
          const ii = i + q;
          if (ii < 0 || ii >= n) continue;
          s += w[q + rad] * src[j * n + ii];
          ws += w[q + rad];
        }
        tmp[j * n + i] = s / ws;
      }
    for (let j = 0; j < n; j++)
      for (let i = 0; i < n; i++) {
        let s = 0;
        let ws = 0;
        for (let q = -rad; q <= rad; q++) {
          const jj = j + q;
          if (jj < 0 || jj >= n) continue;
          s += w[q + rad] * tmp[jj * n + i];
          ws += w[q + rad];
        }
        out[j * n + i] = s / ws;
      }
    return out;
  };
  const near = blur(hillRamp, 30);
  let nearMax = 0;
  for (let k = 0; k < N; k++) nearMax = Math.max(nearMax, near[k]);
  const valleyEvening = new Float64Array(N);
  const lake = new Float64Array(N);
  for (let k = 0; k < N; k++) {
    if (!inDomain[k]) continue;
    const valley = smooth((320 - elevation[k]) / 40) * (lakeRho[k] < 1 ? 0.3 : 1);
    valleyEvening[k] = valley * (near[k] / nearMax) ** 1.5;
    lake[k] = 1 - smooth((lakeRho[k] - 0.9) / 0.4);
  }
  return { n, step, x0, y0, inDomain, elevation, gx, gy, hillRamp, valleyEvening, lake };
}

/** The day factor multiplying all birth rates: moisture and onshore flow anomalies. */
export function dayFactor(m: DailyMeans): number {
  const P = STORM_PARAMS;
  const t = (P.onshoreTowardDeg * Math.PI) / 180;
  const onshore = m.u * Math.sin(t) + m.v * Math.cos(t);
  return Math.exp(P.moistureGain * m.q + P.onshoreGain * onshore);
}

function hillWeights(g: ModelGrid, m: DailyMeans): Float64Array {
  const P = STORM_PARAMS;
  const from = (P.climFlowFromDeg * Math.PI) / 180;
  const u = -P.climFlowMS * Math.sin(from) + m.u;
  const v = -P.climFlowMS * Math.cos(from) + m.v;
  const w = new Float64Array(g.n * g.n);
  for (let k = 0; k < w.length; k++) {
    if (!g.inDomain[k] || g.hillRamp[k] === 0) continue;
    const s = Math.hypot(g.gx[k], g.gy[k]);
    const upslope = s > 0 ? (u * g.gx[k] + v * g.gy[k]) / s : 0;
    const steep = Math.min(1, s / P.slopeRefMPerKm);
    w[k] = g.hillRamp[k] * (P.slopeBase + s / P.slopeRefMPerKm) * Math.exp(P.upslopeGain * upslope * steep);
  }
  return w;
}

export interface StormSimulation {
  cells: ModelCell[];
  dayFactors: number[];
}

/** Major semi-axis (km) of an ellipse of the given area and axis ratio. */
export const semiMajor = (areaKm2: number, ratio: number) => Math.sqrt(areaKm2 / (Math.PI * ratio));

/**
 * Time-stepped simulation of convective cells at the nominal scan interval over the whole season
 * (the atmosphere does not stop when the radar does). Births are Poisson in each step with a rate
 * from the diurnal shape × the day factor × the spatial weights; each cell lives through a
 * log-normal lifetime with a growth–decay envelope; some split, some merge.
 */
export function simulateStorms(
  seed: number,
  clock: SeasonClock,
  means: DailyMeans[],
  grid: ModelGrid,
): StormSimulation {
  const P = STORM_PARAMS;
  const cells: ModelCell[] = [];
  const active: Active[] = [];
  const staticSamplers = {
    valleyEvening: new GridSampler(grid.valleyEvening, grid),
    lakeNight: new GridSampler(grid.lake, grid),
    background: new GridSampler(Float64Array.from(grid.inDomain), grid),
  };
  const comps = ['hill', 'valleyEvening', 'lakeNight', 'background'] as const;
  // Diurnal shapes normalised so that each sums to 1 over the steps of a day.
  const shapes: Record<(typeof comps)[number], Float64Array> = {
    hill: new Float64Array(SCANS_PER_DAY),
    valleyEvening: new Float64Array(SCANS_PER_DAY),
    lakeNight: new Float64Array(SCANS_PER_DAY),
    background: new Float64Array(SCANS_PER_DAY),
  };
  for (const c of comps) {
    let s = 0;
    for (let k = 0; k < SCANS_PER_DAY; k++) {
      shapes[c][k] = diurnalShape(localHourOf(clock.timeOf(k)), P.diurnal[c]);
      s += shapes[c][k];
    }
    for (let k = 0; k < SCANS_PER_DAY; k++) shapes[c][k] /= s;
  }
  const toward = (P.motionTowardDeg * Math.PI) / 180;
  const dayFactors = means.map(dayFactor);

  const newActive = (
    cell: ModelCell,
    rng: Rng,
    x: number,
    y: number,
    dayMean: DailyMeans,
    vigour?: number,
  ): Active => {
    const z = vigour ?? rng.normal();
    const mix = (rho: number) => rho * z + Math.sqrt(1 - rho * rho) * rng.normal();
    const lifeMin = Math.min(360, Math.max(16, P.lifetimeMedianMin * Math.exp(P.lifetimeSigma * mix(0.5))));
    const peakTop35 = Math.min(13.5, Math.max(3.2, P.top35MedianKm * Math.exp(P.top35Sigma * mix(0.6))));
    const hmax = Math.min(peakTop35 - 1, 1.6 + 1.8 * rng.uniform());
    const speedAnom = P.motionAnomalyShare;
    const vx = msToKmPerStep(
      P.motionMS * Math.sin(toward) + speedAnom * dayMean.u + P.motionSpreadMS * rng.normal(),
    );
    const vy = msToKmPerStep(
      P.motionMS * Math.cos(toward) + speedAnom * dayMean.v + P.motionSpreadMS * rng.normal(),
    );
    return {
      cell,
      rng,
      age: 0,
      lifeSteps: lifeMin / SITE.scanIntervalMin,
      tau0: 0,
      x,
      y,
      vx,
      vy,
      peakAreaKm2: Math.min(400, Math.max(5, P.peakAreaMedianKm2 * Math.exp(P.peakAreaSigma * z))),
      boost: 1,
      axisRatio: 0.45 + 0.55 * rng.uniform() ** 0.7,
      orientationDeg: 180 * rng.uniform(),
      rotationDegPerStep: 3 * rng.normal(),
      peakDbz: Math.min(64, Math.max(39, P.peakDbzMean + P.peakDbzSigma * mix(0.5))),
      hmaxKm: hmax,
      peakTop35Km: peakTop35,
      echoExcessKm: Math.min(6, P.echoTopExcessMedianKm * Math.exp(P.echoTopExcessSigma * rng.normal())),
      splitAtTau: rng.chance(P.splitChance) ? rng.range(0.42, 0.66) : null,
      alive: true,
    };
  };

  const stateOf = (a: Active, step: number): CellState => {
    const tau = a.tau0 + (1 - a.tau0) * (a.age / a.lifeSteps);
    const e = envelope(tau);
    const top35 = a.hmaxKm + 0.3 + (a.peakTop35Km - a.hmaxKm - 0.3) * e ** 0.6;
    return {
      cellId: a.cell.id,
      step,
      x: a.x,
      y: a.y,
      areaKm2: a.peakAreaKm2 * a.boost * e ** 1.2,
      axisRatio: a.axisRatio,
      orientationDeg: ((a.orientationDeg % 180) + 180) % 180,
      peakDbz: 35 + (a.peakDbz - 35) * (0.2 + 0.8 * e ** 0.7),
      hmaxKm: a.hmaxKm,
      top35Km: top35,
      echoTopKm: top35 + a.echoExcessKm * (0.5 + 0.5 * e ** 0.5),
    };
  };
  const tauOf = (a: Active) => a.tau0 + (1 - a.tau0) * (a.age / a.lifeSteps);
  const currentA = (a: Active) => {
    const s = a.cell.states[a.cell.states.length - 1];
    return s ? semiMajor(s.areaKm2, s.axisRatio) : 0;
  };

  const tooClose = (x: number, y: number, aNew: number, except?: Active) =>
    active.some(
      (o) =>
        o !== except &&
        o.alive &&
        Math.hypot(o.x - x, o.y - y) < aNew + currentA(o) * 1.2 + P.birthClearanceKm,
    );

  let nextId = 0;
  let day = -1;
  let hillSampler: GridSampler | null = null;
  let birthRng: Rng | null = null;
  let birthIndex = 0;
  for (let step = 0; step < clock.nScans; step++) {
    const d = Math.floor(step / SCANS_PER_DAY);
    if (d !== day) {
      day = d;
      hillSampler = new GridSampler(hillWeights(grid, means[d]), grid);
      birthRng = new Rng(seed, 'births', d);
      birthIndex = 0;
    }
    const br = birthRng as Rng;
    const sod = step - d * SCANS_PER_DAY;
    const mean = means[d];

    // 1. Age and move the living cells; those past their lifetime or outside the domain end.
    for (const a of active) {
      a.age += 1;
      if (tauOf(a) >= 1 || Math.hypot(a.x, a.y) > P.domainKm + 20) {
        a.alive = false;
        continue;
      }
      a.vx += 0.04 * a.rng.normal();
      a.vy += 0.04 * a.rng.normal();
      a.x += a.vx;
      a.y += a.vy;
      a.orientationDeg += a.rotationDegPerStep;
      a.cell.states.push(stateOf(a, step));
    }

    // 2. Splits: the cell divides along its major axis; the child takes a share of the area.
    for (const a of active.slice()) {
      if (!a.alive || a.splitAtTau === null || tauOf(a) < a.splitAtTau) continue;
      a.splitAtTau = null;
      const s = a.cell.states[a.cell.states.length - 1];
      if (s.areaKm2 < 8) continue;
      const share = a.rng.range(0.3, 0.45);
      const id = nextId++;
      const child: ModelCell = { id, kind: 'split', birthStep: step, parentId: a.cell.id, states: [] };
      const c = newActive(child, new Rng(seed, 'cell', id), a.x, a.y, mean, 0);
      c.tau0 = tauOf(a);
      c.lifeSteps = a.lifeSteps * a.rng.range(0.8, 1.3);
      c.peakAreaKm2 = (share * s.areaKm2) / envelope(c.tau0) ** 1.2;
      c.peakDbz = a.peakDbz - a.rng.range(0, 3);
      c.peakTop35Km = Math.max(a.hmaxKm + 1.3, a.peakTop35Km * a.rng.range(0.85, 1));
      c.hmaxKm = a.hmaxKm;
      c.axisRatio = a.axisRatio;
      c.orientationDeg = a.orientationDeg;
      c.splitAtTau = null;
      a.boost *= 1 - share;
      const aParent = semiMajor(s.areaKm2 * (1 - share), s.axisRatio);
      const aChild = semiMajor(s.areaKm2 * share, s.axisRatio);
      const dist = aParent + aChild + P.touchGapKm + 1;
      const th = (s.orientationDeg * Math.PI) / 180;
      const sign = a.rng.chance(0.5) ? 1 : -1;
      const ux = sign * Math.sin(th);
      const uy = sign * Math.cos(th);
      a.x += ux * dist * share;
      a.y += uy * dist * share;
      c.x = s.x - ux * dist * (1 - share);
      c.y = s.y - uy * dist * (1 - share);
      c.vx = a.vx - 0.15 * ux;
      c.vy = a.vy - 0.15 * uy;
      a.vx += 0.1 * ux;
      a.vy += 0.1 * uy;
      a.cell.states[a.cell.states.length - 1] = stateOf(a, step);
      child.states.push(stateOf(c, step));
      cells.push(child);
      active.push(c);
    }

    // 3. Births, component by component.
    for (const comp of comps) {
      const factor = comp === 'background' ? Math.sqrt(dayFactors[d]) : dayFactors[d];
      const expected = P.birthsPerDay[comp] * shapes[comp][sod] * factor;
      const nBirths = br.poisson(expected);
      for (let b = 0; b < nBirths; b++) {
        const sampler = comp === 'hill' ? (hillSampler as GridSampler) : staticSamplers[comp];
        const cellRng = new Rng(seed, 'cell-birth', d, birthIndex++);
        const zv = cellRng.normal();
        const aPeak = semiMajor(P.peakAreaMedianKm2 * Math.exp(P.peakAreaSigma * zv), 0.7);
        let pos: [number, number] | null = null;
        for (let t = 0; t < 6 && !pos; t++) {
          const p = sampler.sample(br);
          if (Math.hypot(p[0], p[1]) <= P.domainKm && !tooClose(p[0], p[1], aPeak)) pos = p;
        }
        if (!pos) continue;
        const id = nextId++;
        const cell: ModelCell = { id, kind: comp, birthStep: step, states: [] };
        const a = newActive(cell, cellRng, pos[0], pos[1], mean, zv);
        cell.states.push(stateOf(a, step));
        cells.push(cell);
        active.push(a);
        // Merge pairs: a smaller companion born nearby, converging on the first.
        if (cellRng.chance(P.mergePairChance)) {
          const zc = zv - cellRng.range(0, 0.6);
          const aComp = semiMajor(P.peakAreaMedianKm2 * Math.exp(P.peakAreaSigma * zc), 0.7);
          const dist = aPeak + aComp + cellRng.range(3, 6);
          const ang = 2 * Math.PI * cellRng.uniform();
          const cx = pos[0] + dist * Math.sin(ang);
          const cy = pos[1] + dist * Math.cos(ang);
          if (Math.hypot(cx, cy) > P.domainKm || tooClose(cx, cy, aComp, a)) continue;
          const cid = nextId++;
          const comp2: ModelCell = { id: cid, kind: 'mergePair', birthStep: step, states: [] };
          const c = newActive(comp2, new Rng(seed, 'cell', cid), cx, cy, mean, zc);
          const closing = cellRng.range(0.5, 1.0);
          c.vx = a.vx - closing * Math.sin(ang);
          c.vy = a.vy - closing * Math.cos(ang);
          c.lifeSteps = Math.max(c.lifeSteps, a.lifeSteps * 0.8);
          c.splitAtTau = null;
          comp2.states.push(stateOf(c, step));
          cells.push(comp2);
          active.push(c);
        }
      }
    }

    // 4. Merges: footprints that touch become one region; the larger survives.
    const living = active.filter((a) => a.alive && a.cell.states[a.cell.states.length - 1]?.step === step);
    for (let i = 0; i < living.length; i++) {
      for (let j = i + 1; j < living.length; j++) {
        const A = living[i];
        const B = living[j];
        if (!A.alive || !B.alive) continue;
        const sa = A.cell.states[A.cell.states.length - 1];
        const sb = B.cell.states[B.cell.states.length - 1];
        if (sa.areaKm2 < 0.5 || sb.areaKm2 < 0.5) continue;
        const gap =
          Math.hypot(sa.x - sb.x, sa.y - sb.y) -
          semiMajor(sa.areaKm2, sa.axisRatio) -
          semiMajor(sb.areaKm2, sb.axisRatio);
        if (gap >= P.touchGapKm) continue;
        const [S, V, ss, sv] = sa.areaKm2 >= sb.areaKm2 ? [A, B, sa, sb] : [B, A, sb, sa];
        const total = ss.areaKm2 + sv.areaKm2;
        const w = sv.areaKm2 / total;
        S.boost *= Math.min(2.5, total / ss.areaKm2);
        S.x = ss.x * (1 - w) + sv.x * w;
        S.y = ss.y * (1 - w) + sv.y * w;
        S.vx = S.vx * (1 - w) + V.vx * w;
        S.vy = S.vy * (1 - w) + V.vy * w;
        S.peakDbz = Math.max(S.peakDbz, V.peakDbz);
        S.peakTop35Km = Math.max(S.peakTop35Km, V.peakTop35Km);
        S.lifeSteps += 0.3 * Math.max(0, V.lifeSteps * (1 - tauOf(V)));
        S.splitAtTau = null;
        S.cell.states[S.cell.states.length - 1] = stateOf(S, step);
        V.alive = false;
        V.cell.states.pop();
        V.cell.mergedIntoId = S.cell.id;
        V.cell.mergeStep = step;
      }
    }
    for (let i = active.length - 1; i >= 0; i--) if (!active[i].alive) active.splice(i, 1);
  }
  cells.sort((a, b) => a.id - b.id);
  return { cells, dayFactors };
}
