import { CROP_CALENDAR_COLUMNS } from '@stormhour/shared';
import { FileImportPanel } from '../../../components/FileImportPanel';
import { useImportCropCalendars } from '../api';

/** Upload one CSV of crop calendars; shows progress, what it replaced, or every refused row. */
export function ImportCalendars() {
  return (
    <FileImportPanel
      description={
        <>
          A CSV with the columns {CROP_CALENDAR_COLUMNS.join(', ')}, one row per stage. Each district named in
          the file gets exactly the file’s stages; other districts keep theirs. A file with any bad row is
          refused whole.
        </>
      }
      labelText="Import crop calendars"
      accept={['.csv', 'text/csv']}
      wrongKind={(name) =>
        /\.(csv|txt)$/i.test(name)
          ? null
          : { title: 'Choose a CSV file.', detail: `${name} is not a .csv file.` }
      }
      checking="Checking the rows…"
      useImport={useImportCropCalendars}
      summary={(result) =>
        `Imported ${result.districts.map((d) => `${d.code} (${d.stages} stages)`).join(', ')}.`
      }
    />
  );
}
