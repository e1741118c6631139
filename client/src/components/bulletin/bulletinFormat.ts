import { type BulletinBlockOutlook, type BulletinContent, formatPercent } from '@stormhour/shared';

/** A chance as officers read it in the table; "no data" rather than a zero that was never measured. */
export function chanceText(p: number | null): string {
  return p === null ? 'no data' : formatPercent(p);
}

export function hourText(hour: number | null): string {
  return hour === null ? '–' : `${String(hour).padStart(2, '0')}:00`;
}

export function intervalText(b: Pick<BulletinBlockOutlook, 'lower' | 'upper'>): string {
  return b.lower === null || b.upper === null ? '–' : `${formatPercent(b.lower)}–${formatPercent(b.upper)}`;
}

/**
 * The change from the usual chance in numbers, beside the words the server wrote:
 * "+27 points (usual 25 %)". Points, not a ratio, because a ratio of two small chances overstates.
 */
export function changeText(b: Pick<BulletinBlockOutlook, 'afternoonChance' | 'climatologyChance'>): string {
  if (b.afternoonChance === null || b.climatologyChance === null) return '–';
  const points = Math.round(b.afternoonChance * 100) - Math.round(b.climatologyChance * 100);
  const sign = points > 0 ? '+' : points < 0 ? '−' : '±';
  return `${sign}${Math.abs(points)} points (usual ${formatPercent(b.climatologyChance)})`;
}

export function windowText(c: Pick<BulletinContent, 'afternoonFromHour' | 'afternoonToHour'>): string {
  return `${hourText(c.afternoonFromHour)}–${hourText(c.afternoonToHour)} local time`;
}
