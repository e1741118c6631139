import {
  Button,
  InlineLoading,
  InlineNotification,
  RadioButton,
  RadioButtonGroup,
  Select,
  SelectItem,
  TextInput,
} from '@carbon/react';
import {
  ANOMALY_PRODUCTS,
  ANOMALY_VARIABLES,
  type AnomalyProduct,
  type AnomalyVariable,
  FIELD_KINDS,
  type FieldKind,
  INTAKE_KINDS,
  type IntakeKind,
  type SiteView,
} from '@stormhour/shared';
import { useId, useState } from 'react';
import { LoadError } from '../../../../components/LoadError';
import { ApiError, messageOf } from '../../../../lib/apiError';
import { useStartIntake } from '../../jobs/api';
import { JobFollower } from '../../jobs/components/JobFollower';
import { useSites } from '../../sites/api';
import { offsetForMapping } from '../../siteTime';
import {
  type AnomalyMappingDraft,
  anomalyDraftFromPreview,
  anomalyMappingProblems,
  toAnomalyMapping,
} from '../anomalyCsvMapping';
import { draftFromHeaders, type MappingDraft, mappingProblems, toMapping } from '../cellTableMapping';
import type { CsvPreview } from '../csvPreview';
import {
  ANOMALY_UNIT_LABELS,
  ANOMALY_VARIABLE_LABELS,
  type AnomalyUnit,
  buildIntakeForm,
  FIELD_KIND_LABELS,
  fitsKind,
  type IntakeDraft,
  isGeoTiffKind,
  KIND_LABELS,
  type OnError,
  PRODUCT_LABELS,
  unitsFor,
  uploadBlockers,
} from '../intakeRequest';
import { AnomalyMappingStep } from './AnomalyMappingStep';
import { ColumnMappingStep } from './ColumnMappingStep';
import { FilePicker } from './FilePicker';
import { UploadProgress } from './UploadProgress';
import { useCsvMapping } from './useCsvMapping';

const proposeCellMapping = (preview: CsvPreview): MappingDraft => draftFromHeaders(preview.headers, 'UTC');

function SiteAndKind(props: {
  sites: SiteView[];
  siteId: number | null;
  kind: IntakeKind;
  disabled: boolean;
  onSite: (id: number | null) => void;
  onKind: (kind: IntakeKind) => void;
}) {
  return (
    <div className="upload-form__row">
      <Select
        id="upload-site"
        labelText="Radar site"
        value={props.siteId === null ? '' : String(props.siteId)}
        disabled={props.disabled}
        onChange={(e) => props.onSite(e.target.value === '' ? null : Number(e.target.value))}
      >
        <SelectItem value="" text="Choose a site" />
        {props.sites.map((s) => (
          <SelectItem key={s.id} value={String(s.id)} text={`${s.code} — ${s.name}`} />
        ))}
      </Select>
      <Select
        id="upload-kind"
        labelText="Kind of files"
        value={props.kind}
        disabled={props.disabled}
        onChange={(e) => props.onKind(e.target.value as IntakeKind)}
      >
        {INTAKE_KINDS.map((k) => (
          <SelectItem key={k} value={k} text={KIND_LABELS[k]} />
        ))}
      </Select>
    </div>
  );
}

/** For anomaly grids whose metadata does not say: which field the files hold and in what units. */
function AnomalyFields(props: {
  variable: AnomalyVariable | null;
  units: AnomalyUnit | null;
  disabled: boolean;
  onVariable: (variable: AnomalyVariable | null) => void;
  onUnits: (units: AnomalyUnit | null) => void;
}) {
  return (
    <div className="upload-form__row">
      <Select
        id="upload-variable"
        labelText="Variable"
        helperText="Only needed when the file's metadata does not name it."
        value={props.variable ?? ''}
        disabled={props.disabled}
        onChange={(e) => props.onVariable((e.target.value || null) as AnomalyVariable | null)}
      >
        <SelectItem value="" text="From the file's metadata" />
        {ANOMALY_VARIABLES.map((v) => (
          <SelectItem key={v} value={v} text={ANOMALY_VARIABLE_LABELS[v]} />
        ))}
      </Select>
      <Select
        id="upload-units"
        labelText="Units in the file"
        helperText="Converted to g/kg and m/s on intake."
        value={props.units ?? ''}
        disabled={props.disabled}
        onChange={(e) => props.onUnits((e.target.value || null) as AnomalyUnit | null)}
      >
        <SelectItem value="" text="From the file's metadata" />
        {unitsFor(props.variable).map((u) => (
          <SelectItem key={u} value={u} text={ANOMALY_UNIT_LABELS[u]} />
        ))}
      </Select>
    </div>
  );
}

