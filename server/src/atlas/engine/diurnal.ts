/** The daily cycle: counts and means by local hour (0–23), and the hour of each curve's peak. */

export function countByHour(hours: Float64Array, keep?: (i: number) => boolean): number[] {
  const counts = new Array<number>(24).fill(0);
  for (let i = 0; i < hours.length; i++) if (!keep || keep(i)) counts[Math.floor(hours[i]) % 24]++;
  return counts;
}

/** Mean of the values per hour, skipping NaN; null for an hour with no value. */
export function meanByHour(
  hours: Float64Array,
  values: Float64Array,
  keep?: (i: number) => boolean,
): { means: (number | null)[]; n: number } {
  const sums = new Float64Array(24);
  const counts = new Uint32Array(24);
  let n = 0;
  for (let i = 0; i < hours.length; i++) {
    if (Number.isNaN(values[i]) || (keep && !keep(i))) continue;
    const h = Math.floor(hours[i]) % 24;
    sums[h] += values[i];
    counts[h]++;
    n++;
  }
  return { means: Array.from(sums, (s, h) => (counts[h] ? s / counts[h] : null)), n };
}

/** Hour of the largest value (the first, on a tie); null when there is none. */
export function peakHour(values: readonly (number | null)[]): number | null {
  let best: number | null = null;
  values.forEach((v, h) => {
    if (v !== null && (best === null || v > (values[best] as number))) best = h;
  });
  return best;
}
