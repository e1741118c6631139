import { ANOMALY_GRID, ANOMALY_PARAMS, FORECAST_WEEK, SITE } from './config.js';
import { RadarProjection } from './geo.js';
import { Rng, ValueNoise } from './prng.js';

export type AnomalyVariable = 'q' | 'u' | 'v';
export const ANOMALY_VARIABLES: readonly AnomalyVariable[] = ['q', 'u', 'v'];
export const ANOMALY_UNITS: Record<AnomalyVariable, string> = { q: 'g/kg', u: 'm/s', v: 'm/s' };
export const ANOMALY_QUANTITIES: Record<AnomalyVariable, string> = {
  q: 'specific humidity anomaly',
  u: 'eastward wind anomaly',
  v: 'northward wind anomaly',
};

export interface DailyMeans {
  q: number;
  u: number;
  v: number;
}

export interface AnomalyGrids {
  /** local dates, YYYY-MM-DD */
  dates: string[];
  /** pixel-centre longitudes west → east and latitudes north → south */
  lons: number[];
  lats: number[];
  /** one row-major (north row first) grid per day and variable, values rounded as written */
  fields: Record<AnomalyVariable, Float32Array[]>;
  /** cos(lat)-weighted mean over the grid points inside the radar coverage, per day */
  coverageMeans: DailyMeans[];
  /** hidden flow regime of each day (the Markov chain's state) */
  regimes: string[];
}

/** Number of decimals written for each variable (CSV and GeoTIFF carry the same rounded values). */
export const ANOMALY_DECIMALS: Record<AnomalyVariable, number> = { q: 3, u: 2, v: 2 };

export function gridAxis(from: number, to: number, step: number): number[] {
  const n = Math.round((to - from) / step) + 1;
  return Array.from({ length: n }, (_, i) => Math.round((from + i * step) * 1e6) / 1e6);
}

/**
 * Daily 850 hPa anomalies of specific humidity and wind: a Markov chain of flow regimes (persistent,
 * so spells of several days), a moisture anomaly that follows the regime with a lag plus AR(1)
 * noise (dry and moist spells), large-scale gradients and a little texture.
 */
export function generateAnomalies(seed: number, dates: string[]): AnomalyGrids {
  const P = ANOMALY_PARAMS;
  const r = new Rng(seed, 'anomalies');
  const texture = new ValueNoise(seed, 'anomaly-texture');
  const lons = gridAxis(ANOMALY_GRID.west, ANOMALY_GRID.east, ANOMALY_GRID.step);
  const lats = gridAxis(ANOMALY_GRID.south, ANOMALY_GRID.north, ANOMALY_GRID.step).reverse();
  const nx = lons.length;
  const ny = lats.length;
  const proj = new RadarProjection(SITE.lat, SITE.lon);
  const inCoverage: boolean[] = [];
  for (const lat of lats) {
    for (const lon of lons) {
      const [x, y] = proj.toXY(lon, lat);
      inCoverage.push(Math.hypot(x, y) <= SITE.rangeKm);
    }
  }

  const fields: Record<AnomalyVariable, Float32Array[]> = { q: [], u: [], v: [] };
  const coverageMeans: DailyMeans[] = [];
  const regimes: string[] = [];
  const weights = P.regimeWeights as readonly number[];
  const drawRegime = (exclude: number): number => {
    let total = 0;
    weights.forEach((w, i) => {
      if (i !== exclude) total += w;
    });
    let t = r.uniform() * total;
    for (let i = 0; i < weights.length; i++) {
      if (i === exclude) continue;
      t -= weights[i];
      if (t <= 0) return i;
    }
    return weights.length - 1;
  };

  let regime = drawRegime(-1);
  let m = 0;
  let e = r.normal() * 0.8;
  let nu = 0;
  let nv = 0;
  const grad = { qx: 0, qy: 0, ux: 0, uy: 0, vx: 0, vy: 0 };
  dates.forEach((_, d) => {
    if (d > 0 && !r.chance(P.regimePersistence)) regime = drawRegime(regime);
    const reg = P.regimes[regime];
    regimes.push(reg.name);
    // Domain-mean wind anomaly: the regime's vector, scaled a little, plus AR(1) noise.
    const from = (reg.fromDeg * Math.PI) / 180;
    const speed = reg.speedMS * (0.8 + 0.4 * r.uniform());
    nu = 0.5 * nu + P.windNoiseMS * r.normal();
    nv = 0.5 * nv + P.windNoiseMS * r.normal();
    const u0 = -speed * Math.sin(from) + nu;
    const v0 = -speed * Math.cos(from) + nv;
    m = P.qLag * m + (1 - P.qLag) * P.qGain * reg.qShift;
    e = P.qAr * e + P.qInnovation * r.normal();
    const q0 = m + e;
    const ga = P.gradientAr;
    const gs = Math.sqrt(1 - ga * ga);
    grad.qx = ga * grad.qx + gs * P.gradientSigma.q * r.normal();
    grad.qy = ga * grad.qy + gs * P.gradientSigma.q * r.normal();
    grad.ux = ga * grad.ux + gs * P.gradientSigma.wind * r.normal();
    grad.uy = ga * grad.uy + gs * P.gradientSigma.wind * r.normal();
    grad.vx = ga * grad.vx + gs * P.gradientSigma.wind * r.normal();
    grad.vy = ga * grad.vy + gs * P.gradientSigma.wind * r.normal();

    const q = new Float32Array(nx * ny);
    const u = new Float32Array(nx * ny);
    const v = new Float32Array(nx * ny);
    let wsum = 0;
    const sums = { q: 0, u: 0, v: 0 };
    const round = (val: number, k: number) => Math.round(val * 10 ** k) / 10 ** k;
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const dx = lons[i] - 88;
        const dy = lats[j] - 14;
        const t1 = texture.fractal(lons[i] * 1.3 + 31.7 * d, lats[j] * 1.3 - 17.3 * d, 1, 2);
        const t2 = texture.fractal(lons[i] * 1.3 - 23.1 * d + 500, lats[j] * 1.3 + 13.9 * d, 1, 2);
        const t3 = texture.fractal(lons[i] * 1.3 + 7.7 * d + 900, lats[j] * 1.3 + 29.3 * d, 1, 2);
        const k = j * nx + i;
        q[k] = round(q0 + grad.qx * dx + grad.qy * dy + P.textureSigma.q * 2 * t1, ANOMALY_DECIMALS.q);
        u[k] = round(u0 + grad.ux * dx + grad.uy * dy + P.textureSigma.wind * 2 * t2, ANOMALY_DECIMALS.u);
        v[k] = round(v0 + grad.vx * dx + grad.vy * dy + P.textureSigma.wind * 2 * t3, ANOMALY_DECIMALS.v);
        if (inCoverage[k]) {
          const w = Math.cos((lats[j] * Math.PI) / 180);
          wsum += w;
          sums.q += w * q[k];
          sums.u += w * u[k];
          sums.v += w * v[k];
        }
      }
    }
    fields.q.push(q);
    fields.u.push(u);
    fields.v.push(v);
    coverageMeans.push({ q: sums.q / wsum, u: sums.u / wsum, v: sums.v / wsum });
  });
  return { dates, lons, lats, fields, coverageMeans, regimes };
}

