import { useEffect, useState } from 'react';
import { type CsvPreview, readCsvPreview } from '../csvPreview';

export interface CsvMapping<D> {
  preview: CsvPreview | null;
  draft: D | null;
  setDraft: (draft: D) => void;
  /** What is missing before upload, as `check` says; "reading" while the preview loads. */
  problems: string[];
}

/**
 * Reads the first rows of a CSV file, proposes a mapping of its columns (`propose`) and checks it
 * (`check`). Both are called with the latest preview; `propose` must be a stable function.
 */
export function useCsvMapping<D>(
  file: File | null,
  propose: (preview: CsvPreview) => D,
  check: (draft: D, preview: CsvPreview) => string[],
): CsvMapping<D> {
  const [state, setState] = useState<{ file: File; preview: CsvPreview; draft: D } | null>(null);

  useEffect(() => {
    if (!file) return;
    let cancelled = false;
    readCsvPreview(file).then((preview) => {
      if (!cancelled) setState({ file, preview, draft: propose(preview) });
    });
    return () => {
      cancelled = true;
    };
  }, [file, propose]);

  const current = state && state.file === file ? state : null;
  const problems = !file
    ? []
    : !current
      ? ['Reading the first rows of the file…']
      : current.preview.headers.length === 0
        ? ['The file has no header row to map.']
        : check(current.draft, current.preview);
  return {
    preview: current?.preview ?? null,
    draft: current?.draft ?? null,
    setDraft: (draft) => setState((s) => (s ? { ...s, draft } : s)),
    problems,
  };
}
