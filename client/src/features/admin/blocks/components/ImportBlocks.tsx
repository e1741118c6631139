import { BLOCK_FEATURE_PROPERTIES } from '@stormhour/shared';
import { FileImportPanel } from '../../../../components/FileImportPanel';
import { useImportBlocks } from '../api';
import { BOUNDARY_FILE_ACCEPT, importSummary, isBoundaryFile } from '../blockList';

/** Upload one GeoJSON file of block boundaries; shows progress, the outcome, or every refused feature. */
export function ImportBlocks() {
  return (
    <FileImportPanel
      description={
        <>
          One GeoJSON FeatureCollection of Polygon or MultiPolygon features in longitude/latitude. Each
          feature needs the properties {BLOCK_FEATURE_PROPERTIES.join(', ')}. Blocks with a known code are
          updated; new districts are created. Drop the file on the box or press it to choose one.
        </>
      }
      labelText="Import blocks"
      accept={BOUNDARY_FILE_ACCEPT}
      wrongKind={(name) =>
        isBoundaryFile(name)
          ? null
          : { title: 'Choose a GeoJSON file.', detail: `${name} is not a .geojson or .json file.` }
      }
      checking="Checking the features…"
      useImport={useImportBlocks}
      summary={importSummary}
    />
  );
}
