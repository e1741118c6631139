import { Button, InlineNotification } from '@carbon/react';
import { type RefObject, useState } from 'react';
import { downloadCsv, downloadPng, downloadSvg } from '../exportFigure';

interface ExportBarProps {
  /** What is exported, for the buttons' names: "onset map". */
  what: string;
  fileName: string;
  /** The element holding the figure's SVG (the first svg inside is exported). */
  figure: RefObject<HTMLElement | null>;
  rows: () => Record<string, string | number | null>[];
}

/** Export of a view: the figure as SVG or PNG, its numbers as CSV. */
export function ExportBar({ what, fileName, figure, rows }: ExportBarProps) {
  const [problem, setProblem] = useState<string | null>(null);
  const svg = () => figure.current?.querySelector('svg') ?? null;
  return (
    <fieldset className="atlas-export" aria-label={`Export the ${what}`}>
      <Button
        kind="ghost"
        size="sm"
        onClick={() => {
          const found = svg();
          if (found) downloadSvg(found, fileName);
        }}
      >
        SVG
      </Button>
      <Button
        kind="ghost"
        size="sm"
        onClick={() => {
          const found = svg();
          if (found) downloadPng(found, fileName).catch((e: Error) => setProblem(e.message));
        }}
      >
        PNG
      </Button>
      <Button kind="ghost" size="sm" onClick={() => downloadCsv(rows(), fileName)}>
        CSV
      </Button>
      {problem ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="Export failed"
          subtitle={problem}
          onCloseButtonClick={() => setProblem(null)}
        />
      ) : null}
    </fieldset>
  );
}
