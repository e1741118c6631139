import { ProgressBar } from '@carbon/react';
import { perFileProgress } from '../uploadProgress';

/** One bar per file while the request is on its way; the bytes fill the files in order. */
export function UploadProgress(props: { files: File[]; fraction: number; accepted: boolean }) {
  const { files, fraction, accepted } = props;
  const shares = perFileProgress(
    files.map((f) => f.size),
    fraction,
  );
  return (
    <section className="form-stack" aria-label="Upload progress">
      {files.map((file, i) => (
        <ProgressBar
          key={`${file.name}-${file.size}`}
          label={file.name}
          value={shares[i] * 100}
          max={100}
          status={shares[i] >= 1 ? 'finished' : 'active'}
          helperText={shares[i] >= 1 ? 'Sent' : `${Math.round(shares[i] * 100)} % sent`}
        />
      ))}
      {fraction >= 1 && !accepted ? <p>All files sent; waiting for the server to take the job…</p> : null}
    </section>
  );
}
