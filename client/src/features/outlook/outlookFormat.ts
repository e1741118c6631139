import { colors } from '@carbon/colors';
import { type OutlookBlock, type OutlookFigure, SMALL_N } from '@stormhour/shared';

/** Nine steps of Carbon's blue palette, light (rare) to dark (likely). */
export const CHANCE_STEPS = [10, 20, 30, 40, 50, 60, 70, 80, 90].map((grade) => colors.blue[grade]);
export const NO_DATA_FILL = colors.gray[20];

export function percent(v: number | null, digits = 0): string {
  return v === null ? '–' : `${(v * 100).toFixed(digits)} %`;
}

/** The colour of a chance on a scale from 0 to `top` (the largest chance shown, so the map uses its range). */
export function chanceColour(chance: number | null, top: number): string {
  if (chance === null) return NO_DATA_FILL;
  const share = top > 0 ? Math.min(1, chance / top) : 0;
  return CHANCE_STEPS[Math.min(CHANCE_STEPS.length - 1, Math.floor(share * CHANCE_STEPS.length))];
}

/** The legend's classes, e.g. "0–5 %", for the same scale. */
export function chanceClasses(top: number): { colour: string; label: string }[] {
  const step = top / CHANCE_STEPS.length;
  return CHANCE_STEPS.map((colour, i) => ({
    colour,
    label: `${(i * step * 100).toFixed(0)}–${((i + 1) * step * 100).toFixed(0)} %`,
  }));
}

export const isSmallN = (f: OutlookFigure) => f.n !== null && f.n < SMALL_N;

/** "32 % (90 % 24–41 %, n 118)" — a figure with its interval and its days. */
export function describeFigure(f: OutlookFigure): string {
  if (f.n === null) return 'no data';
  if (f.rate === null) return `no day counted (n ${f.n})`;
  return `${percent(f.rate)} (90 % interval ${percent(f.lower)}–${percent(f.upper)}, ${f.x} of ${f.n} days)`;
}

/** The afternoon chance a block is coloured by: the shrunk estimate, steadier than the raw rate. */
export const mapValue = (b: OutlookBlock) => (b.hasData ? b.afternoon.shrunk : null);
