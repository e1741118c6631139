import { colors } from '@carbon/colors';
import { MOISTURE_CLASSES, type MoistureClass, type RegimeDay, type RegimeSettings } from '@stormhour/shared';
import { scaleQuantize } from 'd3-scale';

/*
 * Words, colours and layout of the Regimes screen. A regime is a moisture class × a flow class; its
 * colour follows the same split: one hue per flow sector, a lighter grade for drier days.
 */

export const MOISTURE_TEXT: Record<MoistureClass, string> = {
  dry: 'dry',
  'near-normal': 'near normal',
  moist: 'moist',
};

/** Hues for the site's flow sectors, in the order the settings list them; weak flow has its own. */
const SECTOR_HUES = ['blue', 'magenta', 'teal', 'purple', 'green', 'cyan', 'red', 'orange'] as const;
const WEAK_HUE = 'yellow';
const GRADE_OF: Record<MoistureClass, number> = { dry: 30, 'near-normal': 50, moist: 70 };
/** For a regime name the days do not explain. */
const SPARE_COLOURS = [colors.warmGray[60], colors.coolGray[70], colors.warmGray[80]];

export const NO_DATA_COLOUR = colors.gray[20];
export const WEAK = 'weak';

export interface RegimeStyle {
  regime: string;
  colour: string;
  moisture: MoistureClass | null;
  flow: string | null;
}

function parseMoisture(text: string): MoistureClass | null {
  const normalised = text.trim().toLowerCase().replace(/\s+/g, '-');
  return (MOISTURE_CLASSES as readonly string[]).includes(normalised) ? (normalised as MoistureClass) : null;
}

/** Moisture and flow of a regime name such as "moist / onshore", from its days or else its wording. */
function partsOf(
  regime: string,
  days: readonly RegimeDay[],
): { moisture: MoistureClass | null; flow: string | null } {
  const day = days.find((d) => d.regime === regime && d.moisture !== null && d.flow !== null);
  if (day) return { moisture: day.moisture, flow: day.flow };
  const [moisture, flow] = regime.split('/').map((part) => part.trim());
  return { moisture: moisture ? parseMoisture(moisture) : null, flow: flow || null };
}

/**
 * Every regime seen in the days or counts, with its colour, ordered dry → moist and then by the
 * sectors as the settings list them, weak last. The same regime keeps its colour between periods.
 */
export function regimeStyles(
  days: readonly RegimeDay[],
  counts: readonly { regime: string }[],
  settings: RegimeSettings,
): RegimeStyle[] {
  const names = new Set<string>();
  for (const d of days) if (d.regime) names.add(d.regime);
  for (const c of counts) names.add(c.regime);
  const sectorNames = settings.sectors.map((s) => s.name);
  const flowRank = (flow: string | null) => {
    if (flow === WEAK) return sectorNames.length;
    const i = flow === null ? -1 : sectorNames.indexOf(flow);
    return i === -1 ? sectorNames.length + 1 : i;
  };
  let spare = 0;
  return [...names]
    .map((regime) => ({ regime, ...partsOf(regime, days) }))
    .sort(
      (a, b) =>
        (a.moisture ? GRADE_OF[a.moisture] : 99) - (b.moisture ? GRADE_OF[b.moisture] : 99) ||
        flowRank(a.flow) - flowRank(b.flow) ||
        a.regime.localeCompare(b.regime),
    )
    .map((style) => {
      const sector = style.flow === null ? -1 : sectorNames.indexOf(style.flow);
      const hue =
        style.flow === WEAK ? WEAK_HUE : sector >= 0 ? SECTOR_HUES[sector % SECTOR_HUES.length] : null;
      const colour =
        hue && style.moisture
          ? colors[hue][GRADE_OF[style.moisture]]
          : SPARE_COLOURS[spare++ % SPARE_COLOURS.length];
      return { ...style, colour };
    });
}

export function colourOf(styles: readonly RegimeStyle[], regime: string | null): string {
  if (regime === null) return NO_DATA_COLOUR;
  return styles.find((s) => s.regime === regime)?.colour ?? NO_DATA_COLOUR;
}

/** True when any day has an anomaly to classify by; before the first grid arrives none has. */
export function hasAnomalyData(days: readonly RegimeDay[]): boolean {
  return days.some((d) => d.q !== null || d.speedMs !== null);
}

/** The day's anomaly wind was too light to have a direction worth classing. */
export function isWeak(day: RegimeDay, settings: RegimeSettings): boolean {
  return day.flow === WEAK || (day.speedMs !== null && day.speedMs < settings.weakBelowMs);
}

const COMPASS_WORDS = [
  'north',
  'north-east',
  'east',
  'south-east',
  'south',
  'south-west',
  'west',
  'north-west',
] as const;

/** The nearest of the eight compass points to a direction in degrees clockwise from north, in words. */
export function compassWord(degrees: number): (typeof COMPASS_WORDS)[number] {
  const normalised = ((degrees % 360) + 360) % 360;
  return COMPASS_WORDS[Math.round(normalised / 45) % 8];
}

const twoDecimals = new Intl.NumberFormat('en-GB', {
  minimumFractionDigits: 2,
  maximumFractionDigits: 2,
  signDisplay: 'exceptZero',
});
const oneDecimal = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/** "+0.42 g/kg"; "no data" when no grid covered the day. */
export function formatQ(q: number | null): string {
  return q === null ? 'no data' : `${twoDecimals.format(q)} g/kg`;
}

