import type { IntervalMethod } from '@stormhour/shared';
import jStat from 'jstat';

export interface Interval {
  lower: number;
  upper: number;
}

/**
 * Equal-tailed Jeffreys interval: the α/2 and 1 − α/2 quantiles of Beta(x + ½, n − x + ½), with the
 * lower bound 0 when x = 0 and the upper bound 1 when x = n (Brown, Cai & DasGupta 2001, §4.1.2).
 * x may be fractional (the weekly figure's effective count).
 */
export function jeffreysInterval(x: number, n: number, level: number): Interval {
  const tail = (1 - level) / 2;
  return {
    lower: x <= 0 ? 0 : jStat.beta.inv(tail, x + 0.5, n - x + 0.5),
    upper: x >= n ? 1 : jStat.beta.inv(1 - tail, x + 0.5, n - x + 0.5),
  };
}

/** Wilson score interval (Wilson 1927; Brown, Cai & DasGupta 2001, §4.1.1). */
export function wilsonInterval(x: number, n: number, level: number): Interval {
  const z = jStat.normal.inv(1 - (1 - level) / 2, 0, 1);
  const p = x / n;
  const z2 = z * z;
  const centre = (p + z2 / (2 * n)) / (1 + z2 / n);
  const half = (z / (1 + z2 / n)) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return { lower: Math.max(0, centre - half), upper: Math.min(1, centre + half) };
}

/**
 * Beta quantiles cost tens of microseconds each and an outlook asks for thousands, mostly the same
 * (x, n) again (n is shared by every block of a bin): answers are remembered, up to a bound.
 */
const remembered = new Map<string, Interval>();
const REMEMBER_AT_MOST = 100_000;

/** The interval of x successes in n trials by the chosen method; null when n is 0. */
export function binomialInterval(
  method: IntervalMethod,
  x: number,
  n: number,
  level: number,
): Interval | null {
  if (n <= 0) return null;
  const key = `${method}|${x}|${n}|${level}`;
  let found = remembered.get(key);
  if (!found) {
    found = method === 'wilson' ? wilsonInterval(x, n, level) : jeffreysInterval(x, n, level);
    if (remembered.size >= REMEMBER_AT_MOST) remembered.clear();
    remembered.set(key, found);
  }
  return found;
}