/** Direction the wind blows from, degrees clockwise from north in [0, 360) (NCL wind_direction). */
export function windFromDeg(u: number, v: number): number {
  if (u === 0 && v === 0) return 0;
  const d = (Math.atan2(-u, -v) * 180) / Math.PI;
  return (d + 360) % 360;
}

/** The dates of the forecast week (FORECAST_WEEK), YYYY-MM-DD. */
export function forecastDates(): string[] {
  const first = Date.parse(`${FORECAST_WEEK.firstDate}T00:00:00Z`);
  return Array.from({ length: FORECAST_WEEK.days }, (_, d) =>
    new Date(first + d * 86_400_000).toISOString().slice(0, 10),
  );
}

/**
 * Forecast anomalies for the coming week: a moist south-easterly spell on the season's grid, from the
 * streams `forecast-anomalies` and `forecast-texture` (the season's streams are left alone).
 */
export function generateForecastAnomalies(
  seed: number,
  dates: string[] = forecastDates(),
): Pick<AnomalyGrids, 'dates' | 'lons' | 'lats' | 'fields'> {
  const F = FORECAST_WEEK;
  const r = new Rng(seed, 'forecast-anomalies');
  const texture = new ValueNoise(seed, 'forecast-texture');
  const lons = gridAxis(ANOMALY_GRID.west, ANOMALY_GRID.east, ANOMALY_GRID.step);
  const lats = gridAxis(ANOMALY_GRID.south, ANOMALY_GRID.north, ANOMALY_GRID.step).reverse();
  const nx = lons.length;
  const ny = lats.length;
  const fields: Record<AnomalyVariable, Float32Array[]> = { q: [], u: [], v: [] };
  const round = (val: number, k: number) => Math.round(val * 10 ** k) / 10 ** k;
  dates.forEach((_, d) => {
    const q0 = F.qMeanGKg + F.qSigmaGKg * r.normal();
    const from = ((F.fromDeg + F.fromSigmaDeg * r.normal()) * Math.PI) / 180;
    const speed = F.speedMS * (0.8 + 0.4 * r.uniform());
    const u0 = -speed * Math.sin(from);
    const v0 = -speed * Math.cos(from);
    const q = new Float32Array(nx * ny);
    const u = new Float32Array(nx * ny);
    const v = new Float32Array(nx * ny);
    for (let j = 0; j < ny; j++)
      for (let i = 0; i < nx; i++) {
        const k = j * nx + i;
        const t = (o: number) => texture.fractal(lons[i] * 1.3 + o + 11.1 * d, lats[j] * 1.3 - o, 1, 2);
        q[k] = round(q0 + ANOMALY_PARAMS.textureSigma.q * 2 * t(0), ANOMALY_DECIMALS.q);
        u[k] = round(u0 + ANOMALY_PARAMS.textureSigma.wind * 2 * t(500), ANOMALY_DECIMALS.u);
        v[k] = round(v0 + ANOMALY_PARAMS.textureSigma.wind * 2 * t(900), ANOMALY_DECIMALS.v);
      }
    fields.q.push(q);
    fields.u.push(u);
    fields.v.push(v);
  });
  return { dates, lons, lats, fields };
}
