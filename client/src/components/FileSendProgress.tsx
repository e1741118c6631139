import { ProgressBar } from '@carbon/react';

/** One file on its way to the server: the share sent, then what the server is doing with it. */
export function FileSendProgress({
  fileName,
  progress,
  checking,
}: {
  fileName: string | null;
  /** Share of the bytes sent, 0–1. */
  progress: number;
  /** Shown once every byte is sent, e.g. "Checking the rows…". */
  checking: string;
}) {
  return (
    <ProgressBar
      label={`Uploading ${fileName ?? 'the file'}`}
      helperText={progress < 1 ? `${Math.round(progress * 100)} % sent` : checking}
      value={progress < 1 ? progress * 100 : undefined}
      max={100}
    />
  );
}
