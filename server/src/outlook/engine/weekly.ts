/**
 * The chance of at least one afternoon storm in a 7-day week, counted from the record rather than
 * assumed from independent days: over the counted days in date order, every run of 7 consecutive
 * entries is a window; a window is a hit when any of its days had a storm (DESIGN §3.5).
 */
export function weekWindows(hitByDay: ArrayLike<number>, length = 7): { windows: number; hits: number } {
  const days = hitByDay.length;
  if (days < length) return { windows: 0, hits: 0 };
  let inWindow = 0;
  let hits = 0;
  for (let i = 0; i < days; i++) {
    if (hitByDay[i]) inWindow++;
    if (i >= length && hitByDay[i - length]) inWindow--;
    if (i >= length - 1 && inWindow > 0) hits++;
  }
  return { windows: days - length + 1, hits };
}
