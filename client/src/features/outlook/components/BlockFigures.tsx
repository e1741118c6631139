import type { OutlookResponse } from '@stormhour/shared';
import { SortableTable } from '../../../components/SortableTable';
import { percent } from '../outlookFormat';

const interval = (lower: number | null, upper: number | null) =>
  lower === null || upper === null ? '–' : `${percent(lower)}–${percent(upper)}`;

/** Per block: the afternoon chance and the chance of a week with an afternoon storm, with intervals and n. */
export function BlockFigures({ outlook }: { outlook: OutlookResponse }) {
  const rows = outlook.blocks.map((b) => ({
    id: String(b.blockId),
    block: `${b.name} (${b.code})`,
    district: b.districtName,
    afternoon: b.afternoon.rate,
    afternoonInterval: interval(b.afternoon.lower, b.afternoon.upper),
    n: b.afternoon.n,
    shrunk: b.afternoon.shrunk,
    perArea: b.afternoon.per100Km2,
    week: b.week.rate,
    weekInterval: interval(b.week.lower, b.week.upper),
    windows: b.hasData ? b.week.windows : null,
    climatology: b.climatologyRate,
    ratio: b.ratioToClimatology,
    peak: b.peakBin === null ? '–' : outlook.bins[b.peakBin].label,
  }));
  const headers = [
    { key: 'block', header: 'Block' },
    { key: 'district', header: 'District' },
    { key: 'afternoon', header: 'Afternoon chance' },
    { key: 'afternoonInterval', header: '90 % interval' },
    { key: 'n', header: 'n days' },
    { key: 'shrunk', header: 'Shrunk' },
    { key: 'perArea', header: 'Onsets /100 km² /day' },
    { key: 'week', header: 'Week chance' },
    { key: 'weekInterval', header: 'Week 90 %' },
    { key: 'windows', header: 'n windows' },
    { key: 'climatology', header: 'All days' },
    { key: 'ratio', header: '× all days' },
    { key: 'peak', header: 'Peak bin' },
  ];
  const rates = new Set(['afternoon', 'shrunk', 'week', 'climatology']);
  return (
    <SortableTable
      rows={rows}
      headers={headers}
      label="Afternoon and weekly figures per block"
      title="Afternoon and week, per block"
      description={`Afternoon = ${outlook.afternoon.fromHour}–${outlook.afternoon.toHour} local. Week = at least one afternoon storm in 7 consecutive counted days, counted from the record.`}
      empty="No blocks."
      renderCell={(header, value) => {
        if (value === null || value === undefined)
          return header === 'n' || header === 'windows' ? 'no data' : '–';
        if (rates.has(header)) return percent(value as number);
        if (header === 'perArea') return (value as number).toFixed(3);
        if (header === 'ratio') return `${(value as number).toFixed(2)} ×`;
        return value as string;
      }}
    />
  );
}