/** A signed number with two decimals, for axis ticks and legends. */
export function formatSigned(value: number): string {
  return twoDecimals.format(value);
}

/** "3.4 m/s from 225° (south-west)". */
export function formatWind(speedMs: number | null, fromDeg: number | null): string {
  if (speedMs === null) return 'no data';
  if (fromDeg === null) return `${oneDecimal.format(speedMs)} m/s`;
  const rounded = Math.round(fromDeg) % 360;
  return `${oneDecimal.format(speedMs)} m/s from ${rounded}° (${compassWord(fromDeg)})`;
}

export function formatDegrees(degrees: number): string {
  return `${Math.round(degrees)}°`;
}

/** The flow class in words: a sector's name, or weak with its threshold. */
export function flowText(flow: string | null, settings: RegimeSettings): string {
  if (flow === null) return 'unknown';
  if (flow === WEAK) return `weak (below ${oneDecimal.format(settings.weakBelowMs)} m/s)`;
  return flow;
}

const dayFormat = new Intl.DateTimeFormat('en-GB', {
  timeZone: 'UTC',
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  year: 'numeric',
});
const monthFormat = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', month: 'short' });

const DAY_MS = 86_400_000;

function dateOf(day: string): Date {
  return new Date(`${day}T00:00:00Z`);
}

/** "Tue 14 Jul 2026" for the local date "2026-07-14". */
export function formatDay(day: string): string {
  return dayFormat.format(dateOf(day)).replace(',', '');
}

/** Every detail of a day, one per line, as its tooltip and readout say them. */
export function dayDetails(day: RegimeDay, settings: RegimeSettings): { term: string; value: string }[] {
  return [
    { term: 'Date', value: formatDay(day.date) },
    { term: 'Regime', value: day.regime ?? 'no data' },
    { term: 'q′ (moisture anomaly)', value: formatQ(day.q) },
    { term: 'Wind anomaly', value: formatWind(day.speedMs, day.directionFromDeg) },
    { term: 'Moisture class', value: day.moisture ? MOISTURE_TEXT[day.moisture] : 'unknown' },
    { term: 'Flow class', value: flowText(day.flow, settings) },
    { term: 'Coverage with data', value: `${Math.round(day.coverage * 100)} %` },
  ];
}

export interface CalendarCell {
  day: RegimeDay;
  /** Column: weeks since the Monday on or before the first day. */
  week: number;
  /** Row: 0 Monday … 6 Sunday. */
  weekday: number;
}

export interface CalendarLayout {
  cells: CalendarCell[];
  weeks: number;
  /** Where each month's label goes: the week holding its first day (or the first week). */
  months: { key: string; label: string; week: number }[];
}

function noDataDay(date: string): RegimeDay {
  return {
    date,
    q: null,
    u: null,
    v: null,
    speedMs: null,
    directionFromDeg: null,
    moisture: null,
    flow: null,
    regime: null,
    coverage: 0,
  };
}

/** One cell per day from the first to the last, weeks as columns; days the server left out show as no data. */
export function calendarLayout(days: readonly RegimeDay[]): CalendarLayout {
  if (days.length === 0) return { cells: [], weeks: 0, months: [] };
  const byDate = new Map(days.map((d) => [d.date, d]));
  const sorted = [...byDate.keys()].sort();
  const first = dateOf(sorted[0]).getTime();
  const last = dateOf(sorted[sorted.length - 1]).getTime();
  const lead = (new Date(first).getUTCDay() + 6) % 7;
  const cells: CalendarCell[] = [];
  const months: CalendarLayout['months'] = [];
  for (let t = first; t <= last; t += DAY_MS) {
    const at = new Date(t);
    const date = at.toISOString().slice(0, 10);
    const index = (t - first) / DAY_MS + lead;
    const week = Math.floor(index / 7);
    cells.push({ day: byDate.get(date) ?? noDataDay(date), week, weekday: index % 7 });
    if (t === first || at.getUTCDate() === 1) {
      // A month starting in the first week or two would crowd the label before it.
      if (months.length > 0 && months[months.length - 1].week >= week - 3) months.pop();
      const month = monthFormat.format(at);
      const label = months.length === 0 || at.getUTCMonth() === 0 ? `${month} ${at.getUTCFullYear()}` : month;
      months.push({ key: date, label, week });
    }
  }
  return { cells, weeks: cells[cells.length - 1].week + 1, months };
}

/** Dry browns to moist teals of Carbon's palette, with a neutral grey in the middle. */
export const DIVERGING = [
  colors.orange[80],
  colors.orange[70],
  colors.orange[50],
  colors.orange[20],
  colors.gray[10],
  colors.teal[20],
  colors.teal[40],
  colors.teal[60],
  colors.teal[80],
] as const;

/** A colour scale for composite q′ centred on zero, and its classes for the legend. */
export function compositeScale(q: readonly (readonly (number | null)[])[]) {
  let largest = 0;
  for (const row of q) for (const v of row) if (v !== null) largest = Math.max(largest, Math.abs(v));
  // A tidy round limit, so the legend reads in even steps.
  const step = largest <= 0 ? 0.1 : 10 ** Math.floor(Math.log10(largest)) / 2;
  const limit = Math.max(step, Math.ceil(largest / step) * step);
  const scale = scaleQuantize<string>().domain([-limit, limit]).range(DIVERGING);
  const classes = DIVERGING.map((colour) => {
    const [from, to] = scale.invertExtent(colour);
    return { colour, from, to };
  });
  return { colour: (value: number) => scale(value), classes, limit };
}
