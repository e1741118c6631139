import { Button, FileUploaderDropContainer } from '@carbon/react';
import type { IntakeKind } from '@stormhour/shared';
import { formatBytes } from '../../jobs/jobSummary';
import { fitsKind, KIND_EXTENSIONS } from '../intakeRequest';

interface FilePickerProps {
  kind: IntakeKind;
  files: File[];
  disabled: boolean;
  onChange: (files: File[]) => void;
}

/** Same name and size: the same file picked twice, which would only be counted as a duplicate later. */
function sameFile(a: File, b: File): boolean {
  return a.name === b.name && a.size === b.size;
}

/** Drop zone and file list. The zone is a button, so Enter or Space opens the file chooser too. */
export function FilePicker({ kind, files, disabled, onChange }: FilePickerProps) {
  return (
    <div className="form-stack">
      <p className="cds--label-description">
        Drop one or many {KIND_EXTENSIONS[kind].join(' or ')} files on the box, or press it (Enter or Space)
        to choose them.
      </p>
      <FileUploaderDropContainer
        labelText="Choose files"
        multiple
        disabled={disabled}
        accept={KIND_EXTENSIONS[kind]}
        onAddFiles={(_event, { addedFiles }) =>
          onChange([...files, ...addedFiles.filter((f) => !files.some((known) => sameFile(f, known)))])
        }
      />
      {files.length > 0 ? (
        <ul className="file-list" aria-label="Chosen files">
          {files.map((file, index) => (
            <li key={`${file.name}-${file.size}`}>
              <span className="mono">{file.name}</span>
              <span className="file-list__size">{formatBytes(file.size)}</span>
              {fitsKind(file.name, kind) ? null : (
                <span className="field-problem">not a {KIND_EXTENSIONS[kind][0]} file</span>
              )}
              <Button
                kind="ghost"
                size="sm"
                disabled={disabled}
                aria-label={`Remove ${file.name}`}
                onClick={() => onChange(files.filter((_, i) => i !== index))}
              >
                Remove
              </Button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
