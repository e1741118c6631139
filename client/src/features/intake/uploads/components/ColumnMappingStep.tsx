import { RadioButton, RadioButtonGroup, Select, SelectItem, TextInput } from '@carbon/react';
import { CELL_TABLE_FIELDS, type CellTableField } from '@stormhour/shared';
import { CELL_FIELD_LABELS, type MappingDraft } from '../cellTableMapping';
import type { CsvPreview } from '../csvPreview';
import { CsvPreviewTable } from './CsvPreviewTable';

interface ColumnMappingStepProps {
  fileName: string;
  preview: CsvPreview;
  draft: MappingDraft;
  /** The site's local offset, offered as the likely time zone of the file's times. */
  siteOffset: string | null;
  onChange: (draft: MappingDraft) => void;
}

const REQUIRED: readonly CellTableField[] = ['scan_time', 'area'];

function shownFields(position: MappingDraft['position']): CellTableField[] {
  const hidden: CellTableField[] = position === 'latlon' ? ['x', 'y'] : ['lat', 'lon'];
  return CELL_TABLE_FIELDS.filter((f) => !hidden.includes(f));
}

function isRequired(field: CellTableField): boolean {
  return REQUIRED.includes(field) || ['lat', 'lon', 'x', 'y'].includes(field);
}

/** Before a cell table is sent: which of the file's columns holds each of our fields, and in what units. */
export function ColumnMappingStep({
  fileName,
  preview,
  draft,
  siteOffset,
  onChange,
}: ColumnMappingStepProps) {
  const setColumn = (field: CellTableField, header: string) =>
    onChange({ ...draft, columns: { ...draft.columns, [field]: header || undefined } });
  return (
    <fieldset className="mapping-step">
      <legend className="section-title">Columns of the cell table</legend>
      <CsvPreviewTable title="Preview of the cell table" fileName={fileName} preview={preview} />
      <p className="cds--label-description">
        For each of our fields, pick the file’s column that holds it. Columns matching our name or a common
        spelling are already picked. The same mapping applies to every file of this upload.
      </p>
      <RadioButtonGroup
        legendText="Positions are"
        name="mapping-position"
        valueSelected={draft.position}
        onChange={(value) => onChange({ ...draft, position: value as MappingDraft['position'] })}
      >
        <RadioButton id="position-latlon" labelText="Latitude and longitude (°)" value="latlon" />
        <RadioButton id="position-xy" labelText="Projected x and y (m)" value="xy" />
      </RadioButtonGroup>
      <div className="mapping-grid">
        {shownFields(draft.position).map((field) => (
          <Select
            key={field}
            id={`mapping-${field}`}
            labelText={`${CELL_FIELD_LABELS[field]} (${field})${isRequired(field) ? ', required' : ''}`}
            value={draft.columns[field] ?? ''}
            onChange={(e) => setColumn(field, e.target.value)}
          >
            <SelectItem value="" text="Not in the file" />
            {preview.headers.map((h) => (
              <SelectItem key={h} value={h} text={h} />
            ))}
          </Select>
        ))}
      </div>
      <div className="mapping-grid">
        <RadioButtonGroup
          legendText="Area unit"
          name="mapping-area-unit"
          valueSelected={draft.areaUnit}
          onChange={(value) => onChange({ ...draft, areaUnit: value as MappingDraft['areaUnit'] })}
        >
          <RadioButton id="area-km2" labelText="km²" value="km2" />
          <RadioButton id="area-m2" labelText="m²" value="m2" />
        </RadioButtonGroup>
        <TextInput
          id="mapping-time-zone"
          labelText="Time zone of the times"
          helperText={`UTC, or an offset such as ${siteOffset ?? '+06:00'}${siteOffset ? ' (the site’s local time)' : ''}. Used only for times that carry no zone.`}
          value={draft.timeZone}
          onChange={(e) => onChange({ ...draft, timeZone: e.target.value.trim() })}
        />
        {draft.position === 'xy' ? (
          <TextInput
            id="mapping-crs"
            labelText="Coordinate system of x and y"
            helperText="An EPSG code such as EPSG:32645, or a proj4 definition; coordinates in metres."
            value={draft.crs}
            onChange={(e) => onChange({ ...draft, crs: e.target.value })}
          />
        ) : null}
      </div>
    </fieldset>
  );
}
