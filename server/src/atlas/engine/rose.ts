/** A rose of directions: 16 sectors of 22.5° centred on N, NNE, …, NNW, with speed classes. */

export const SECTOR_NAMES = [
  'N',
  'NNE',
  'NE',
  'ENE',
  'E',
  'ESE',
  'SE',
  'SSE',
  'S',
  'SSW',
  'SW',
  'WSW',
  'W',
  'WNW',
  'NW',
  'NNW',
] as const;

const WIDTH = 360 / SECTOR_NAMES.length;

/**
 * Sector of a direction in degrees clockwise from north, any real value (wraps at 360°). Sectors are
 * half-open, [centre − 11.25°, centre + 11.25°), so a direction on a boundary goes clockwise.
 */
export function sectorOf(directionDeg: number): number {
  const wrapped = ((directionDeg % 360) + 360) % 360;
  return Math.floor((wrapped + WIDTH / 2) / WIDTH) % SECTOR_NAMES.length;
}

/** Index of the class whose lower edge is the largest not above the speed (edges ascending from 0). */
export function speedClassOf(speedMs: number, edges: readonly number[]): number {
  let k = 0;
  for (let i = 0; i < edges.length; i++) if (speedMs >= edges[i]) k = i;
  return k;
}

/** counts[sector][class]; directions that are NaN (no motion) are skipped. */
export function motionRose(
  directionsDeg: Float64Array,
  speedsMs: Float64Array,
  edges: readonly number[],
): { counts: number[][]; withMotion: number } {
  const counts = SECTOR_NAMES.map(() => new Array<number>(edges.length).fill(0));
  let withMotion = 0;
  for (let i = 0; i < directionsDeg.length; i++) {
    if (Number.isNaN(directionsDeg[i])) continue;
    const speed = Number.isNaN(speedsMs[i]) ? 0 : speedsMs[i];
    counts[sectorOf(directionsDeg[i])][speedClassOf(speed, edges)]++;
    withMotion++;
  }
  return { counts, withMotion };
}

/**
 * Mean of wind components (u east, v north) and its direction: the direction it blows FROM is
 * atan2(−u, −v) (meteorological convention), the direction it blows TOWARD is that plus 180°.
 */
export function meanWind(us: number[], vs: number[]) {
  if (us.length === 0) return null;
  const u = us.reduce((a, b) => a + b, 0) / us.length;
  const v = vs.reduce((a, b) => a + b, 0) / vs.length;
  const speedMs = Math.hypot(u, v);
  const fromDeg = speedMs === 0 ? 0 : ((((Math.atan2(-u, -v) * 180) / Math.PI) % 360) + 360) % 360;
  return { u, v, speedMs, fromDeg, towardDeg: (fromDeg + 180) % 360 };
}
