import { NumberInput, Select, SelectItem, TextInput } from '@carbon/react';
import { type DistrictView, SCORECARD_SOURCE_LABELS, SCORECARD_SOURCES } from '@stormhour/shared';

export interface ScorecardChoice {
  districtId: string;
  from: string;
  to: string;
  source: string;
  resamples: string;
}

/** District, season, source of outcomes and resamples; problems shown under the field they concern. */
export function ScorecardControls({
  districts,
  choice,
  problems,
  onChange,
}: {
  districts: DistrictView[];
  choice: ScorecardChoice;
  problems: Record<string, string>;
  onChange: (patch: Partial<ScorecardChoice>) => void;
}) {
  return (
    <div className="track-filters scorecard-controls">
      <Select
        id="scorecard-district"
        labelText="District"
        value={choice.districtId}
        invalid={Boolean(problems.districtId)}
        invalidText={problems.districtId}
        onChange={(e) => onChange({ districtId: e.target.value, from: '', to: '' })}
      >
        {districts.map((d) => (
          <SelectItem key={d.id} value={String(d.id)} text={d.name} />
        ))}
      </Select>
      <TextInput
        id="scorecard-from"
        type="date"
        labelText="First day (local)"
        value={choice.from}
        invalid={Boolean(problems.from)}
        invalidText={problems.from}
        onChange={(e) => onChange({ from: e.target.value })}
      />
      <TextInput
        id="scorecard-to"
        type="date"
        labelText="Last day (local)"
        value={choice.to}
        invalid={Boolean(problems.to)}
        invalidText={problems.to}
        onChange={(e) => onChange({ to: e.target.value })}
      />
      <Select
        id="scorecard-source"
        labelText="What happened, from"
        value={choice.source}
        invalid={Boolean(problems.source)}
        invalidText={problems.source}
        onChange={(e) => onChange({ source: e.target.value })}
      >
        {SCORECARD_SOURCES.map((s) => (
          <SelectItem key={s} value={s} text={SCORECARD_SOURCE_LABELS[s]} />
        ))}
      </Select>
      <NumberInput
        id="scorecard-resamples"
        label="Resamples for the intervals"
        helperText="Whole days drawn again; 0 for no intervals"
        min={0}
        max={10_000}
        step={100}
        value={Number(choice.resamples)}
        invalid={Boolean(problems.resamples)}
        invalidText={problems.resamples}
        onChange={(_e, { value }) => onChange({ resamples: String(value) })}
      />
    </div>
  );
}
