import { RegionBoundary } from '../../../../components/RegionBoundary';
import { JobsTable } from '../../jobs/components/JobsTable';
import { UploadForm } from './UploadForm';

export default function UploadsPage() {
  return (
    <>
      <section aria-labelledby="upload-title">
        <h2 id="upload-title" className="section-title">
          Upload radar products
        </h2>
        <RegionBoundary region="the upload">
          <UploadForm />
        </RegionBoundary>
      </section>
      <section aria-labelledby="jobs-title">
        <h2 id="jobs-title" className="section-title">
          Jobs
        </h2>
        <RegionBoundary region="the jobs table">
          <JobsTable />
        </RegionBoundary>
      </section>
    </>
  );
}
