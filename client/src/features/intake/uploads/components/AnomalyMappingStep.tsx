import { Select, SelectItem, TextInput } from '@carbon/react';
import {
  ANOMALY_CSV_DATE_FORMATS,
  ANOMALY_CSV_FIELDS,
  ANOMALY_VARIABLES,
  type AnomalyCsvDateFormat,
  type AnomalyCsvField,
  type AnomalyVariable,
} from '@stormhour/shared';
import {
  ANOMALY_FIELD_LABELS,
  type AnomalyMappingDraft,
  DATE_FORMAT_EXAMPLES,
  unknownVariableNames,
} from '../anomalyCsvMapping';
import type { CsvPreview } from '../csvPreview';
import { ANOMALY_VARIABLE_LABELS } from '../intakeRequest';
import { CsvPreviewTable } from './CsvPreviewTable';

interface AnomalyMappingStepProps {
  fileName: string;
  preview: CsvPreview;
  draft: AnomalyMappingDraft;
  /** The variable chosen for the whole upload, which stands in for a missing variable column. */
  fileVariable: AnomalyVariable | null;
  onChange: (draft: AnomalyMappingDraft) => void;
}

const ALWAYS_REQUIRED: readonly AnomalyCsvField[] = ['date', 'lat', 'lon', 'value'];

/** Before a long-form anomaly CSV is sent: its columns, its names for q, u, v, and how it writes dates. */
export function AnomalyMappingStep({
  fileName,
  preview,
  draft,
  fileVariable,
  onChange,
}: AnomalyMappingStepProps) {
  const setColumn = (field: AnomalyCsvField, header: string) =>
    onChange({ ...draft, columns: { ...draft.columns, [field]: header || undefined } });
  const variableColumn = draft.columns.variable;
  const namesInFile = variableColumn
    ? [...new Set(preview.rows.map((r) => (r[variableColumn] ?? '').trim()).filter(Boolean))]
    : [];
  const unknown = unknownVariableNames(draft, preview);
  return (
    <fieldset className="mapping-step">
      <legend className="section-title">Columns of the anomaly CSV</legend>
      <CsvPreviewTable title="Preview of the anomaly CSV" fileName={fileName} preview={preview} />
      <p className="cds--label-description">
        One row per day, grid point, variable and level. For each of our fields, pick the file’s column that
        holds it; columns matching our name or a common spelling are already picked. The same mapping applies
        to every CSV file of this upload.
      </p>
      <div className="mapping-grid">
        {ANOMALY_CSV_FIELDS.map((field) => (
          <Select
            key={field}
            id={`anomaly-mapping-${field}`}
            labelText={`${ANOMALY_FIELD_LABELS[field]} (${field})${ALWAYS_REQUIRED.includes(field) ? ', required' : ''}`}
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
        <Select
          id="anomaly-mapping-date-format"
          labelText="Dates are written"
          value={draft.dateFormat}
          onChange={(e) => onChange({ ...draft, dateFormat: e.target.value as AnomalyCsvDateFormat })}
        >
          {ANOMALY_CSV_DATE_FORMATS.map((f) => (
            <SelectItem key={f} value={f} text={`${f} (e.g. ${DATE_FORMAT_EXAMPLES[f]})`} />
          ))}
        </Select>
        {draft.columns.level_hpa ? null : (
          <TextInput
            id="anomaly-mapping-level"
            labelText="Pressure level of the whole file (hPa)"
            helperText="The file has no level column: every row is at this level, e.g. 850."
            inputMode="decimal"
            value={draft.levelHpa}
            onChange={(e) => onChange({ ...draft, levelHpa: e.target.value })}
          />
        )}
        {variableColumn ? null : (
          <p className="cds--label-description">
            {fileVariable
              ? `Every row is read as ${ANOMALY_VARIABLE_LABELS[fileVariable].toLowerCase()} (${fileVariable}), the variable chosen above.`
              : 'The file has no variable column: pick the variable of the whole file above.'}
          </p>
        )}
      </div>
      {variableColumn ? (
        <fieldset className="mapping-grid">
          <legend className="cds--label">
            The file’s names for our variables
            {namesInFile.length > 0 ? ` (seen in the first rows: ${namesInFile.join(', ')})` : ''}
          </legend>
          {ANOMALY_VARIABLES.map((v) => (
            <TextInput
              key={v}
              id={`anomaly-mapping-name-${v}`}
              labelText={`Name of ${v} (${ANOMALY_VARIABLE_LABELS[v].toLowerCase()})`}
              helperText={`Leave empty if the file writes ${v}.`}
              value={draft.variableNames[v]}
              invalid={unknown.length > 0 && draft.variableNames[v].trim() === ''}
              invalidText={`Unknown names in the file: ${unknown.join(', ')}`}
              onChange={(e) =>
                onChange({ ...draft, variableNames: { ...draft.variableNames, [v]: e.target.value } })
              }
            />
          ))}
        </fieldset>
      ) : null}
    </fieldset>
  );
}
