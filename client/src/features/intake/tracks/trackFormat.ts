import type { CellView, TrackView } from '@stormhour/shared';
import { NOT_ONSET_TEXT } from '../intakeWords';

const COMPASS = ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'] as const;

/** The nearest of the eight compass points to a direction in degrees from north, clockwise. */
export function compassPoint(degrees: number): (typeof COMPASS)[number] {
  const normalised = ((degrees % 360) + 360) % 360;
  return COMPASS[Math.round(normalised / 45) % 8];
}

/** "315° NW": the direction a storm moves toward; "—" when it did not move far enough to tell. */
export function formatHeading(degrees: number | null): string {
  if (degrees === null) return '—';
  return `${Math.round(degrees) % 360}° ${compassPoint(degrees)}`;
}

const decimals = (digits: number) =>
  new Intl.NumberFormat('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: digits });
const oneDecimal = decimals(1);

export function formatOneDecimal(value: number | null): string {
  return value === null ? '—' : oneDecimal.format(value);
}

/** "Yes", or why the first scan is not counted as an onset. */
export function onsetText(track: Pick<TrackView, 'onset' | 'notOnsetReason'>): string {
  if (track.onset) return 'Yes';
  return track.notOnsetReason ? NOT_ONSET_TEXT[track.notOnsetReason] : 'No';
}

/** The centroids as [lon, lat] in time order, the order the storm moved through them. */
export function trackPath(cells: readonly Pick<CellView, 'scanTime' | 'lon' | 'lat'>[]): [number, number][] {
  return [...cells]
    .sort((a, b) => Date.parse(a.scanTime) - Date.parse(b.scanTime))
    .map((c) => [c.lon, c.lat]);
}
