import type { JobView, QualityReport } from '@stormhour/shared';

const number = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });

/** The site a job was for; jobs carry their request fields in `params`. */
export function jobSiteId(job: Pick<JobView, 'params'>): number | null {
  const value = job.params.siteId;
  const id = typeof value === 'string' ? Number(value) : value;
  return typeof id === 'number' && Number.isInteger(id) && id > 0 ? id : null;
}

/** "812 B", "14.2 kB", "3.1 MB" (decimal units, as file managers on most systems show them). */
export function formatBytes(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  const units = ['kB', 'MB', 'GB', 'TB'];
  let value = bytes;
  let unit = -1;
  while (value >= 1000 && unit < units.length - 1) {
    value /= 1000;
    unit++;
  }
  return `${number.format(value)} ${units[unit]}`;
}

/** "45 %" from a share 0–1. */
export function formatShare(share: number): string {
  return `${Math.round(share * 100)} %`;
}

/** A sentence that says what the cells-per-scan line shows. */
export function summariseCellsPerScan(
  points: QualityReport['cellsPerScan'],
  formatTime: (iso: string) => string,
): string {
  if (points.length === 0) return 'No scans were read, so there is nothing to plot.';
  const most = points.reduce((best, p) => (p.cells > best.cells ? p : best));
  const total = points.reduce((sum, p) => sum + p.cells, 0);
  const scans = points.length === 1 ? '1 scan' : `${points.length} scans`;
  return (
    `${scans} from ${formatTime(points[0].time)} to ${formatTime(points[points.length - 1].time)}; ` +
    `${number.format(total / points.length)} cells per scan on average; ` +
    `most in one scan: ${most.cells} at ${formatTime(most.time)}.`
  );
}

/** A sentence that says how many days reach the availability a day needs to count. */
export function summariseAvailability(days: QualityReport['availabilityByDay'], threshold: number): string {
  if (days.length === 0) return 'No days to show.';
  const counted = days.filter((d) => d.share >= threshold).length;
  const lowest = days.reduce((low, d) => (d.share < low.share ? d : low));
  return (
    `${counted} of ${days.length} ${days.length === 1 ? 'day has' : 'days have'} at least ` +
    `${formatShare(threshold)} of the expected scans; the lowest is ${formatShare(lowest.share)} on ${lowest.date}.`
  );
}
