import type { BulletinContent } from '@stormhour/shared';
import { diffArrays } from 'diff';
import { bulletinLines } from './bulletinFormat';

export interface DiffLine {
  kind: 'added' | 'removed' | 'same';
  text: string;
}

/** The lines of `after` against `before`, in order, each marked added, removed or the same. */
export function diffBulletins(before: BulletinContent, after: BulletinContent): DiffLine[] {
  return diffArrays(bulletinLines(before), bulletinLines(after)).flatMap((part) =>
    part.value.map(
      (text): DiffLine => ({ kind: part.added ? 'added' : part.removed ? 'removed' : 'same', text }),
    ),
  );
}

const MARK = { added: '+', removed: '−', same: ' ' } as const;

/** Two bulletins compared line by line; unchanged lines are folded away unless asked for. */
export function VersionDiff({
  before,
  after,
  label,
  showSame = false,
}: {
  before: BulletinContent;
  after: BulletinContent;
  label: string;
  showSame?: boolean;
}) {
  const lines = diffBulletins(before, after);
  const changed = lines.filter((l) => l.kind !== 'same').length;
  if (changed === 0) return <p>No differences.</p>;
  return (
    <>
      <p className="cds--label-description">
        {lines.filter((l) => l.kind === 'added').length} lines added,{' '}
        {lines.filter((l) => l.kind === 'removed').length} removed.
      </p>
      <ul className="version-diff" aria-label={label}>
        {lines
          .filter((l) => showSame || l.kind !== 'same')
          .map((l, i) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: a diff's lines are identified by position
            <li key={i} className={`version-diff__${l.kind}`}>
              <span aria-hidden="true" className="version-diff__mark">
                {MARK[l.kind]}
              </span>
              <span className="cds--visually-hidden">
                {l.kind === 'added' ? 'Added: ' : l.kind === 'removed' ? 'Removed: ' : ''}
              </span>
              {l.text}
            </li>
          ))}
      </ul>
    </>
  );
}