/** For anomaly grids: analysis or forecast, and whether the values are anomalies, totals or a climatology. */
function AnomalyProductFields(props: {
  product: AnomalyProduct;
  fieldKind: FieldKind;
  disabled: boolean;
  onProduct: (product: AnomalyProduct) => void;
  onFieldKind: (fieldKind: FieldKind) => void;
}) {
  return (
    <div className="upload-form__row">
      <Select
        id="upload-product"
        labelText="Product"
        helperText="Forecasts are kept apart: they never replace or mix with analyses of the same day."
        value={props.product}
        disabled={props.disabled}
        onChange={(e) => props.onProduct(e.target.value as AnomalyProduct)}
      >
        {ANOMALY_PRODUCTS.map((p) => (
          <SelectItem key={p} value={p} text={PRODUCT_LABELS[p]} />
        ))}
      </Select>
      <Select
        id="upload-field-kind"
        labelText="The values are"
        helperText="For totals, upload the climatology of the same variable, level and grid first."
        value={props.fieldKind}
        disabled={props.disabled}
        onChange={(e) => props.onFieldKind(e.target.value as FieldKind)}
      >
        {FIELD_KINDS.map((k) => (
          <SelectItem key={k} value={k} text={FIELD_KIND_LABELS[k]} />
        ))}
      </Select>
    </div>
  );
}

