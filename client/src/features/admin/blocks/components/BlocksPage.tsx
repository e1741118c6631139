import { PageSection } from '../../../../components/PageSection';
import { BlocksMapPanel } from './BlocksMapPanel';
import { BlocksTable } from './BlocksTable';
import { DistrictsTable } from './DistrictsTable';
import { ImportBlocks } from './ImportBlocks';

export default function BlocksPage() {
  return (
    <>
      <PageSection title="Import block boundaries" region="the import">
        <ImportBlocks />
      </PageSection>
      <PageSection title="Districts" region="the districts">
        <DistrictsTable />
      </PageSection>
      <PageSection title="Blocks" region="the blocks table">
        <BlocksTable />
      </PageSection>
      <PageSection title="Map" region="the map">
        <BlocksMapPanel />
      </PageSection>
    </>
  );
}
