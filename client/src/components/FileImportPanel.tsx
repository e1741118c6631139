import { FileUploaderDropContainer, InlineNotification } from '@carbon/react';
import type { UseMutationResult } from '@tanstack/react-query';
import { type ReactNode, useState } from 'react';
import { ApiError, messageOf } from '../lib/apiError';
import { FileSendProgress } from './FileSendProgress';
import { ProblemTable } from './ProblemTable';

/**
 * One file dropped or chosen, sent with a progress bar, then the outcome: what was imported, or
 * "nothing was imported" with every refused row or feature the server named. A file of the wrong kind
 * is refused here before anything is sent.
 */
export function FileImportPanel<T>({
  description,
  labelText,
  accept,
  wrongKind,
  checking,
  useImport,
  summary,
}: {
  description: ReactNode;
  labelText: string;
  accept: string[];
  /** Why a file cannot be this kind (its name is checked), or null when it may be. */
  wrongKind: (fileName: string) => { title: string; detail: string } | null;
  /** What the bar says once the bytes are sent and the server is reading them. */
  checking: string;
  useImport: (onProgress: (fraction: number) => void) => UseMutationResult<T, Error, File>;
  summary: (result: T) => string;
}) {
  const [progress, setProgress] = useState(0);
  const [fileName, setFileName] = useState<string | null>(null);
  const [refused, setRefused] = useState<{ title: string; detail: string } | null>(null);
  const mutation = useImport(setProgress);

  function start(file: File | undefined) {
    if (!file) return;
    const wrong = wrongKind(file.name);
    setRefused(wrong);
    if (wrong) return;
    setFileName(file.name);
    setProgress(0);
    mutation.mutate(file);
  }

  const error = mutation.error;
  const problems = error instanceof ApiError ? error.details : [];
  return (
    <div className="import-panel form-stack">
      <p className="cds--label-description">{description}</p>
      <FileUploaderDropContainer
        labelText={labelText}
        accept={accept}
        disabled={mutation.isPending}
        onAddFiles={(_event, { addedFiles }) => start(addedFiles[0])}
      />
      {mutation.isPending ? (
        <FileSendProgress fileName={fileName} progress={progress} checking={checking} />
      ) : null}
      {refused ? (
        <InlineNotification kind="error" lowContrast title={refused.title} subtitle={refused.detail} />
      ) : null}
      {mutation.isSuccess ? (
        <InlineNotification
          kind="success"
          lowContrast
          title={summary(mutation.data)}
          subtitle={fileName ?? ''}
        />
      ) : null}
      {mutation.isError ? (
        <>
          <InlineNotification
            kind="error"
            lowContrast
            hideCloseButton
            title="Nothing was imported."
            subtitle={messageOf(error)}
          />
          {problems.length > 0 ? <ProblemTable problems={problems} /> : null}
        </>
      ) : null}
    </div>
  );
}
