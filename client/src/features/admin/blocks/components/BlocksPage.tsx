import { RegionBoundary } from '../../../../components/RegionBoundary';
import { BlocksMapPanel } from './BlocksMapPanel';
import { BlocksTable } from './BlocksTable';
import { DistrictsTable } from './DistrictsTable';
import { ImportBlocks } from './ImportBlocks';

export default function BlocksPage() {
  return (
    <>
      <section aria-labelledby="import-title">
        <h2 id="import-title" className="section-title">
          Import block boundaries
        </h2>
        <RegionBoundary region="the import">
          <ImportBlocks />
        </RegionBoundary>
      </section>
      <section aria-labelledby="districts-title">
        <h2 id="districts-title" className="section-title">
          Districts
        </h2>
        <RegionBoundary region="the districts">
          <DistrictsTable />
        </RegionBoundary>
      </section>
      <section aria-labelledby="blocks-title">
        <h2 id="blocks-title" className="section-title">
          Blocks
        </h2>
        <RegionBoundary region="the blocks table">
          <BlocksTable />
        </RegionBoundary>
      </section>
      <section aria-labelledby="map-title">
        <h2 id="map-title" className="section-title">
          Map
        </h2>
        <RegionBoundary region="the map">
          <BlocksMapPanel />
        </RegionBoundary>
      </section>
    </>
  );
}
