import { Select, SelectItem, Toggle } from '@carbon/react';
import type { BulletinView } from '@stormhour/shared';
import { useState } from 'react';
import { BulletinView as BulletinDocument } from '../../../components/bulletin/BulletinView';
import { VersionDiff } from '../../../components/bulletin/VersionDiff';
import { LoadError } from '../../../components/LoadError';
import { formatDateTime } from '../../../lib/format';
import { useBulletinCompare, useBulletinDiff, useBulletinVersion } from '../api';

/**
 * What changed: the shown version (the approved one once approved) against the version before it and
 * against the district's last sent bulletin, compared by the server on the plain text officers receive;
 * any two saved versions side by side; and any saved version to read in full.
 */
export function VersionsPanel({ bulletin }: { bulletin: BulletinView }) {
  const shownVersion = bulletin.approvedVersion ?? bulletin.currentVersion;
  const diff = useBulletinDiff(bulletin.id, shownVersion);
  const [showSame, setShowSame] = useState(false);
  const [reading, setReading] = useState<number | null>(null);
  const version = useBulletinVersion(bulletin.id, reading);
  const newestFirst = [...bulletin.versions].sort((a, b) => b.version - a.version);
  const [pair, setPair] = useState<{ from: number | null; to: number | null }>({ from: null, to: null });
  const compared = useBulletinCompare(bulletin.id, pair.from, pair.to);
  const versionChoices = (id: string, label: string, key: 'from' | 'to') => (
    <Select
      id={id}
      labelText={label}
      value={pair[key] === null ? '' : String(pair[key])}
      onChange={(e) => setPair({ ...pair, [key]: e.target.value ? Number(e.target.value) : null })}
    >
      <SelectItem value="" text="Choose a version" />
      {newestFirst.map((v) => (
        <SelectItem key={v.version} value={String(v.version)} text={`Version ${v.version}`} />
      ))}
    </Select>
  );

  return (
    <div className="form-stack">
      <Toggle
        id="bulletin-diff-same"
        labelText="Unchanged lines"
        labelA="Hidden"
        labelB="Shown"
        size="sm"
        toggled={showSame}
        onToggle={setShowSame}
      />
      {diff.isError ? (
        <LoadError what="the comparison" error={diff.error} onRetry={() => diff.refetch()} />
      ) : null}
      {diff.data ? (
        <div className="diff-pair">
          <section aria-label="Against the previous version">
            <h3 className="bulletin-view__heading">
              Version {diff.data.version} against{' '}
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
          <section aria-label="Against the last sent bulletin">
            <h3 className="bulletin-view__heading">
              Against{' '}
              {diff.data.previousSent.against
                ? `${diff.data.previousSent.against.number}, the district’s last sent bulletin`
                : 'the district’s last sent bulletin'}
            </h3>
            <VersionDiff
              diff={diff.data.previousSent}
              label="Changes from the last sent bulletin"
              showSame={showSame}
            />
          </section>
        </div>
      ) : diff.isLoading ? (
        <p>Loading…</p>
      ) : null}

      <section aria-label="Compare two versions" className="form-stack">
        <h3 className="bulletin-view__heading">Compare two versions</h3>
        <div className="track-filters">
          {versionChoices('bulletin-compare-from', 'From version', 'from')}
          {versionChoices('bulletin-compare-to', 'To version', 'to')}
        </div>
        {compared.isError ? (
          <LoadError what="the comparison" error={compared.error} onRetry={() => compared.refetch()} />
        ) : null}
        {compared.data ? (
          <VersionDiff
            diff={compared.data}
            label={`Changes from version ${pair.from} to version ${pair.to}`}
            showSame={showSame}
          />
        ) : null}
      </section>

      <Select
        id="bulletin-version"
        labelText="Read a saved version"
        value={reading === null ? '' : String(reading)}
        onChange={(e) => setReading(e.target.value ? Number(e.target.value) : null)}
      >
        <SelectItem value="" text="Choose a version" />
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
      {version.isError ? (
        <LoadError what="the version" error={version.error} onRetry={() => version.refetch()} />
      ) : null}
      {reading !== null && version.data ? <BulletinDocument content={version.data.content} /> : null}
    </div>
  );
}
