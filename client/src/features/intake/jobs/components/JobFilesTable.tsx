import { Table, TableBody, TableCell, TableHead, TableHeader, TableRow, Tag } from '@carbon/react';
import type { JobFileView } from '@stormhour/shared';
import { FILE_STATE_NOTES, FILE_STATE_TAGS, FILE_STATE_TEXT } from '../../intakeWords';
import { formatBytes } from '../jobSummary';

export function JobFilesTable({ files }: { files: JobFileView[] }) {
  return (
    <Table aria-label="Files" size="sm">
      <TableHead>
        <TableRow>
          <TableHeader>File</TableHeader>
          <TableHeader>Size</TableHeader>
          <TableHeader>State</TableHeader>
        </TableRow>
      </TableHead>
      <TableBody>
        {files.length === 0 ? (
          <TableRow>
            <TableCell colSpan={3}>The job has no files.</TableCell>
          </TableRow>
        ) : null}
        {files.map((file) => (
          <TableRow key={file.uploadId}>
            <TableCell className="mono">{file.fileName}</TableCell>
            <TableCell>{formatBytes(file.sizeBytes)}</TableCell>
            <TableCell>
              <Tag type={FILE_STATE_TAGS[file.state]} size="sm">
                {FILE_STATE_TEXT[file.state]}
              </Tag>
              {FILE_STATE_NOTES[file.state] ? ` — ${FILE_STATE_NOTES[file.state]}` : null}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
