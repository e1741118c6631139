import { Select, SelectItem, Toggle } from '@carbon/react';
import type { BulletinView } from '@stormhour/shared';
import { useState } from 'react';
import { VersionDiff } from '../../../components/bulletin/VersionDiff';
import { LoadError } from '../../../components/LoadError';
import { formatDateTime } from '../../../lib/format';
import { useBulletinDiff } from '../api';

/**
 * Saved versions, and the chosen one's text compared with the version before it and with the district's
 * previous sent bulletin (the comparisons come from the server, on the same plain text officers get).
 */
export function VersionsPanel({ bulletin }: { bulletin: BulletinView }) {
  const [version, setVersion] = useState(bulletin.currentVersion);
  const [showSame, setShowSame] = useState(false);
  const shown = bulletin.versions.some((v) => v.version === version) ? version : bulletin.currentVersion;
  const diff = useBulletinDiff(bulletin.id, shown);
  const newestFirst = [...bulletin.versions].sort((a, b) => b.version - a.version);

  return (
    <div className="form-stack">
      <div className="form-row">
        <Select
          id="bulletin-version"
          labelText="Version"
          value={String(shown)}
          onChange={(e) => setVersion(Number(e.target.value))}
        >
          {newestFirst.map((v) => (
            <SelectItem
              key={v.version}
              value={String(v.version)}
              text={`Version ${v.version}: ${v.savedBy}, ${formatDateTime(v.savedAt)}${
                v.version === bulletin.approvedVersion ? ' (approved)' : ''
              }`}
            />
          ))}
        </Select>
        <Toggle
          id="bulletin-diff-same"
          labelText="Unchanged lines"
          labelA="Hidden"
          labelB="Shown"
          size="sm"
          toggled={showSame}
          onToggle={setShowSame}
        />
      </div>
      {diff.isError ? (
        <LoadError what="the comparison" error={diff.error} onRetry={() => diff.refetch()} />
      ) : null}
      {diff.data ? (
        <div className="diff-pair">
          <section aria-label="Against the previous version">
            <h3 className="bulletin-view__heading">
              Against{' '}
              {diff.data.previousVersion.against
                ? `version ${diff.data.previousVersion.against.version}`
                : 'the previous version'}
            </h3>
            <VersionDiff
              diff={diff.data.previousVersion}
              label="Changes from the previous version"
              showSame={showSame}
            />
          </section>
          <section aria-label="Against the previous sent bulletin">
            <h3 className="bulletin-view__heading">
              Against{' '}
              {diff.data.previousSent.against
                ? `${diff.data.previousSent.against.number} (last sent)`
                : 'the last sent bulletin'}
            </h3>
            <VersionDiff
              diff={diff.data.previousSent}
              label="Changes from the previous sent bulletin"
              showSame={showSame}
            />
          </section>
        </div>
      ) : diff.isLoading ? (
        <p>Loading…</p>
      ) : null}
    </div>
  );
}