/** Site, kind, files and options; for cell tables the column mapping; then upload and follow the job. */
export function UploadForm() {
  const sites = useSites();
  const blockersId = useId();
  const [chosenSite, setChosenSite] = useState<number | null>(null);
  const [kind, setKind] = useState<IntakeKind>('volume');
  const [files, setFiles] = useState<File[]>([]);
  const [onError, setOnError] = useState<OnError>('skip');
  const [timePattern, setTimePattern] = useState('');
  const [variable, setVariable] = useState<AnomalyVariable | null>(null);
  const [units, setUnits] = useState<AnomalyUnit | null>(null);
  const [product, setProduct] = useState<AnomalyProduct>('analysis');
  const [fieldKind, setFieldKind] = useState<FieldKind>('anomaly');
  const [fraction, setFraction] = useState(0);
  const upload = useStartIntake(setFraction);

  // With one site there is nothing to choose.
  const siteId = chosenSite ?? (sites.data?.length === 1 ? sites.data[0].id : null);
  const site = sites.data?.find((s) => s.id === siteId) ?? null;
  const csvFile = kind === 'cell-table' ? (files.find((f) => fitsKind(f.name, kind)) ?? null) : null;
  const mapping = useCsvMapping(csvFile, proposeCellMapping, mappingProblems);
  // Anomaly uploads may mix GeoTIFFs and CSVs: the mapping step is for the CSVs.
  const anomalyCsv =
    kind === 'anomaly-grid' ? (files.find((f) => f.name.toLowerCase().endsWith('.csv')) ?? null) : null;
  const anomalyMapping = useCsvMapping<AnomalyMappingDraft>(
    anomalyCsv,
    anomalyDraftFromPreview,
    (d, preview) => anomalyMappingProblems(d, preview, variable),
  );
  const activeProblems = anomalyCsv ? anomalyMapping.problems : mapping.problems;
  const draft: IntakeDraft = {
    siteId,
    kind,
    files,
    onError,
    timePattern,
    variable,
    units,
    product,
    fieldKind,
    mapping: anomalyCsv
      ? anomalyMapping.draft && anomalyMapping.problems.length === 0
        ? toAnomalyMapping(anomalyMapping.draft)
        : null
      : mapping.draft && mapping.problems.length === 0
        ? toMapping(mapping.draft)
        : null,
  };
  const blockers = uploadBlockers(draft, activeProblems);
  const busy = upload.isPending || upload.isSuccess;

  if (sites.isPending) return <InlineLoading description="Loading the radar sites" />;
  if (sites.isError) return <LoadError what="the radar sites" error={sites.error} onRetry={sites.refetch} />;

  function start() {
    setFraction(0);
    upload.mutate(buildIntakeForm(draft));
  }

  function startAgain() {
    upload.reset();
    setFiles([]);
    setFraction(0);
  }

  const details = upload.error instanceof ApiError ? upload.error.details : [];

  return (
    <div className="upload-form form-stack">
      <SiteAndKind
        sites={sites.data}
        siteId={siteId}
        kind={kind}
        disabled={busy}
        onSite={setChosenSite}
        onKind={setKind}
      />
      <FilePicker kind={kind} files={files} disabled={busy} onChange={setFiles} />
      <RadioButtonGroup
        legendText="When a file cannot be read"
        name="upload-on-error"
        valueSelected={onError}
        disabled={busy}
        onChange={(value) => setOnError(value as OnError)}
      >
        <RadioButton id="on-error-skip" labelText="Skip the file and go on" value="skip" />
        <RadioButton id="on-error-fail" labelText="Stop the job; store nothing" value="fail" />
      </RadioButtonGroup>
      {isGeoTiffKind(kind) ? (
        <TextInput
          id="upload-time-pattern"
          labelText="File-name time pattern (optional)"
          helperText="Only for files whose metadata lacks the scan time: write the name with YYYY MM DD hh mm ss where the time is, e.g. VSR_YYYYMMDD_hhmm.tif. Times are read as UTC."
          value={timePattern}
          disabled={busy}
          onChange={(e) => setTimePattern(e.target.value)}
        />
      ) : null}
      {kind === 'anomaly-grid' ? (
        <AnomalyFields
          variable={variable}
          units={units}
          disabled={busy}
          onVariable={(next) => {
            setVariable(next);
            // Units of another variable no longer apply.
            if (units && !unitsFor(next).includes(units)) setUnits(null);
          }}
          onUnits={setUnits}
        />
      ) : null}
      {kind === 'anomaly-grid' ? (
        <AnomalyProductFields
          product={product}
          fieldKind={fieldKind}
          disabled={busy}
          onProduct={setProduct}
          onFieldKind={setFieldKind}
        />
      ) : null}
      {kind === 'anomaly-grid' ? (
        <TextInput
          id="upload-date-pattern"
          labelText="File-name date pattern (optional)"
          helperText="Only for grids whose bands carry no dates: write the name with YYYY MM DD where the first band's date is, e.g. q850_YYYYMMDD.tif; each further band is the next day."
          value={timePattern}
          disabled={busy}
          onChange={(e) => setTimePattern(e.target.value)}
        />
      ) : null}
      {csvFile && mapping.preview && mapping.draft ? (
        <ColumnMappingStep
          fileName={csvFile.name}
          preview={mapping.preview}
          draft={mapping.draft}
          siteOffset={site ? offsetForMapping(site.utcOffsetMinutes) : null}
          onChange={mapping.setDraft}
        />
      ) : null}
      {anomalyCsv && anomalyMapping.preview && anomalyMapping.draft ? (
        <AnomalyMappingStep
          fileName={anomalyCsv.name}
          preview={anomalyMapping.preview}
          draft={anomalyMapping.draft}
          fileVariable={variable}
          onChange={anomalyMapping.setDraft}
        />
      ) : null}

      {blockers.length > 0 && !busy ? (
        <div id={blockersId} className="upload-blockers">
          <p>Before uploading:</p>
          <ul aria-label="Before uploading">
            {blockers.map((b) => (
              <li key={b}>{b}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {upload.isError ? (
        <>
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="The upload was refused; nothing was stored."
            subtitle={messageOf(upload.error)}
          />
          {details.length > 0 ? (
            <ul className="field-problems" aria-label="What the server refused">
              {details.map((d) => (
                <li key={`${d.where}-${d.problem}`}>
                  <span className="mono">{d.where}</span>: {d.problem}
                </li>
              ))}
            </ul>
          ) : null}
        </>
      ) : null}

      {upload.isSuccess ? (
        <Button kind="tertiary" onClick={startAgain}>
          Start another upload
        </Button>
      ) : (
        <Button
          onClick={start}
          disabled={blockers.length > 0 || upload.isPending}
          aria-describedby={blockers.length > 0 ? blockersId : undefined}
        >
          Upload
        </Button>
      )}
      {upload.isPending || upload.isSuccess ? (
        <UploadProgress
          files={files}
          fraction={upload.isSuccess ? 1 : fraction}
          accepted={upload.isSuccess}
        />
      ) : null}
      {upload.isSuccess ? <JobFollower jobId={upload.data.id} /> : null}
    </div>
  );
}
