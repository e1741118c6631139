import type { Coverage } from '../radar/engine/coverage.js';
import { isCovered } from '../radar/engine/coverage.js';
import { distanceAndAzimuth } from '../radar/engine/site-plane.js';
import type { GridDefinition } from './anomaly-climatology.js';
import { describeGrid } from './anomaly-climatology.js';
import type { AnomalyFile } from './anomaly-reader.js';
import { FileProblem } from './geotiff-reader.js';

/**
 * Refuses a grid none of whose cell centres lies in the site's coverage: the regimes average over those
 * cells (DESIGN §3.4), so such a grid could never give a day its means.
 */
export function checkOverlapsCoverage(grid: GridDefinition, site: Coverage & { code: string }): void {
  // Most grids hold the radar: try the cell nearest to it before walking the whole grid.
  const clamp = (k: number, n: number) => Math.min(n - 1, Math.max(0, Math.round(k)));
  const i0 = clamp((site.lon - grid.lon0) / grid.dLon, grid.nx);
  const j0 = clamp((grid.lat0 - site.lat) / grid.dLat, grid.ny);
  const near = distanceAndAzimuth(site, { lat: grid.lat0 - j0 * grid.dLat, lon: grid.lon0 + i0 * grid.dLon });
  if (isCovered(site, near.km, near.azimuthDeg)) return;
  for (let j = 0; j < grid.ny; j++) {
    const lat = grid.lat0 - j * grid.dLat;
    for (let i = 0; i < grid.nx; i++) {
      const { km, azimuthDeg } = distanceAndAzimuth(site, { lat, lon: grid.lon0 + i * grid.dLon });
      if (isCovered(site, km, azimuthDeg)) return;
    }
  }
  throw new FileProblem(
    'grid',
    `the grid (${describeGrid(grid)}) does not overlap the coverage of site ${site.code} (${site.rangeKm} km around ${site.lat}° N, ${site.lon}° E): no cell centre lies inside it`,
  );
}

/**
 * Remembers which file of an upload brought each day of each variable and level, and refuses a second
 * file repeating one: which of the two is right cannot be told.
 */
export class UploadDates {
  private readonly seen = new Map<string, string>();

  check(fileName: string, fields: AnomalyFile[]): void {
    const mine = new Map<string, string>();
    for (const f of fields)
      for (const d of f.days) {
        const key = `${f.variable}@${f.levelHpa}@${d.date}`;
        const other = this.seen.get(key);
        if (other)
          throw new FileProblem(
            d.where,
            `${d.date} of ${f.variable} at ${f.levelHpa} hPa is also in ${other} of this upload: upload each day once`,
          );
        mine.set(key, fileName);
      }
    for (const [k, v] of mine) this.seen.set(k, v);
  }
}
