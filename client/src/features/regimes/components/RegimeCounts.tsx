import type { DataTableHeader } from '@carbon/react';
import type { RegimesResponse } from '@stormhour/shared';
import { SortableTable } from '../../../components/SortableTable';
import { colourOf, type RegimeStyle } from '../regimeFormat';

const HEADERS: DataTableHeader[] = [
  { key: 'regime', header: 'Regime' },
  { key: 'days', header: 'Days' },
  { key: 'share', header: 'Share (%)' },
];

const share = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 1 });

/** How many days fell in each regime; sortable by any column. */
export function RegimeCounts({
  counts,
  styles,
}: {
  counts: RegimesResponse['counts'];
  styles: RegimeStyle[];
}) {
  const total = counts.reduce((sum, c) => sum + c.days, 0);
  const rows = counts.map((c) => ({
    id: c.regime,
    regime: c.regime,
    days: c.days,
    share: total === 0 ? 0 : (100 * c.days) / total,
  }));
  return (
    <SortableTable
      rows={rows}
      headers={HEADERS}
      label="Days per regime"
      description="Share is of the days that have a regime; days without data are left out."
      empty="No day could be classified in this period."
      cellClassName={(header) => (header === 'regime' ? undefined : 'numeric')}
      renderCell={(header, value) => {
        if (header === 'regime') {
          return (
            <>
              <span
                className="map-legend__swatch"
                style={{ background: colourOf(styles, value as string) }}
                aria-hidden="true"
              />
              {value as string}
            </>
          );
        }
        if (header === 'share') return share.format(value as number);
        return String(value);
      }}
    />
  );
}
