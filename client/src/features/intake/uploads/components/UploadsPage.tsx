import { PageSection } from '../../../../components/PageSection';
import { JobsTable } from '../../jobs/components/JobsTable';
import { UploadForm } from './UploadForm';

export default function UploadsPage() {
  return (
    <>
      <PageSection title="Upload radar products and anomaly grids" region="the upload">
        <UploadForm />
      </PageSection>
      <PageSection title="Jobs" region="the jobs table">
        <JobsTable />
      </PageSection>
    </>
  );
}
