import { Select, SelectItem } from '@carbon/react';
import { ATLAS_BIN_HOURS, ATLAS_CELL_TYPES, ATLAS_SOURCES, type SiteView } from '@stormhour/shared';
import { useDistricts } from '../../../api/districts';
import { SitePeriodFields } from '../../../components/SitePeriodFields';
import { useRegimes } from '../../regimes/api';
import type { AtlasParams } from '../api';
import { binLabel } from '../atlasParams';

export type FilterPatch = Partial<
  Record<'site' | 'from' | 'to' | 'regime' | 'district' | 'type' | 'source' | 'binHours' | 'bin', string>
>;

const SOURCE_NAMES: Record<string, string> = {
  'cell-table': 'Cell table',
  volume: 'Radar volumes',
  'column-max': 'Column maximum',
};

/** Site, period, regime, district, cell type, source and time of day: the filter of every view. */
export function AtlasFilters({
  sites,
  params,
  binHours,
  bin,
  onChange,
}: {
  sites: SiteView[];
  params: AtlasParams;
  binHours: number;
  bin: number | null;
  onChange: (patch: FilterPatch) => void;
}) {
  const regimes = useRegimes({ siteId: params.siteId, from: params.from, to: params.to });
  const districts = useDistricts();
  const regimeChoices = regimes.data?.counts ?? [];
  return (
    <div className="track-filters atlas-filters">
      <SitePeriodFields
        idPrefix="atlas"
        size="sm"
        sites={sites}
        siteId={params.siteId}
        from={params.from}
        to={params.to}
        onChange={onChange}
      />
      <Select
        size="sm"
        id="atlas-regime"
        labelText="Regime"
        value={params.regime ?? ''}
        onChange={(e) => onChange({ regime: e.target.value })}
        helperText={
          regimes.isSuccess && regimeChoices.length === 0 ? 'No anomaly grids: all days only' : undefined
        }
      >
        <SelectItem value="" text="All days" />
        {regimeChoices.map((r) => (
          <SelectItem key={r.regime} value={r.regime} text={`${r.regime} (${r.days} d)`} />
        ))}
      </Select>
      <Select
        size="sm"
        id="atlas-district"
        labelText="District"
        value={params.districtId === null ? '' : String(params.districtId)}
        onChange={(e) => onChange({ district: e.target.value })}
      >
        <SelectItem value="" text="All districts" />
        {(districts.data ?? []).map((d) => (
          <SelectItem key={d.id} value={String(d.id)} text={d.name} />
        ))}
      </Select>
      <Select
        size="sm"
        id="atlas-type"
        labelText="Cell type"
        value={params.cellType ?? ''}
        onChange={(e) => onChange({ type: e.target.value })}
      >
        <SelectItem value="" text="All types" />
        {ATLAS_CELL_TYPES.map((t) => (
          <SelectItem key={t} value={t} text={t} />
        ))}
      </Select>
      <Select
        size="sm"
        id="atlas-source"
        labelText="Source"
        value={params.source ?? ''}
        onChange={(e) => onChange({ source: e.target.value })}
      >
        <SelectItem value="" text="Most onsets" />
        {ATLAS_SOURCES.map((s) => (
          <SelectItem key={s} value={s} text={SOURCE_NAMES[s]} />
        ))}
      </Select>
      <Select
        size="sm"
        id="atlas-bin-hours"
        labelText="Time bins (map)"
        value={String(binHours)}
        onChange={(e) => onChange({ binHours: e.target.value, bin: '' })}
      >
        {ATLAS_BIN_HOURS.map((h) => (
          <SelectItem key={h} value={String(h)} text={`${h} h`} />
        ))}
      </Select>
      <Select
        size="sm"
        id="atlas-bin"
        labelText="Local time (map)"
        value={bin === null ? '' : String(bin)}
        onChange={(e) => onChange({ bin: e.target.value })}
      >
        <SelectItem value="" text="Whole day" />
        {Array.from({ length: 24 / binHours }, (_, k) => binLabel(binHours, k)).map((label, k) => (
          <SelectItem key={label} value={String(k)} text={label} />
        ))}
      </Select>
    </div>
  );
}
