import { Checkbox, Select, SelectItem, TextInput } from '@carbon/react';
import type { BlockView, CellType, SiteView } from '@stormhour/shared';
import { useEffect, useState } from 'react';
import { useDebouncedValue } from '../../../../lib/useDebouncedValue';
import { CELL_TYPE_TEXT } from '../../intakeWords';
import { formatUtcOffset } from '../../siteTime';
import type { TracksView } from '../tracksSearch';

interface TrackFiltersProps {
  view: TracksView & { siteId: number };
  sites: SiteView[];
  blocks: BlockView[];
  offsetMinutes: number;
  onChange: (patch: Partial<TracksView>) => void;
}

/** Minimum duration as typed; sent once typing pauses, so each keystroke does not reload the table. */
function MinDuration({
  value,
  onChange,
}: {
  value: number | null;
  onChange: (value: number | null) => void;
}) {
  const [text, setText] = useState(value === null ? '' : String(value));
  const settled = useDebouncedValue(text, 400);
  const parsed = settled.trim() === '' ? null : Number(settled);
  const invalid = parsed !== null && (!Number.isFinite(parsed) || parsed < 0);
  useEffect(() => {
    if (!invalid && parsed !== value) onChange(parsed);
  }, [parsed, invalid, value, onChange]);
  return (
    <TextInput
      id="tracks-min-duration"
      labelText="Shortest duration (min)"
      inputMode="numeric"
      value={text}
      invalid={invalid}
      invalidText="Enter minutes, 0 or more"
      onChange={(e) => setText(e.target.value)}
    />
  );
}

export function TrackFilters({ view, sites, blocks, offsetMinutes, onChange }: TrackFiltersProps) {
  const zone = formatUtcOffset(offsetMinutes);
  return (
    <div className="track-filters">
      <Select
        id="tracks-site"
        labelText="Radar site"
        value={String(view.siteId)}
        onChange={(e) => onChange({ siteId: Number(e.target.value), page: 1 })}
      >
        {sites.map((s) => (
          <SelectItem key={s.id} value={String(s.id)} text={`${s.code} — ${s.name}`} />
        ))}
      </Select>
      <Select
        id="tracks-block"
        labelText="Start block"
        value={view.blockId === null ? '' : String(view.blockId)}
        onChange={(e) =>
          onChange({ blockId: e.target.value === '' ? null : Number(e.target.value), page: 1 })
        }
      >
        <SelectItem value="" text="All blocks" />
        {blocks.map((b) => (
          <SelectItem key={b.id} value={String(b.id)} text={`${b.code} — ${b.name}`} />
        ))}
      </Select>
      <Select
        id="tracks-type"
        labelText="Cell type"
        value={view.type ?? ''}
        onChange={(e) => onChange({ type: (e.target.value || null) as CellType | null, page: 1 })}
      >
        <SelectItem value="" text="All types" />
        {(Object.keys(CELL_TYPE_TEXT) as CellType[]).map((t) => (
          <SelectItem key={t} value={t} text={CELL_TYPE_TEXT[t]} />
        ))}
      </Select>
      <MinDuration
        value={view.minDurationMin}
        onChange={(minDurationMin) => onChange({ minDurationMin, page: 1 })}
      />
      <TextInput
        id="tracks-from"
        type="date"
        labelText={`First day (${zone})`}
        value={view.fromDay ?? ''}
        onChange={(e) => onChange({ fromDay: e.target.value || null, page: 1 })}
      />
      <TextInput
        id="tracks-to"
        type="date"
        labelText={`Last day (${zone})`}
        value={view.toDay ?? ''}
        onChange={(e) => onChange({ toDay: e.target.value || null, page: 1 })}
      />
      <Checkbox
        id="tracks-onset-only"
        labelText="Onsets only"
        checked={view.onsetOnly}
        onChange={(_event, { checked }) => onChange({ onsetOnly: checked, page: 1 })}
      />
    </div>
  );
}
