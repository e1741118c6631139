import type { RegimesResponse } from '@stormhour/shared';
import { formatQ } from '../regimeFormat';

const speed = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });

/** The bounds and sectors the days below were classified with. */
export function RegimeThresholds({ regimes }: { regimes: RegimesResponse }) {
  const { settings, moistureBoundsGKg: bounds } = regimes;
  const method =
    settings.moistureMethod === 'terciles' ? 'terciles of this period’s q′' : 'fixed bounds set for the site';
  return (
    <dl className="regime-thresholds" aria-label="Thresholds in use">
      <div>
        <dt>Moisture classes ({method})</dt>
        <dd>
          {bounds
            ? `dry below ${formatQ(bounds[0])}; near normal from ${formatQ(bounds[0])} to ${formatQ(bounds[1])}; moist above ${formatQ(bounds[1])}`
            : 'not set yet: too few days with q′'}
        </dd>
      </div>
      <div>
        <dt>Flow classes (direction the anomaly wind blows from)</dt>
        <dd>
          weak below {speed.format(settings.weakBelowMs)} m/s; otherwise{' '}
          {settings.sectors.map((s) => `${s.name} ${s.fromDeg}°–${s.toDeg}°`).join(', ')}
        </dd>
      </div>
    </dl>
  );
}
