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

/**
 * A bulletin as labelled lines, one idea per line, so that two versions can be compared line by line
 * and a change shows where it is ("Outlook · Sallow Ford: …").
 */
export function bulletinLines(c: BulletinContent): string[] {
  return [
    `Number: ${c.number}`,
    `Week: ${c.weekStart} to ${c.weekEnd}`,
    `Regime: ${c.regimeLabel ?? 'all days'}`,
    ...c.summary.split('\n').map((line) => `Summary: ${line}`),
    ...c.outlook.map(
      (b) =>
        `Outlook · ${b.blockName}: ${chanceText(b.afternoonChance)} (${intervalText(b)}, n = ${b.n}), peak ${hourText(b.peakHourLocal)}, ${b.inWords}`,
    ),
    ...c.crops.flatMap((a) =>
      a.advice.split('\n').map((line) => `Crop advice · ${a.crop} (${a.stage}): ${line}`),
    ),
    ...c.generalAdvice.split('\n').map((line) => `General advice: ${line}`),
    ...c.cautions.map((t) => `Caution: ${t}`),
  ];
}
