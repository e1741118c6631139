import { InlineLoading } from '@carbon/react';
import { useParams } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { RegionBoundary } from '../../../../components/RegionBoundary';
import { useSite } from '../api';
import { SiteForm } from './SiteForm';

function EditSite({ id }: { id: number }) {
  const site = useSite(id);
  if (site.isPending) return <InlineLoading description="Loading the site" />;
  if (site.isError) return <LoadError what="the site" error={site.error} onRetry={site.refetch} />;
  return (
    <>
      <h2 className="section-title">
        Edit {site.data.name} ({site.data.code})
      </h2>
      <SiteForm site={site.data} />
    </>
  );
}

/** /intake/sites/new adds a site; /intake/sites/:siteId edits one. */
export default function SiteFormPage() {
  const { siteId } = useParams();
  return (
    <RegionBoundary region="the site form">
      {siteId ? (
        <EditSite id={Number(siteId)} />
      ) : (
        <>
          <h2 className="section-title">Add a radar site</h2>
          <SiteForm />
        </>
      )}
    </RegionBoundary>
  );
}
