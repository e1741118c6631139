import { Select, SelectItem, Slider, TextInput, Toggle } from '@carbon/react';
import { type EvaluableRule, formatDay, MOISTURE_CLASSES, mondayOf, parseDay } from '@stormhour/shared';
import { useState } from 'react';
import { useBlocks } from '../../../api/blocks';
import { useDistricts } from '../../../api/districts';
import { useCropCalendar } from '../api';
import { buildExampleContext, type ExampleSettings, exampleCrops } from '../exampleContext';
import { RulePreview } from './RulePreview';

const FLOWS = ['onshore', 'along-shore', 'offshore', 'along-valley', 'weak'];
const REGIMES = MOISTURE_CLASSES.flatMap((m) => FLOWS.map((f) => `${m} / ${f}`));
const HOURS = [9, 12, 15, 18, 21];

const pct = (p: number) => Math.round(p * 100);

/**
 * The rule editor's live preview against an example week the user adjusts: a district's blocks with a
 * slider each for the afternoon chance, the usual chance, the peak hour, the regime and a rain forecast.
 * The real outlook is not needed here; a bulletin shows RulePreview against its own outlook instead.
 */
export function ExamplePreview({ rule }: { rule: EvaluableRule }) {
  const districts = useDistricts();
  const [chosen, setChosen] = useState<number | null>(null);
  const district = districts.data?.find((d) => d.id === chosen) ?? districts.data?.[0] ?? null;
  const blocks = useBlocks({ districtId: district?.id });
  const calendar = useCropCalendar(district?.id ?? null);
  const [settings, setSettings] = useState<ExampleSettings>(() => ({
    weekStart: mondayOf(formatDay(new Date())),
    regime: 'moist / onshore',
    chances: {},
    defaultChance: 0.3,
    climatology: 0.25,
    peakHourLocal: 15,
    rainLikely24h: false,
  }));
  const set = (patch: Partial<ExampleSettings>) => setSettings((s) => ({ ...s, ...patch }));

  if (!district)
    return <p className="cds--label-description">Add a district with blocks to preview advice.</p>;
  const districtBlocks = blocks.data ?? [];
  const crops = exampleCrops(calendar.data?.entries ?? [], settings.weekStart, rule);
  const context = buildExampleContext(district, districtBlocks, crops, settings);

  return (
    <div className="example-preview">
      <h3 className="cds--label example-preview__title">Live preview against an example week</h3>
      <RulePreview rule={rule} context={context} />
      <fieldset className="example-preview__controls">
        <legend className="cds--label">Example week (not the real outlook)</legend>
        <Select
          id="example-district"
          labelText="District"
          value={district.id}
          onChange={(event) => setChosen(Number(event.target.value))}
        >
          {(districts.data ?? []).map((d) => (
            <SelectItem key={d.id} value={d.id} text={d.name} />
          ))}
        </Select>
        <TextInput
          id="example-week"
          type="date"
          labelText="Week starting"
          value={settings.weekStart}
          onChange={(event) => {
            if (parseDay(event.target.value)) set({ weekStart: event.target.value });
          }}
        />
        <p className="cds--label-description">
          Crops this week:{' '}
          {crops.length === 0
            ? 'none in the calendar'
            : crops
                .map((c) => `${c.crop} (${c.stage}${c.addedForPreview ? ', added for the preview' : ''})`)
                .join(', ')}
        </p>
        <Select
          id="example-regime"
          labelText="Expected regime"
          value={settings.regime ?? ''}
          onChange={(event) => set({ regime: event.target.value || null })}
        >
          <SelectItem value="" text="unknown" />
          {REGIMES.map((r) => (
            <SelectItem key={r} value={r} text={r} />
          ))}
        </Select>
        <Select
          id="example-peak"
          labelText="Peak hour in every block"
          value={settings.peakHourLocal ?? ''}
          onChange={(event) =>
            set({ peakHourLocal: event.target.value === '' ? null : Number(event.target.value) })
          }
        >
          <SelectItem value="" text="unknown" />
          {HOURS.map((h) => (
            <SelectItem
              key={h}
              value={h}
              text={`${String(h).padStart(2, '0')}:00–${String(h + 3).padStart(2, '0')}:00`}
            />
          ))}
        </Select>
        <Toggle
          id="example-rain"
          labelText="Rain likely within 24 hours"
          labelA="No"
          labelB="Yes"
          toggled={settings.rainLikely24h}
          onToggle={(on) => set({ rainLikely24h: on })}
        />
        <Slider
          id="example-usual"
          labelText="Usual afternoon chance, all days (%)"
          min={0}
          max={100}
          step={1}
          value={pct(settings.climatology)}
          onChange={({ value }) => set({ climatology: value / 100 })}
        />
        {districtBlocks.map((b) => (
          <Slider
            key={b.code}
            id={`example-chance-${b.code}`}
            labelText={`Afternoon chance in ${b.name} (%)`}
            min={0}
            max={100}
            step={1}
            value={pct(settings.chances[b.code] ?? settings.defaultChance)}
            onChange={({ value }) => set({ chances: { ...settings.chances, [b.code]: value / 100 } })}
          />
        ))}
      </fieldset>
    </div>
  );
}
