import { FileUploaderDropContainer, InlineNotification } from '@carbon/react';
import { BLOCK_FEATURE_PROPERTIES } from '@stormhour/shared';
import { useState } from 'react';
import { FileSendProgress } from '../../../../components/FileSendProgress';
import { ProblemTable } from '../../../../components/ProblemTable';
import { ApiError, messageOf } from '../../../../lib/apiError';
import { useImportBlocks } from '../api';
import { BOUNDARY_FILE_ACCEPT, importSummary, isBoundaryFile } from '../blockList';

/** Upload one GeoJSON file of block boundaries; shows progress, the outcome, or every refused feature. */
export function ImportBlocks() {
  const [progress, setProgress] = useState(0);
  const [fileName, setFileName] = useState<string | null>(null);
  const [wrongType, setWrongType] = useState<string | null>(null);
  const mutation = useImportBlocks(setProgress);

  function start(file: File | undefined) {
    if (!file) return;
    setWrongType(null);
    if (!isBoundaryFile(file.name)) {
      setWrongType(`${file.name} is not a .geojson or .json file.`);
      return;
    }
    setFileName(file.name);
    setProgress(0);
    mutation.mutate(file);
  }

  const error = mutation.error;
  const problems = error instanceof ApiError ? error.details : [];

  return (
    <div className="import-panel form-stack">
      <p className="cds--label-description">
        One GeoJSON FeatureCollection of Polygon or MultiPolygon features in longitude/latitude. Each feature
        needs the properties {BLOCK_FEATURE_PROPERTIES.join(', ')}. Blocks with a known code are updated; new
        districts are created. Drop the file on the box or press it to choose one.
      </p>
      <FileUploaderDropContainer
        labelText="Import blocks"
        accept={BOUNDARY_FILE_ACCEPT}
        disabled={mutation.isPending}
        onAddFiles={(_event, { addedFiles }) => start(addedFiles[0])}
      />
      {mutation.isPending ? (
        <FileSendProgress fileName={fileName} progress={progress} checking="Checking the features…" />
      ) : null}
      {wrongType ? (
        <InlineNotification kind="error" lowContrast title="Choose a GeoJSON file." subtitle={wrongType} />
      ) : null}
      {mutation.isSuccess ? (
        <InlineNotification
          kind="success"
          lowContrast
          title={importSummary(mutation.data)}
          subtitle={fileName ?? ''}
        />
      ) : null}
      {mutation.isError ? (
        <>
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="Nothing was imported."
            subtitle={messageOf(error)}
          />
          {problems.length > 0 ? <ProblemTable problems={problems} /> : null}
        </>
      ) : null}
    </div>
  );
}
