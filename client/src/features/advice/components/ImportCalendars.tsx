import { FileUploaderDropContainer, InlineNotification } from '@carbon/react';
import { CROP_CALENDAR_COLUMNS } from '@stormhour/shared';
import { useState } from 'react';
import { FileSendProgress } from '../../../components/FileSendProgress';
import { ProblemTable } from '../../../components/ProblemTable';
import { ApiError, messageOf } from '../../../lib/apiError';
import { useImportCropCalendars } from '../api';

/** Upload one CSV of crop calendars; shows progress, what it replaced, or every refused row. */
export function ImportCalendars() {
  const [progress, setProgress] = useState(0);
  const [fileName, setFileName] = useState<string | null>(null);
  const [wrongType, setWrongType] = useState<string | null>(null);
  const mutation = useImportCropCalendars(setProgress);

  function start(file: File | undefined) {
    if (!file) return;
    setWrongType(null);
    if (!/\.(csv|txt)$/i.test(file.name)) {
      setWrongType(`${file.name} is not a .csv file.`);
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
        A CSV with the columns {CROP_CALENDAR_COLUMNS.join(', ')}, one row per stage. Each district named in
        the file gets exactly the file’s stages; other districts keep theirs. A file with any bad row is
        refused whole.
      </p>
      <FileUploaderDropContainer
        labelText="Import crop calendars"
        accept={['.csv', 'text/csv']}
        disabled={mutation.isPending}
        onAddFiles={(_event, { addedFiles }) => start(addedFiles[0])}
      />
      {mutation.isPending ? (
        <FileSendProgress fileName={fileName} progress={progress} checking="Checking the rows…" />
      ) : null}
      {wrongType ? (
        <InlineNotification kind="error" lowContrast title="Choose a CSV file." subtitle={wrongType} />
      ) : null}
      {mutation.isSuccess ? (
        <InlineNotification
          kind="success"
          lowContrast
          title={`Imported ${mutation.data.districts.map((d) => `${d.code} (${d.stages} stages)`).join(', ')}.`}
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
