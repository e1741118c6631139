/**
 * Points placed along an axis drawn between two points of a plane (km): the distance along the axis
 * from its first point (the scalar projection on the unit vector) and the signed distance across it
 * (positive to the left when looking from the first point to the second).
 */

export interface PlaneAxis {
  ax: number;
  ay: number;
  bx: number;
  by: number;
}

export function axisLength({ ax, ay, bx, by }: PlaneAxis): number {
  return Math.hypot(bx - ax, by - ay);
}

export function projectOntoAxis(
  xs: Float64Array,
  ys: Float64Array,
  axis: PlaneAxis,
): { along: Float64Array; across: Float64Array } {
  const length = axisLength(axis);
  if (!(length > 0)) throw new Error('projectOntoAxis: the axis needs two different points');
  const ux = (axis.bx - axis.ax) / length;
  const uy = (axis.by - axis.ay) / length;
  const along = new Float64Array(xs.length);
  const across = new Float64Array(xs.length);
  for (let i = 0; i < xs.length; i++) {
    const dx = xs[i] - axis.ax;
    const dy = ys[i] - axis.ay;
    along[i] = dx * ux + dy * uy;
    across[i] = ux * dy - uy * dx;
  }
  return { along, across };
}

/**
 * Counts on a distance × local-hour grid of the points inside the corridor (|across| ≤ half-width,
 * 0 ≤ along ≤ length). Row r holds distances [r·step, (r+1)·step); the far end joins the last row.
 */
export function timeDistanceCounts(
  along: Float64Array,
  across: Float64Array,
  hours: Float64Array,
  lengthKm: number,
  halfWidthKm: number,
  stepKm: number,
): { counts: number[][]; inCorridor: number } {
  const rows = Math.max(1, Math.ceil(lengthKm / stepKm - 1e-9));
  const counts = Array.from({ length: rows }, () => new Array<number>(24).fill(0));
  let inCorridor = 0;
  for (let i = 0; i < along.length; i++) {
    if (Math.abs(across[i]) > halfWidthKm || along[i] < 0 || along[i] > lengthKm) continue;
    const r = Math.min(rows - 1, Math.floor(along[i] / stepKm));
    counts[r][Math.floor(hours[i]) % 24]++;
    inCorridor++;
  }
  return { counts, inCorridor };
}
