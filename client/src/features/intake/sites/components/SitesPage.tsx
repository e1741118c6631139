import { Button, InlineLoading } from '@carbon/react';
import { Link as RouterLink } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { RegionBoundary } from '../../../../components/RegionBoundary';
import { paths } from '../../../../config/paths';
import { useSites } from '../api';
import { CoverageMap } from './CoverageMap';
import { SitesTable } from './SitesTable';

export default function SitesPage() {
  const sites = useSites();
  return (
    <>
      <section aria-labelledby="sites-title">
        <div className="section-bar">
          <h2 id="sites-title" className="section-title">
            Radar sites
          </h2>
          <Button as={RouterLink} to={paths.intake.newSite} size="md">
            Add site
          </Button>
        </div>
        {sites.isPending ? <InlineLoading description="Loading the sites" /> : null}
        {sites.isError ? <LoadError what="the sites" error={sites.error} onRetry={sites.refetch} /> : null}
        {sites.isSuccess ? <SitesTable sites={sites.data} /> : null}
      </section>
      <section aria-labelledby="coverage-title">
        <h2 id="coverage-title" className="section-title">
          Coverage
        </h2>
        <RegionBoundary region="the coverage map">
          {sites.isSuccess ? <CoverageMap sites={sites.data} /> : null}
        </RegionBoundary>
      </section>
    </>
  );
}
