import { useEffect, useState } from 'react';
import { draftFromHeaders, type MappingDraft, mappingProblems } from '../cellTableMapping';
import { type CsvPreview, readCsvPreview } from '../csvPreview';

interface CsvMapping {
  preview: CsvPreview | null;
  draft: MappingDraft | null;
  setDraft: (draft: MappingDraft) => void;
  /** What is missing before upload; "reading" while the preview loads. */
  problems: string[];
}

/** Reads the first rows of the first file, proposes a mapping from its header, and checks it. */
export function useCsvMapping(file: File | null): CsvMapping {
  const [state, setState] = useState<{ file: File; preview: CsvPreview; draft: MappingDraft } | null>(null);

  useEffect(() => {
    if (!file) return;
    let cancelled = false;
    readCsvPreview(file).then((preview) => {
      if (!cancelled) setState({ file, preview, draft: draftFromHeaders(preview.headers, 'UTC') });
    });
    return () => {
      cancelled = true;
    };
  }, [file]);

  const current = state && state.file === file ? state : null;
  const problems = !file
    ? []
    : !current
      ? ['Reading the first rows of the file…']
      : current.preview.headers.length === 0
        ? ['The file has no header row to map.']
        : mappingProblems(current.draft);
  return {
    preview: current?.preview ?? null,
    draft: current?.draft ?? null,
    setDraft: (draft) => setState((s) => (s ? { ...s, draft } : s)),
    problems,
  };
}
