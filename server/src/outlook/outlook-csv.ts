import type { OutlookFigure, OutlookResponse } from '@stormhour/shared';
import Papa from 'papaparse';

const round = (v: number | null, digits = 4) => (v === null ? '' : Number(v.toFixed(digits)));

/** The outlook as one row per block and bin, with the block's afternoon and weekly figures repeated. */
export function outlookCsv(o: OutlookResponse): string {
  const figure = (prefix: string, f: OutlookFigure) => ({
    [`${prefix}n`]: f.n ?? '',
    [`${prefix}x`]: f.x ?? '',
    [`${prefix}rate`]: round(f.rate),
    [`${prefix}lower`]: round(f.lower),
    [`${prefix}upper`]: round(f.upper),
    [`${prefix}shrunk`]: round(f.shrunk),
    [`${prefix}per_100km2_day`]: round(f.per100Km2, 5),
  });
  const rows = o.blocks.flatMap((b) =>
    o.bins.map((bin) => ({
      site: o.siteCode,
      source: o.source ?? '',
      measure: o.measure,
      regime: o.regime,
      from: o.from ?? '',
      to: o.to ?? '',
      interval: `${o.interval} ${o.level * 100}%`,
      district: b.districtName,
      block_code: b.code,
      block_name: b.name,
      coverage: round(b.coverage, 3),
      bin_local: bin.label,
      ...figure('', b.bins[bin.index]),
      ...figure('afternoon_', b.afternoon),
      climatology_afternoon_rate: round(b.climatologyRate),
      ratio_to_climatology: round(b.ratioToClimatology, 3),
      week_windows: b.week.windows,
      week_rate: round(b.week.rate),
      week_lower: round(b.week.lower),
      week_upper: round(b.week.upper),
      peak_bin: b.peakBin === null ? '' : o.bins[b.peakBin].label,
    })),
  );
  return Papa.unparse(rows);
}
