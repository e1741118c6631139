import type { BulletinTextDiff } from '@stormhour/shared';

const MARK = { added: '+', removed: '−', same: ' ' } as const;
const SPOKEN = { added: 'Added: ', removed: 'Removed: ', same: '' } as const;

/**
 * The server's line-by-line comparison of two bulletins' plain text. Unchanged lines are folded away
 * unless asked for, so a long bulletin's two changed lines are seen at once.
 */
export function VersionDiff({
  diff,
  label,
  showSame = false,
}: {
  diff: BulletinTextDiff;
  label: string;
  showSame?: boolean;
}) {
  if (!diff.against) return <p>Nothing to compare with yet.</p>;
  if (diff.added === 0 && diff.removed === 0) return <p>No differences.</p>;
  return (
    <>
      <p className="cds--label-description">
        {diff.added} {diff.added === 1 ? 'line' : 'lines'} added, {diff.removed} removed.
      </p>
      <ul className="version-diff" aria-label={label}>
        {diff.lines
          .filter((l) => showSame || l.op !== 'same')
          .map((l, i) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: a diff's lines are identified by position
            <li key={i} className={`version-diff__line version-diff__${l.op}`}>
              <span aria-hidden="true" className="version-diff__mark">
                {MARK[l.op]}
              </span>
              <span className="cds--visually-hidden">{SPOKEN[l.op]}</span>
              {l.text}
            </li>
          ))}
      </ul>
    </>
  );
}
