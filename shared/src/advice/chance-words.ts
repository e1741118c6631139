/**
 * Chances in plain words, as natural frequencies ("about 1 afternoon in 4"), which readers without
 * statistics training grasp more reliably than percentages.
 *
 * The mapping:
 * - below 5 %: "rarely" (fewer than 1 afternoon in 20);
 * - 80 % and above: "most afternoons";
 * - otherwise the nearest fraction of this ladder, by absolute difference (ties go to the smaller):
 *   1/20, 1/15, 1/12, 1/10, 1/8, 1/7, 1/6, 1/5, 1/4, 1/3, 2/5, 1/2, 3/5, 2/3, 3/4.
 *   The small fractions are spaced so that each word covers a band of a few percentage points.
 * The long form names the unit once ("about 1 afternoon in 2"); the short form, used after it, does not
 * ("usually 1 in 4").
 */
export const CHANCE_LADDER: readonly [number, number][] = [
  [1, 20],
  [1, 15],
  [1, 12],
  [1, 10],
  [1, 8],
  [1, 7],
  [1, 6],
  [1, 5],
  [1, 4],
  [1, 3],
  [2, 5],
  [1, 2],
  [3, 5],
  [2, 3],
  [3, 4],
];
export const RARELY_BELOW = 0.05;
export const MOST_FROM = 0.8;

export type ChanceBand = { kind: 'rarely' } | { kind: 'most' } | { kind: 'fraction'; k: number; n: number };

export function chanceBand(p: number): ChanceBand {
  if (!(p >= 0 && p <= 1)) throw new Error(`A chance must be between 0 and 1, not ${p}`);
  if (p < RARELY_BELOW) return { kind: 'rarely' };
  if (p >= MOST_FROM) return { kind: 'most' };
  let best = CHANCE_LADDER[0];
  for (const f of CHANCE_LADDER) {
    // A margin keeps exact ties (0.55 between 1/2 and 3/5) with the smaller despite rounding noise.
    if (Math.abs(f[0] / f[1] - p) < Math.abs(best[0] / best[1] - p) - 1e-9) best = f;
  }
  return { kind: 'fraction', k: best[0], n: best[1] };
}

/** "about 1 afternoon in 2" (long) or "about 1 in 2" (short); "rarely"; "most afternoons". */
export function chanceInWords(p: number, form: 'long' | 'short' = 'long'): string {
  const band = chanceBand(p);
  if (band.kind === 'rarely') return 'rarely';
  if (band.kind === 'most') return 'most afternoons';
  if (form === 'short') return `about ${band.k} in ${band.n}`;
  return `about ${band.k} ${band.k === 1 ? 'afternoon' : 'afternoons'} in ${band.n}`;
}

/** A chance as a whole percentage: "52 %"; "<1 %" for a chance above 0 that rounds to 0. */
export function formatPercent(p: number): string {
  const pct = Math.round(p * 100);
  return pct === 0 && p > 0 ? '<1 %' : `${pct} %`;
}

/** What a chance usually is, after the chance itself: "usually 1 in 4", "usually rare". */
export function baseRateInWords(base: number): string {
  const band = chanceBand(base);
  if (band.kind === 'rarely') return 'usually rare';
  if (band.kind === 'most') return 'usually most afternoons';
  return `usually ${band.k} in ${band.n}`;
}

/**
 * The chance with the change from the all-days climatology, e.g. "about 1 afternoon in 2, usually 1 in 4";
 * "about 1 afternoon in 4, as usual" when both fall in the same band.
 */
export function chanceWithClimatology(p: number, base: number | null): string {
  const words = chanceInWords(p);
  if (base === null) return words;
  const same = JSON.stringify(chanceBand(p)) === JSON.stringify(chanceBand(base));
  return same ? `${words}, as usual` : `${words}, ${baseRateInWords(base)}`;
}
